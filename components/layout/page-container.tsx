import type { HTMLAttributes } from "react";
import { cx } from "@/components/ui/cx";

/**
 * The site's content width and side padding. <main> itself is full width so a page can run a
 * coloured band edge to edge; everything else sits inside one of these.
 */
export function PageContainer({ className, ...rest }: HTMLAttributes<HTMLDivElement>) {
  return <div className={cx("mx-auto w-full max-w-shell px-4 py-8 sm:px-6 sm:py-12", className)} {...rest} />;
}
