import type { ComponentProps } from "react";
import { buttonClasses } from "./button";
import { cx } from "./cx";

/** A pager link, or the same words shown as unavailable where there is no such page. */
export function PagerLink({ enabled, children, ...link }: ComponentProps<"a"> & { enabled: boolean }) {
  const classes = buttonClasses("secondary", "sm");
  return enabled ? (
    <a className={classes} {...link}>
      {children}
    </a>
  ) : (
    <span className={cx(classes, "cursor-not-allowed opacity-60")} aria-disabled="true">
      {children}
    </span>
  );
}
