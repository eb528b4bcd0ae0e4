import Link from "next/link";
import { HeaderNav, type HeaderUser } from "./header-nav";
import { Wordmark } from "./logo";

export type SiteHeaderProps = { user: HeaderUser | null };

export function SiteHeader({ user }: SiteHeaderProps) {
  return (
    <header className="on-dark relative bg-walnut text-cream">
      <div className="mx-auto flex max-w-shell flex-wrap items-center justify-between gap-x-6 gap-y-2 px-4 py-3 sm:px-6">
        <Link href="/" aria-label="Rosinwood home" className="rounded-knot text-cream no-underline hover:text-rosin">
          <Wordmark />
        </Link>
        <HeaderNav user={user} />
      </div>
      {/* A thin rosin edge, like the light catching a bow stick. */}
      <div aria-hidden="true" className="h-1 bg-linear-to-r from-cedar via-rosin to-cedar" />
    </header>
  );
}
