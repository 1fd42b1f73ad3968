import type { Metadata, Viewport } from "next";
import type { ReactNode } from "react";
import { SafetyNotice } from "@/components/safety-notice";
import { SiteHeader } from "@/components/site-header";
import { serverEnv } from "@/lib/env";
import { reportFeedTitle } from "@/lib/report-feed";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Benchplate: measured heating tools", template: "%s · Benchplate" },
  description:
    "Independent bench tests of hot-air stations, soldering stations and heat guns: rated versus measured, with the uncertainty stated.",
  alternates: { types: { "application/atom+xml": [{ url: `${serverEnv().APP_ORIGIN}/feed.xml`, title: reportFeedTitle }] } },
};

export const viewport: Viewport = { width: "device-width", initialScale: 1, themeColor: "#f6f3ec" };

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en">
      <body className="flex min-h-screen flex-col">
        <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:bg-paper-raised focus:p-2">
          Skip to content
        </a>
        <SiteHeader />
        <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-4 py-8">
          {children}
        </main>
        <footer className="border-t border-rule bg-paper-sunk">
          <div className="mx-auto flex max-w-6xl flex-col gap-3 px-4 py-6 text-sm text-ink-soft">
            <SafetyNotice compact />
            <p>Benchplate publishes what was measured, how, and how sure we are of it.</p>
          </div>
        </footer>
      </body>
    </html>
  );
}
