import type { ReactNode } from "react";
import { cx } from "./cx";

export type AlertTone = "info" | "success" | "warning" | "error";

const tones: Record<AlertTone, { box: string; title: string; label: string }> = {
  info: { box: "border-slate bg-slate-tint", title: "text-slate", label: "Note" },
  success: { box: "border-spruce bg-spruce-tint", title: "text-spruce", label: "Done" },
  warning: { box: "border-cedar bg-rosin-tint", title: "text-cedar", label: "Take care" },
  error: { box: "border-berry bg-berry-tint", title: "text-berry", label: "Problem" },
};

export type AlertProps = {
  tone?: AlertTone;
  title?: ReactNode;
  /** Announce the message when it appears (after an action); leave off for static notices. */
  live?: boolean;
  className?: string;
  children: ReactNode;
};

/** A boxed message; colour is never the only cue, so each tone carries a word too. */
export function Alert({ tone = "info", title, live = false, className, children }: AlertProps) {
  const t = tones[tone];
  const role = live ? (tone === "error" ? "alert" : "status") : undefined;
  return (
    <div role={role} className={cx("rounded-knot border-l-4 px-4 py-3 text-ink", t.box, className)}>
      <p className={cx("font-semibold", t.title)}>{title ?? t.label}</p>
      <div className="mt-1 text-body">{children}</div>
    </div>
  );
}
