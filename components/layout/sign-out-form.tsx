import { cx } from "@/components/ui/cx";

/** A plain form so signing out works before (or without) JavaScript. */
export function SignOutForm({ className }: { className?: string }) {
  return (
    <form method="post" action="/api/auth/sign-out" className={className}>
      <button
        type="submit"
        className={cx(
          "min-h-11 rounded-knot border border-cream/60 px-3 text-small font-semibold text-cream",
          "hover:border-rosin hover:text-rosin",
        )}
      >
        Sign out
      </button>
    </form>
  );
}
