import type { Metadata, Viewport } from "next";
import localFont from "next/font/local";
import { Shell } from "@/components/layout/Shell";
import "./globals.css";

// Atkinson Hyperlegible Next and Mono (SIL OFL 1.1, licences beside the files), shipped with the app.
const sans = localFont({
  src: [
    { path: "./fonts/atkinson-hyperlegible-next-latin-wght-normal.woff2", style: "normal", weight: "200 800" },
    { path: "./fonts/atkinson-hyperlegible-next-latin-wght-italic.woff2", style: "italic", weight: "200 800" },
  ],
  variable: "--font-rp-sans",
  display: "swap",
});
const mono = localFont({
  src: [{ path: "./fonts/atkinson-hyperlegible-mono-latin-wght-normal.woff2", style: "normal", weight: "200 800" }],
  variable: "--font-rp-mono",
  display: "swap",
});

export const metadata: Metadata = {
  title: { default: "Restpoint", template: "%s · Restpoint" },
  description: "A registry that re-runs the computational claims of evolutionary game models and reports, claim by claim, what it reproduced.",
};

export const viewport: Viewport = {
  themeColor: [
    { media: "(prefers-color-scheme: light)", color: "#f5f3ee" },
    { media: "(prefers-color-scheme: dark)", color: "#11161b" },
  ],
};

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={`${sans.variable} ${mono.variable}`}>
      <body className="flex min-h-dvh flex-col bg-canvas text-ink antialiased">
        <Shell>{children}</Shell>
      </body>
    </html>
  );
}
