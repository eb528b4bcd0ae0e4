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
  // Catalogue, ladders, tune pages and the teacher's tools (issue 5). Which course, rung or tune a
  // person may open is decided per record by lib/catalogue/access.ts.
  "catalogue:view",
  "ladder:view",
  "tune:view",
  "notes:write",
  "tune:edit",
  "tune:import",
  "course:edit",
  // Assignments, check-ins, review, practice log, recordings, calendar feed (issue 6). Which
  // assignment or recording is decided per record in lib/teaching/.
  "assignment:view",
  "assignment:manage", // assign, edit, withdraw (a teacher's own roster only)
  "checkin:create", // check in, withdraw one's own check-in before review
  "checkin:review", // review queue: listen, feedback, sign off, "needs more time"
  "practice:write", // one's own practice log
  "recording:upload", // presigned upload address, for one's own assignment only
  "recording:listen", // presigned playback address: the recording's student and their teachers
  "calendar:manage", // one's own private calendar feed address (create, revoke)
  // Memberships and billing (issue 7). Which membership or payment is decided per record in lib/billing/.
  "plans:view",
  "plans:manage",
  "billing:subscribe", // start a checkout session for oneself
  "billing:manage", // one's own membership: cancel at period end, resume, change plan, invoices
  "money:view", // admin tables: payments, memberships, enrolments, revenue, CSV export
  "payments:refund",
  // Every member has a teacher: the teacher welcomes their new members; the admin hands enrolments to another teacher.
  "members:welcome",
  "enrolments:reassign",
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
  "catalogue:view",
  "tune:view", // taster rungs are open to visitors; the rest is checked per tune
  "plans:view",
];

const TABLE: Record<Actor, readonly Action[]> = {
  visitor: EVERYONE,
  student: [
    ...EVERYONE,
    "area:learn",
    "people:view",
    "ladder:view",
    "notes:write",
    "assignment:view",
    "checkin:create",
    "practice:write",
    "recording:upload",
    "recording:listen",
    "calendar:manage",
    "billing:subscribe",
    "billing:manage",
  ],
  teacher: [
    ...EVERYONE,
    "area:teach",
    "roster:view",
    "students:invite",
    "people:view",
    "ladder:view",
    "notes:write",
    "tune:edit",
    "tune:import",
    "course:edit",
    "assignment:view",
    "assignment:manage",
    "checkin:review",
    "recording:listen",
    "calendar:manage",
    "members:welcome",
  ],
  // "admin: everything" (PRODUCT.md §2).
  admin: ACTIONS,
};

export function can(actor: Actor, action: Action): boolean {
  return TABLE[actor].includes(action);
}

/** Where each role lands after signing in. */
export const HOME: Record<Role, string> = { student: "/learn", teacher: "/teach", admin: "/admin/people" };
