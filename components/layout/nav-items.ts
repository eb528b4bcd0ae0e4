export type Role = "student" | "teacher" | "admin";

export type NavItem = {
  href: string;
  label: string;
  /** Shown as a call to action rather than a plain link. */
  emphasis?: boolean;
};

const visitorItems: NavItem[] = [
  { href: "/catalogue", label: "Catalogue" },
  { href: "/plans", label: "Plans" },
  { href: "/sign-in", label: "Sign in" },
  { href: "/sign-up", label: "Join", emphasis: true },
];

// The calendar feed pages (/learn/calendar, /teach/calendar) are reached from Today and the assignments list,
// and "Assign" from the assignments list, so the bar stays short enough to sit on one line at 1024 px.
const roleItems: Record<Role, NavItem[]> = {
  student: [
    { href: "/learn", label: "Today" },
    { href: "/learn/courses", label: "My courses" },
    { href: "/learn/practice", label: "Practice log" },
    { href: "/learn/billing", label: "Membership" },
  ],
  teacher: [
    { href: "/teach", label: "Roster" },
    { href: "/teach/review", label: "Review" },
    { href: "/teach/assignments", label: "Assignments" },
    { href: "/teach/tunes", label: "Tunes" },
    { href: "/teach/courses", label: "Courses" },
    { href: "/teach/import", label: "Import" },
    { href: "/teach/invite", label: "Invite" },
  ],
  admin: [
    { href: "/admin/people", label: "People" },
    { href: "/admin/payments", label: "Payments" },
    { href: "/admin/memberships", label: "Memberships" },
    { href: "/admin/enrolments", label: "Enrolments" },
    { href: "/admin/revenue", label: "Revenue" },
    { href: "/admin/plans", label: "Plans" },
  ],
};

export function navItemsFor(role: Role | null): NavItem[] {
  return role ? roleItems[role] : visitorItems;
}

/**
 * The item the current page belongs to: the longest href that equals the path or is a
 * folder above it, so /learn/courses/x marks "My courses" and not "Today" (/learn).
 */
export function activeHref(pathname: string, items: NavItem[]): string | null {
  let best: string | null = null;
  for (const { href } of items) {
    const inside = pathname === href || pathname.startsWith(href.endsWith("/") ? href : `${href}/`);
    if (inside && (best === null || href.length > best.length)) best = href;
  }
  return best;
}
