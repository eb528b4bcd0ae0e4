import { db } from "@/db/client";
import { addToRoster, findInvitation, findUserById, markInvitationAccepted, updateUser } from "@/db/queries/auth";
import { createUser, findUserByEmail } from "@/db/queries/people";
import type { ActionState } from "./action-state";
import { startSession, type RequestContext } from "./context";
import { badRequest, conflict, forbidden, notFound, raceConflict } from "./errors";
import { hashPassword } from "./password";
import { passwordProblem } from "./password-policy";
import { HOME, type Role } from "./permissions";
import { hashToken } from "./tokens";

export const INVITATION_DEAD =
  "This invitation has expired or has already been used. Ask whoever invited you for a new one.";
export const INVITATION_OTHER_ADDRESS =
  "This invitation was sent to another address. Sign out, then open the link again.";
export const INVITATION_JUST_ACCEPTED =
  "This invitation was just accepted in another window or tab. Sign in to carry on.";
export const INVITATION_SIGN_IN_FIRST =
  "This address already has an account: sign in, then open the invitation link again.";

/** What the acceptance page shows before the person decides. */
export async function describeInvitation(token: string) {
  const inv = await findInvitation(db(), hashToken(token));
  if (!inv || inv.acceptedAt || inv.expiresAt <= new Date()) return null;
  const account = await findUserByEmail(db(), inv.email);
  // An unconfirmed account proves nothing about its owner; the invitation link does.
  const needsSignIn = Boolean(account && account.emailVerifiedAt && !account.disabled);
  return { email: inv.email, role: inv.role, inviterName: inv.inviterName, needsSignIn };
}

// Invitations only ever add a role: a teacher invited as a student stays a teacher.
const RANK: Record<Role, number> = { student: 0, teacher: 1, admin: 2 };

export async function acceptInvitation(
  ctx: RequestContext,
  input: { token: string; name?: string; password?: string },
): Promise<ActionState> {
  const inv = await findInvitation(db(), hashToken(input.token));
  if (!inv || inv.acceptedAt || inv.expiresAt <= new Date()) throw notFound(INVITATION_DEAD);
  const same = (a: string) => a.trim().toLowerCase() === inv.email.trim().toLowerCase();
  if (ctx.user && !same(ctx.user.email)) throw forbidden(INVITATION_OTHER_ADDRESS);

  const existing = ctx.user ? await findUserById(db(), ctx.user.id) : await findUserByEmail(db(), inv.email);
  if (existing?.disabled) throw forbidden("This account is closed. Please contact the school.");
  if (!ctx.user && existing?.emailVerifiedAt) throw conflict(INVITATION_SIGN_IN_FIRST);

  let newAccount: { name: string; passwordHash: string } | null = null;
  if (!ctx.user) {
    const name = input.name?.trim() ?? "";
    const problem = passwordProblem(input.password ?? "", inv.email);
    const fields: Record<string, string> = {};
    if (!name) fields.name = "Please tell us your name.";
    if (problem) fields.password = problem;
    if (Object.keys(fields).length) throw badRequest("Please check the highlighted fields.", fields);
    newAccount = { name, passwordHash: await hashPassword(input.password ?? "") };
  }

  const user = await db()
    .transaction(async (tx) => {
      const now = new Date();
      let person = existing;
      if (!person && newAccount) person = await createUser(tx, { email: inv.email, role: inv.role, ...newAccount });
      else if (person && newAccount) person = await updateUser(tx, person.id, newAccount);
      if (!person) throw notFound(INVITATION_DEAD);
      if (!(await markInvitationAccepted(tx, inv.id, person.id, now))) throw notFound(INVITATION_DEAD);
      const role = RANK[inv.role] > RANK[person.role] ? inv.role : person.role;
      const updated = await updateUser(tx, person.id, { role, emailVerifiedAt: person.emailVerifiedAt ?? now });
      if (inv.role === "student" && inv.inviterRole === "teacher") await addToRoster(tx, inv.invitedBy, person.id);
      return updated ?? person;
    })
    .catch((e: unknown) => {
      // Several acceptances at once: the first made the account; the others meet its unique address.
      throw raceConflict(e, INVITATION_JUST_ACCEPTED) ?? e;
    });
  if (!ctx.user) await startSession(ctx, user.id);
  return { status: 200, redirectTo: HOME[user.role] };
}
