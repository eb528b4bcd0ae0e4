import { cx } from "@/components/ui/cx";

/**
 * Rosinwood's mark: a cake of rosin with the grain of a knot in it and a bow hair drawn
 * across. Decorative next to the wordmark, so it is hidden from assistive technology.
 */
export function LogoMark({ className }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" aria-hidden="true" focusable="false" className={cx("shrink-0", className)}>
      <circle cx="16" cy="17.5" r="10.5" fill="#E3A83E" />
      <path
        d="M8.6 21.2c2.9-5.4 11.9-5.4 14.8 0M11.6 23.9c1.8-3 7-3 8.8 0"
        fill="none"
        stroke="#8A3B12"
        strokeWidth="1.6"
        strokeLinecap="round"
      />
      <path d="M3.5 11.2 28.5 6.2" stroke="#F4E9D8" strokeWidth="2.2" strokeLinecap="round" />
    </svg>
  );
}

export function Wordmark({ className }: { className?: string }) {
  return (
    <span className={cx("inline-flex items-center gap-2.5", className)}>
      <LogoMark className="h-9 w-9" />
      <span className="font-serif text-h4 font-semibold tracking-tight">Rosinwood</span>
    </span>
  );
}
