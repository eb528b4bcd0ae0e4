import { db } from "@/db/client";
import { findUserByEmail } from "@/db/queries/people";
import type { ActionState } from "./action-state";
import { startSession, type RequestContext } from "./context";
import { HttpError } from "./errors";
import { safeNext } from "./links";
import { lucia } from "./lucia";
import { hashPassword, verifyPassword } from "./password";
import { HOME } from "./permissions";
import { hit, ipKey, LIMITS } from "./rate-limit";
import { reserveSignInAttempt, signInSucceeded } from "./sign-in-backoff";
import { sendVerifyLink } from "./sign-up";

// One message for an unknown address, a wrong password and a closed account (issue 4 §3).
export const SIGN_IN_FAILED = "That address and password don't match an account. Check both, or reset your password.";
export const NOT_CONFIRMED =
  "Please confirm your address first: we've just sent a new confirmation link to it. Open it, then sign in here.";

// Verifying against a throwaway hash when the address is unknown keeps both answers equally slow,
// so timing does not tell an attacker which addresses have accounts (common practice).
let decoy: Promise<string> | undefined;
const decoyHash = () => (decoy ??= hashPassword("no account has this password; it only spends time"));

export async function signIn(
  ctx: RequestContext,
  input: { email: string; password: string; next?: string },
): Promise<ActionState> {
  const email = input.email.trim();
  await hit(db(), ipKey("sign-in", ctx.ip), LIMITS.signInIp);
  const attempt = await reserveSignInAttempt(db(), email, ctx.ip);
  const user = await findUserByEmail(db(), email);
  const matches = await verifyPassword(user?.passwordHash ?? (await decoyHash()), input.password);
  if (!user || !user.passwordHash || !matches || user.disabled) throw new HttpError(401, SIGN_IN_FAILED);
  await signInSucceeded(db(), attempt);
  if (!user.emailVerifiedAt) {
    // Only someone who knows the password gets here, so saying so reveals nothing new.
    await db().transaction((tx) => sendVerifyLink(tx, user, "verify-email"));
    throw new HttpError(403, NOT_CONFIRMED);
  }
  // A new session id at every sign-in; a session this browser already had is ended (common practice).
  if (ctx.sessionId) await lucia().invalidateSession(ctx.sessionId);
  await startSession(ctx, user.id);
  return { status: 200, redirectTo: safeNext(input.next) ?? HOME[user.role] };
}

export async function signOut(ctx: RequestContext): Promise<void> {
  if (ctx.sessionId) await lucia().invalidateSession(ctx.sessionId);
  ctx.setCookie(lucia().createBlankSessionCookie());
}
