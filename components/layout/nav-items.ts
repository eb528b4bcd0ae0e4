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

const roleItems: Record<Role, NavItem[]> = {
  student: [
    { href: "/learn", label: "Today" },
    { href: "/learn/courses", label: "My courses" },
    { href: "/learn/practice", label: "Practice log" },
    { href: "/learn/billing", label: "Billing" },
  ],
  teacher: [
    { href: "/teach", label: "Roster" },
    { href: "/teach/tunes", label: "Tunes" },
    { href: "/teach/courses", label: "Courses" },
    { href: "/teach/review", label: "Review" },
  ],
  admin: [
    { href: "/admin/people", label: "People" },
    { href: "/admin/payments", label: "Payments" },
    { href: "/admin/memberships", label: "Memberships" },
    { href: "/admin/enrolments", label: "Enrolments" },
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
