"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { useEffect, useId, useRef, useState } from "react";
import { cx } from "@/components/ui/cx";
import { activeHref, navItemsFor, type Role } from "./nav-items";
import { SignOutForm } from "./sign-out-form";

export type HeaderUser = { name: string; role: Role };

const linkBase = "flex min-h-11 items-center rounded-knot px-3 font-semibold no-underline transition-colors";
const linkPlain = "text-cream hover:bg-cream/10 hover:text-rosin";
// The current page gets an underline as well as colour, so it does not rely on colour alone.
const linkCurrent = "text-rosin underline decoration-2 underline-offset-8";
const linkEmphasis = "bg-rosin text-walnut hover:bg-rosin-pale hover:text-walnut";

/**
 * Inline links from the lg breakpoint up; below it, one disclosure button shows and hides the
 * same list, so there is a single navigation landmark at every width.
 */
export function HeaderNav({ user }: { user: HeaderUser | null }) {
  const pathname = usePathname() ?? "/";
  const items = navItemsFor(user?.role ?? null);
  const current = activeHref(pathname, items);
  const [open, setOpen] = useState(false);
  const buttonRef = useRef<HTMLButtonElement>(null);
  const menuId = useId();

  // A link followed inside the open menu lands on a new page; the menu should not stay open over it.
  useEffect(() => setOpen(false), [pathname]);

  useEffect(() => {
    if (!open) return;
    const onKey = (event: KeyboardEvent) => {
      if (event.key === "Escape") {
        setOpen(false);
        buttonRef.current?.focus();
      }
    };
    document.addEventListener("keydown", onKey);
    return () => document.removeEventListener("keydown", onKey);
  }, [open]);

  return (
    <nav aria-label="Main" className="flex flex-1 items-center justify-end">
      <button
        ref={buttonRef}
        type="button"
        aria-expanded={open}
        aria-controls={menuId}
        onClick={() => setOpen((v) => !v)}
        className="flex min-h-11 items-center gap-2 rounded-knot border border-cream/60 px-3 font-semibold text-cream hover:border-rosin hover:text-rosin lg:hidden"
      >
        <MenuIcon open={open} />
        Menu
      </button>
      <div
        id={menuId}
        className={cx(
          // Below lg the list drops under the header bar as a full-width panel (the header is relative).
          "absolute inset-x-0 top-full z-40 flex-col gap-4 border-b-4 border-rosin bg-walnut px-4 pt-2 pb-5 shadow-lg sm:px-6",
          "lg:static lg:flex lg:flex-row lg:items-center lg:gap-6 lg:border-0 lg:bg-transparent lg:p-0 lg:shadow-none",
          open ? "flex" : "hidden",
        )}
      >
        <ul className="flex flex-col gap-1 lg:flex-row lg:items-center lg:gap-1">
          {items.map((item) => {
            const here = item.href === current;
            return (
              <li key={item.href}>
                <Link
                  href={item.href}
                  aria-current={here ? (pathname === item.href ? "page" : "true") : undefined}
                  className={cx(linkBase, item.emphasis ? linkEmphasis : here ? linkCurrent : linkPlain)}
                >
                  {item.label}
                </Link>
              </li>
            );
          })}
        </ul>
        {user ? (
          <div className="flex flex-wrap items-center gap-3 border-t border-cream/20 px-3 pt-3 lg:border-t-0 lg:border-l lg:pt-0 lg:pr-0 lg:pl-5">
            <span className="text-small text-cream">
              <span className="sr-only">Signed in as </span>
              {user.name}
            </span>
            <SignOutForm />
          </div>
        ) : null}
      </div>
    </nav>
  );
}

function MenuIcon({ open }: { open: boolean }) {
  return (
    <svg viewBox="0 0 20 20" className="h-5 w-5" aria-hidden="true" focusable="false">
      {open ? (
        <path d="M5 5l10 10M15 5L5 15" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
      ) : (
        <path d="M3 6h14M3 10h14M3 14h14" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
      )}
    </svg>
  );
}
