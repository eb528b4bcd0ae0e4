import { db } from "@/db/client";
import { consumeEmailToken, findUserById, updateUser } from "@/db/queries/auth";
import type { ActionState } from "./action-state";
import type { RequestContext } from "./context";
import { notFound } from "./errors";
import { hashToken } from "./tokens";
import { checkoutPath, chosenPlan } from "./chosen-plan";

export const VERIFY_LINK_DEAD =
  "This confirmation link has expired or has already been used. Sign in with your address and password and we'll send a fresh one.";

/**
 * Confirms the address behind a single-use link; the person then signs in with their password and,
 * when they chose a plan before signing up, goes straight on to its checkout.
 */
export async function verifyEmail(
  _ctx: RequestContext,
  input: { token: string; plan?: string; course?: string },
): Promise<ActionState> {
  await db().transaction(async (tx) => {
    const userId = await consumeEmailToken(tx, hashToken(input.token), "verify_email");
    const user = userId ? await findUserById(tx, userId) : null;
    if (!user) throw notFound(VERIFY_LINK_DEAD);
    if (!user.emailVerifiedAt) await updateUser(tx, user.id, { emailVerifiedAt: new Date() });
  });
  const chosen = chosenPlan(input);
  return {
    status: 200,
    redirectTo: chosen
      ? `/sign-in?confirmed=1&next=${encodeURIComponent(checkoutPath(chosen))}`
      : "/sign-in?confirmed=1",
  };
}
