import type { Metadata, Viewport } from "next";
import localFont from "next/font/local";
import { OfflineBanner } from "@/components/layout/offline-banner";
import { SiteFooter } from "@/components/layout/site-footer";
import { SiteHeader } from "@/components/layout/site-header";
import "./globals.css";

// Fonts ship with the app from npm packages; nothing is fetched from a font CDN.
const body = localFont({
  src: "../node_modules/@fontsource-variable/inter/files/inter-latin-wght-normal.woff2",
  variable: "--font-body",
  display: "swap",
  weight: "100 900",
});
const display = localFont({
  src: "../node_modules/@fontsource-variable/outfit/files/outfit-latin-wght-normal.woff2",
  variable: "--font-display",
  display: "swap",
  weight: "100 900",
});

export const metadata: Metadata = {
  title: { default: "Shoal — start your fish farm with people you can trust", template: "%s · Shoal" },
  description: "Find tank builders and fingerling hatcheries near you, plan your first tank, and pay safely.",
};

export const viewport: Viewport = { themeColor: "#176d64", width: "device-width", initialScale: 1 };

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={`${body.variable} ${display.variable}`}>
      <body className="flex min-h-screen flex-col font-sans">
        <a
          href="#main"
          className="sr-only focus:not-sr-only focus:fixed focus:left-3 focus:top-3 focus:z-50 focus:rounded-lg focus:bg-white focus:px-4 focus:py-3 focus:text-sm focus:font-semibold focus:text-lagoon-800 focus:shadow-card"
        >
          Skip to content
        </a>
        <OfflineBanner />
        <SiteHeader />
        {/* tabIndex -1: the skip link moves focus here (not only the scroll), so the next Tab starts in the content. */}
        <main id="main" tabIndex={-1} className="flex-1 focus:outline-none">
          {children}
        </main>
        <SiteFooter />
      </body>
    </html>
  );
}
