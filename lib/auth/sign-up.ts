import { db } from "@/db/client";
import { createUser, findUserByEmail } from "@/db/queries/people";
import { insertEmailToken, retireEmailTokens, type Tx } from "@/db/queries/auth";
import { enqueueEmail } from "@/lib/mail/outbox";
import type { ActionState } from "./action-state";
import type { RequestContext } from "./context";
import { badRequest, sqlState } from "./errors";
import { appLink } from "./links";
import { mailedRecently } from "./mail-throttle";
import { hashPassword } from "./password";
import { passwordProblem } from "./password-policy";
import { addressKey, hitAll, ipKey, LIMITS } from "./rate-limit";
import { chosenPlan, chosenQuery, type ChosenPlan } from "./chosen-plan";
import { sendResetLink } from "./password-reset";
import { MINUTE, newToken, VERIFY_TTL_MINUTES } from "./tokens";

export type SignUpInput = { name: string; email: string; password: string; plan?: string; course?: string };

// The answer is the same whether or not the address already has an account (issue 4 §3), so an
// account only becomes usable once its owner opens the link sent to the address.
export const signUpSentMessage = (email: string) =>
  `Nearly there: we've sent a message to ${email}. Open the link in it to confirm your address, then sign in. ` +
  "(If that address already has an account, the message explains how to get back into it.)";

/**
 * Sends the confirmation link that makes a new account usable (carrying the plan chosen, if any);
 * older links stop working. Nothing is sent when one went out within the last few minutes (./mail-throttle.ts).
 */
export async function sendVerifyLink(
  tx: Tx,
  user: { id: string; name: string; email: string },
  template: "welcome" | "verify-email",
  chosen: ChosenPlan | null = null,
) {
  if (await mailedRecently(tx, user.id, "verify_email")) return;
  const { token, hash } = newToken();
  await retireEmailTokens(tx, user.id, "verify_email");
  await insertEmailToken(tx, {
    userId: user.id,
    purpose: "verify_email",
    tokenHash: hash,
    expiresAt: new Date(Date.now() + VERIFY_TTL_MINUTES * MINUTE),
  });
  await enqueueEmail(tx, {
    to: user.email,
    template,
    data: { name: user.name, verifyUrl: appLink("/verify-email", { token, ...chosenQuery(chosen) }) },
  });
}

export async function signUp(ctx: RequestContext, input: SignUpInput): Promise<ActionState> {
  const email = input.email.trim();
  const problem = passwordProblem(input.password, email);
  if (problem) throw badRequest("Please choose another password.", { password: problem });
  await hitAll(db(), [
    [addressKey("sign-up", email), LIMITS.signUpAddress],
    [ipKey("sign-up", ctx.ip), LIMITS.signUpIp],
  ]);
  // Hashed whatever happens next, so a taken address answers as slowly as a new one.
  const passwordHash = await hashPassword(input.password);
  const chosen = chosenPlan(input);
  try {
    await db().transaction(async (tx) => {
      const existing = await findUserByEmail(tx, email);
      if (!existing) {
        const user = await createUser(tx, { email, name: input.name.trim(), role: "student", passwordHash });
        await sendVerifyLink(tx, user, "welcome", chosen);
      } else if (existing.disabled) {
        // A closed account gets nothing; the visitor still sees the same answer.
      } else if (!existing.emailVerifiedAt) {
        // The first sign-up may well be the address's owner: nothing of the account changes, and
        // whoever reads that mailbox gets a fresh link to confirm it (with the first password).
        await sendVerifyLink(tx, existing, "verify-email", chosen);
      } else {
        await sendResetLink(tx, existing);
      }
    });
  } catch (e) {
    // Another sign-up for the same new address won the race: its link is on its way; answer alike.
    if (sqlState(e) !== "23505") throw e;
  }
  return { status: 200, message: signUpSentMessage(email) };
}
