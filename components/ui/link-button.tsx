import Link from "next/link";
import type { ComponentProps } from "react";
import { buttonClasses, type ButtonSize, type ButtonVariant } from "./button";
import { cx } from "./cx";

export type LinkButtonProps = ComponentProps<typeof Link> & {
  variant?: ButtonVariant;
  size?: ButtonSize;
};

/** A link that looks like a button: for navigation, where a real button would be wrong. */
export function LinkButton({ variant, size, className, ...rest }: LinkButtonProps) {
  return <Link className={cx(buttonClasses(variant, size), className)} {...rest} />;
}
