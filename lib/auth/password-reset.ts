import { db } from "@/db/client";
import { findUserByEmail } from "@/db/queries/people";
import {
  consumeEmailToken,
  findUserById,
  insertEmailToken,
  retireEmailTokens,
  updateUser,
  type Tx,
} from "@/db/queries/auth";
import { enqueueEmail } from "@/lib/mail/outbox";
import type { ActionState } from "./action-state";
import type { RequestContext } from "./context";
import { badRequest, notFound } from "./errors";
import { appLink } from "./links";
import { mailedRecently } from "./mail-throttle";
import { lucia } from "./lucia";
import { hashPassword } from "./password";
import { passwordProblem } from "./password-policy";
import { addressKey, hitAll, ipKey, LIMITS } from "./rate-limit";
import { liftSignInBackoff } from "./sign-in-backoff";
import { hashToken, MINUTE, newToken, RESET_TTL_MINUTES } from "./tokens";

export const resetSentMessage = (email: string) =>
  `If an account exists for ${email}, we've sent it a link to choose a new password. The link works for ${RESET_TTL_MINUTES} minutes, once.`;

export const RESET_LINK_DEAD = "This reset link has expired or has already been used. Ask for a new one below.";

/**
 * A new single-use reset link (stored hashed, expiring within the hour); earlier links stop working.
 * Nothing is sent when one went out within the last few minutes (./mail-throttle.ts).
 */
export async function sendResetLink(tx: Tx, user: { id: string; name: string; email: string }) {
  if (await mailedRecently(tx, user.id, "reset_password")) return;
  const { token, hash } = newToken();
  await retireEmailTokens(tx, user.id, "reset_password");
  await insertEmailToken(tx, {
    userId: user.id,
    purpose: "reset_password",
    tokenHash: hash,
    expiresAt: new Date(Date.now() + RESET_TTL_MINUTES * MINUTE),
  });
  await enqueueEmail(tx, {
    to: user.email,
    template: "password-reset",
    data: { name: user.name, resetUrl: appLink("/reset-password", { token }), expiresInMinutes: RESET_TTL_MINUTES },
  });
}

export async function requestPasswordReset(ctx: RequestContext, input: { email: string }): Promise<ActionState> {
  const email = input.email.trim();
  await hitAll(db(), [
    [addressKey("reset", email), LIMITS.resetAddress],
    [ipKey("reset", ctx.ip), LIMITS.resetIp],
  ]);
  const user = await findUserByEmail(db(), email);
  if (user && !user.disabled) await db().transaction((tx) => sendResetLink(tx, user));
  return { status: 200, message: resetSentMessage(email) };
}

export async function resetPassword(
  _ctx: RequestContext,
  input: { token: string; password: string },
): Promise<ActionState> {
  const problem = passwordProblem(input.password);
  if (problem) throw badRequest("Please choose another password.", { password: problem });
  const passwordHash = await hashPassword(input.password);
  const userId = await db().transaction(async (tx) => {
    const id = await consumeEmailToken(tx, hashToken(input.token), "reset_password");
    if (!id) throw notFound(RESET_LINK_DEAD);
    const user = await findUserById(tx, id);
    if (!user) throw notFound(RESET_LINK_DEAD);
    // The link reached the address, so the address is proven too.
    await updateUser(tx, id, { passwordHash, emailVerifiedAt: user.emailVerifiedAt ?? new Date() });
    await enqueueEmail(tx, { to: user.email, template: "password-changed", data: { name: user.name } });
    // Opening the link proved who they are: the sign-in back-off on that account is lifted.
    await liftSignInBackoff(tx, user.email);
    return id;
  });
  // Whoever knew the old password is signed out everywhere (issue 4 §1).
  await lucia().invalidateUserSessions(userId);
  return { status: 200, redirectTo: "/sign-in?reset=done" };
}
