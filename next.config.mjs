/**
 * Headers every response carries, static files included (OWASP HTTP Headers Cheat Sheet). The
 * Content-Security-Policy, which needs a fresh nonce per page, is set in proxy.ts.
 */
const securityHeaders = [
  { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
  { key: "X-Content-Type-Options", value: "nosniff" },
  // The CSP's frame-ancestors 'none' for browsers that predate it.
  { key: "X-Frame-Options", value: "DENY" },
  { key: "Cross-Origin-Opener-Policy", value: "same-origin" },
  { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=(), payment=(), usb=()" },
  ...((process.env.NEXTAUTH_URL ?? "").startsWith("https://")
    ? [{ key: "Strict-Transport-Security", value: "max-age=31536000; includeSubDomains" }]
    : []),
];

/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  // Test builds write to their own folder so `npm test` never disturbs a running `npm start`.
  distDir: process.env.ARCWRIGHT_DIST_DIR ?? ".next",
  serverExternalPackages: ["postgres"],
  // `npm test` type-checks the whole project with tsc before it builds, and says so through this
  // variable; every other build (`npm start`, `next build` by hand) checks types itself.
  typescript: { ignoreBuildErrors: process.env.ARCWRIGHT_TYPES_CHECKED === "1" },
  async headers() {
    return [{ source: "/:path*", headers: securityHeaders }];
  },
};

export default nextConfig;
