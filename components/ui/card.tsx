import type { HTMLAttributes, ReactNode } from "react";
import { cx } from "./cx";

export type CardProps = HTMLAttributes<HTMLElement> & {
  as?: "div" | "section" | "article" | "li";
  tone?: "plain" | "warm";
};

export function Card({ as: Tag = "div", tone = "plain", className, ...rest }: CardProps) {
  return (
    <Tag
      className={cx(
        "rounded-knot border border-line p-5 sm:p-6",
        tone === "warm" ? "bg-sawdust" : "bg-paper shadow-[0_1px_0_0_#D9C8B0]",
        className,
      )}
      {...rest}
    />
  );
}

export function CardTitle({
  level = 3,
  className,
  children,
}: {
  level?: 2 | 3 | 4;
  className?: string;
  children: ReactNode;
}) {
  const Tag = `h${level}` as const;
  const size = level === 2 ? "text-h3" : level === 3 ? "text-h4" : "text-lead";
  return <Tag className={cx("mb-2 font-serif font-semibold", size, className)}>{children}</Tag>;
}
