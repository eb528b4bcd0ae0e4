import type { Metadata, Viewport } from "next";
import type { ReactNode } from "react";
// Fonts ship inside the build from npm; nothing is fetched from a font service (STACK.md).
import "@fontsource/source-serif-4/400.css";
import "@fontsource/source-serif-4/600.css";
import "@fontsource/source-serif-4/700.css";
import "./globals.css";
import { SiteFooter } from "@/components/layout/site-footer";
import { SiteHeader } from "@/components/layout/site-header";
import { HydrationMark } from "@/components/providers/hydration-mark";
import { getCurrentUser } from "@/lib/auth/current-user";

export const metadata: Metadata = {
  title: { default: "Rosinwood — an online fiddle school", template: "%s · Rosinwood" },
  description:
    "Learn fiddle tunes step by step: the core melody first, then bowing, ornaments, fills and double stops, with a teacher listening along.",
};

export const viewport: Viewport = {
  themeColor: "#2B1D14",
  width: "device-width",
  initialScale: 1,
};

export default async function RootLayout({ children }: { children: ReactNode }) {
  const current = await getCurrentUser();
  // Only what the header shows crosses to the client component; the e-mail and id stay here.
  const user = current ? { name: current.name, role: current.role } : null;
  return (
    <html lang="en-GB">
      <body className="flex min-h-dvh flex-col">
        <a
          href="#main"
          className="sr-only rounded-knot bg-rosin px-4 py-2 font-semibold text-walnut focus:not-sr-only focus:absolute focus:top-3 focus:left-3 focus:z-50"
        >
          Skip to content
        </a>
        <SiteHeader user={user} />
        <main id="main" tabIndex={-1} className="flex flex-1 flex-col focus:outline-none">
          {children}
        </main>
        <SiteFooter />
        <HydrationMark />
      </body>
    </html>
  );
}
