/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  // Test builds write to their own folder so `npm test` never disturbs a running `npm start`.
  distDir: process.env.ARCWRIGHT_DIST_DIR ?? ".next",
  serverExternalPackages: ["postgres"],
};

export default nextConfig;
