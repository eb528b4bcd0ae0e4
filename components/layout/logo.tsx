import { cx } from "@/components/ui/cx";

/**
 * Rosinwood's mark: a cake of rosin seen from above, set in a turned wooden ring, with the
 * pale groove a bow wears into it. Decorative beside the wordmark, so hidden from assistive tech.
 * The ring (#C47A3C) keeps 4.8:1 against the walnut header it sits on.
 */
export function LogoMark({ className }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" aria-hidden="true" focusable="false" className={cx("shrink-0", className)}>
      <circle cx="16" cy="16" r="12" fill="#C47A3C" />
      <path
        d="M6.2 12.5a10.4 10.4 0 0 1 6-6.4M25.8 19.5a10.4 10.4 0 0 1-6 6.4"
        fill="none"
        stroke="#8A3B12"
        strokeWidth="1.3"
        strokeLinecap="round"
      />
      <circle cx="16" cy="16" r="8.2" fill="#E3A83E" />
      <path d="M10.6 19.6 21.4 12.4" stroke="#F6DFA8" strokeWidth="3.4" strokeLinecap="round" />
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
