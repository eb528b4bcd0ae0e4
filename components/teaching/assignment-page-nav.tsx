import type { ReactNode } from "react";
import { PageNav } from "@/components/ui/page-nav";

/** The assignment lists' pager: the teacher's (buttons) and the student's (links) read the same. */
export function AssignmentPageNav(props: {
  page: number;
  pages: number;
  total: number;
  previous: ReactNode;
  next: ReactNode;
}) {
  return <PageNav label="Assignment pages" noun="assignments" {...props} />;
}
