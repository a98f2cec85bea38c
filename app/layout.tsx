import type { Metadata, Viewport } from "next";
import { connection } from "next/server";
import "@fontsource/source-sans-3/400.css";
import "@fontsource/source-sans-3/600.css";
import "@fontsource/source-sans-3/700.css";
import "./globals.css";
import { AppShell } from "@/components/app-shell";
import { ZodWithoutEval } from "@/components/zod-without-eval";

export const metadata: Metadata = {
  title: { default: "Arcwright", template: "%s · Arcwright" },
  description:
    "Plan gravitational-lensing observations from exact Schwarzschild light paths: Einstein radii, magnifications, time delays and sky windows for your proposal.",
};

export const viewport: Viewport = {
  themeColor: "#0b0f17",
  colorScheme: "dark",
};

/**
 * Every page is rendered per request: the proxy gives each response a fresh script nonce for its
 * Content-Security-Policy, and a page prerendered at build time could not carry it.
 */
export default async function RootLayout({ children }: { children: React.ReactNode }) {
  await connection();
  return (
    <html lang="en">
      <body>
        <ZodWithoutEval />
        <AppShell>{children}</AppShell>
      </body>
    </html>
  );
}
