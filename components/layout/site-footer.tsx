import Link from "next/link";
import { Wordmark } from "./logo";

const SAFETY_NOTE =
  "Warm up, take breaks, and stop if playing hurts; see a qualified teacher or health professional if pain persists.";

export function SiteFooter() {
  const year = new Date().getFullYear();
  return (
    <footer className="on-dark mt-auto bg-walnut text-cream">
      <div className="mx-auto grid max-w-shell gap-8 px-4 py-10 sm:px-6 md:grid-cols-[1.3fr_1fr]">
        <div className="flex flex-col gap-3">
          <Wordmark />
          <p className="max-w-prose text-small text-cream">
            An online fiddle school: tunes learned from the core melody up, with a teacher listening along.
          </p>
        </div>
        <nav aria-label="Footer">
          <h2 className="font-sans text-caption font-semibold tracking-widest text-rosin uppercase">Explore</h2>
          <ul className="mt-2 flex flex-col gap-1">
            <li>
              <Link href="/catalogue" className="inline-flex min-h-11 items-center text-cream hover:text-rosin">
                Catalogue
              </Link>
            </li>
            <li>
              <Link href="/sign-in" className="inline-flex min-h-11 items-center text-cream hover:text-rosin">
                Sign in
              </Link>
            </li>
          </ul>
        </nav>
      </div>
      <div className="border-t border-cream/20">
        <div className="mx-auto flex max-w-shell flex-col gap-2 px-4 py-5 text-small sm:px-6">
          <p className="text-cream">
            <strong className="font-semibold text-rosin">Play safely.</strong> {SAFETY_NOTE}
          </p>
          <p className="text-caption text-cream/85">© {year} Rosinwood</p>
        </div>
      </div>
    </footer>
  );
}
