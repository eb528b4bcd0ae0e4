import type { ButtonHTMLAttributes } from "react";
import { cx } from "./cx";
import { ScriptButton } from "./script-button";

export type ButtonVariant = "primary" | "secondary" | "quiet" | "danger";
export type ButtonSize = "sm" | "md" | "lg";

const base =
  "inline-flex items-center justify-center gap-2 rounded-knot font-sans font-semibold no-underline " +
  "transition-colors disabled:cursor-not-allowed disabled:opacity-60";

const variants: Record<ButtonVariant, string> = {
  primary: "bg-cedar text-paper hover:bg-cedar-dark hover:text-paper",
  secondary: "border-2 border-cedar bg-paper text-cedar hover:bg-sawdust hover:text-cedar-dark",
  quiet: "bg-transparent text-ink underline-offset-2 hover:bg-sawdust hover:underline",
  danger: "bg-berry text-paper hover:bg-ink hover:text-paper",
};

// Every size keeps at least a 44px touch target (WCAG 2.2 §2.5.5 enhanced target size).
const sizes: Record<ButtonSize, string> = {
  sm: "min-h-11 px-3 text-small",
  md: "min-h-11 px-5 text-body",
  lg: "min-h-12 px-6 text-lead",
};

export function buttonClasses(variant: ButtonVariant = "primary", size: ButtonSize = "md"): string {
  return cx(base, variants[variant], sizes[size]);
}

export type ButtonProps = ButtonHTMLAttributes<HTMLButtonElement> & {
  variant?: ButtonVariant;
  size?: ButtonSize;
  /**
   * Does nothing without the page's script (a click handler, or the submit button of a form whose submit
   * handler does the work): shown disabled until the page has hydrated. Defaults to having an onClick.
   */
  needsScript?: boolean;
};

export function Button({ variant, size, className, type = "button", ...rest }: ButtonProps) {
  return <ScriptButton type={type} className={cx(buttonClasses(variant, size), className)} {...rest} />;
}
