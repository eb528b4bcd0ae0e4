// The one table of who may do what (PRODUCT.md §2). Every route handler and server action names
// one of these actions and goes through lib/auth/guard.ts, which asks `can`. Rules that depend on
// WHICH record (a teacher's own roster, a student's own data) live in lib/auth/scope.ts.

export type Role = "student" | "teacher" | "admin";
/** Who is asking: a signed-in role, or a visitor with no session. */
export type Actor = Role | "visitor";

export const ACTIONS = [
  "account:sign-up",
  "account:sign-in",
  "account:sign-out",
  "account:reset-password",
  "account:verify-email",
  "invitation:accept",
  "area:learn",
  "area:teach",
  "area:admin",
  "roster:view",
  "students:invite",
  "people:view", // one person's profile, further limited by scope.ts
  "people:list",
  "people:invite-teacher",
  "people:change-role",
] as const;
export type Action = (typeof ACTIONS)[number];

// Anyone, signed in or not: signing in as someone else, a reset link or an invitation link opened
// while another account is signed in must still work.
const EVERYONE: readonly Action[] = [
  "account:sign-up",
  "account:sign-in",
  "account:sign-out",
  "account:reset-password",
  "account:verify-email",
  "invitation:accept",
];

const TABLE: Record<Actor, readonly Action[]> = {
  visitor: EVERYONE,
  student: [...EVERYONE, "area:learn", "people:view"],
  teacher: [...EVERYONE, "area:teach", "roster:view", "students:invite", "people:view"],
  // "admin: everything" (PRODUCT.md §2).
  admin: ACTIONS,
};

export function can(actor: Actor, action: Action): boolean {
  return TABLE[actor].includes(action);
}

/** Where each role lands after signing in. */
export const HOME: Record<Role, string> = { student: "/learn", teacher: "/teach", admin: "/admin/people" };
