import type { HTMLAttributes, ReactNode, TdHTMLAttributes, ThHTMLAttributes } from "react";
import { cx } from "./cx";

export type TableShellProps = {
  caption: ReactNode;
  /** Hide the caption visually but keep it for screen readers. */
  captionHidden?: boolean;
  /** Name for the scroll region when the caption is not plain text. */
  label?: string;
  className?: string;
  children: ReactNode;
};

/**
 * Scrolls sideways on narrow screens instead of squashing columns; the scroll box is
 * focusable and labelled so keyboard users can scroll it too (WCAG 2.2 §2.1.1).
 */
export function TableShell({ caption, captionHidden, label, className, children }: TableShellProps) {
  return (
    <div
      className={cx("overflow-x-auto rounded-knot border border-line bg-paper", className)}
      role="region"
      aria-label={label ?? (typeof caption === "string" ? caption : undefined)}
      tabIndex={0}
    >
      <table className="w-full border-collapse text-left text-small">
        <caption className={cx("px-4 py-3 text-left font-serif text-h4", captionHidden && "sr-only")}>
          {caption}
        </caption>
        {children}
      </table>
    </div>
  );
}

export function THead({ className, ...rest }: HTMLAttributes<HTMLTableSectionElement>) {
  return <thead className={cx("bg-sawdust text-ink", className)} {...rest} />;
}

export function TBody({ className, ...rest }: HTMLAttributes<HTMLTableSectionElement>) {
  return <tbody className={cx("divide-y divide-line", className)} {...rest} />;
}

export function Th({ className, scope = "col", ...rest }: ThHTMLAttributes<HTMLTableCellElement>) {
  return <th scope={scope} className={cx("px-4 py-2.5 font-semibold whitespace-nowrap", className)} {...rest} />;
}

export function Td({ className, ...rest }: TdHTMLAttributes<HTMLTableCellElement>) {
  return <td className={cx("px-4 py-2.5 align-top", className)} {...rest} />;
}
