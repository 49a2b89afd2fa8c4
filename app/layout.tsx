import type { Metadata, Viewport } from "next";
import localFont from "next/font/local";
import { connection } from "next/server";
import "./globals.css";

// Atkinson Hyperlegible (SIL OFL), shipped with the app: designed for legibility outdoors and at low vision.
const body = localFont({
  src: [
    { path: "./fonts/atkinson-hyperlegible-latin-400-normal.woff2", weight: "400", style: "normal" },
    { path: "./fonts/atkinson-hyperlegible-latin-700-normal.woff2", weight: "700", style: "normal" },
  ],
  variable: "--font-body",
  display: "swap",
});

export const metadata: Metadata = {
  title: { default: "Turnstone", template: "%s · Turnstone" },
  description: "Season-to-season change on your network's transects.",
  manifest: "/manifest.webmanifest",
  icons: { icon: "/icons/icon.svg", apple: "/icons/icon-192.png" },
  appleWebApp: { capable: true, title: "Turnstone", statusBarStyle: "default" },
};

export const viewport: Viewport = { themeColor: "#155555", width: "device-width", initialScale: 1 };

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Every page renders per request, so Next can put this request's CSP nonce (set in proxy.ts)
  // on its scripts; a page built ahead of time would carry none and be refused.
  await connection();
  return (
    <html lang="en-GB" className={body.variable}>
      <body className="min-h-dvh font-sans">{children}</body>
    </html>
  );
}
