import { z } from "zod";
import { db } from "@/db/client";
import { insertInvitation, type Tx } from "@/db/queries/auth";
import { enqueueEmail } from "@/lib/mail/outbox";
import type { ActionState } from "./action-state";
import type { RequestContext } from "./context";
import { badRequest, unauthorized } from "./errors";
import { appLink } from "./links";
import type { Role } from "./permissions";
import { hit, LIMITS } from "./rate-limit";
import { INVITATION_TTL_DAYS, newToken } from "./tokens";

export const MAX_INVITES_AT_ONCE = 50;
const emailSchema = z.email();

/** Splits what a teacher pasted (commas, semicolons, spaces or lines) into distinct addresses and the ones that aren't addresses. */
export function parseAddresses(text: string): { valid: string[]; invalid: string[] } {
  const seen = new Set<string>();
  const valid: string[] = [];
  const invalid: string[] = [];
  for (const raw of text.split(/[\s,;]+/)) {
    // "Name <a@b.example>" is how mail programs copy addresses.
    const address = raw.replace(/^<|>$/g, "").trim();
    if (!address) continue;
    if (!emailSchema.safeParse(address).success) invalid.push(address);
    else if (!seen.has(address.toLowerCase())) {
      seen.add(address.toLowerCase());
      valid.push(address);
    }
  }
  return { valid, invalid };
}

async function invite(tx: Tx, inviter: { id: string; name: string }, email: string, role: Role) {
  const { token, hash } = newToken();
  await insertInvitation(tx, {
    email,
    role,
    invitedBy: inviter.id,
    tokenHash: hash,
    expiresAt: new Date(Date.now() + INVITATION_TTL_DAYS * 86_400_000),
  });
  await enqueueEmail(tx, {
    to: email,
    template: "invitation",
    data: {
      inviterName: inviter.name,
      role,
      acceptUrl: appLink("/accept-invitation", { token }),
      expiresInDays: INVITATION_TTL_DAYS,
    },
  });
}

/**
 * Sends each address a link; the answer never says which addresses already have accounts.
 * Students invited by a teacher join that teacher's roster when they accept.
 */
export async function inviteStudents(ctx: RequestContext, input: { addresses: string }): Promise<ActionState> {
  const inviter = ctx.user;
  if (!inviter) throw unauthorized();
  const { valid, invalid } = parseAddresses(input.addresses);
  if (invalid.length)
    throw badRequest("Please fix the addresses.", {
      addresses: `These don't look like e-mail addresses: ${invalid.join(", ")}`,
    });
  if (!valid.length) throw badRequest("Please add an address.", { addresses: "Add at least one e-mail address." });
  if (valid.length > MAX_INVITES_AT_ONCE) {
    throw badRequest("Too many at once.", {
      addresses: `Up to ${MAX_INVITES_AT_ONCE} addresses at a time, please (you gave ${valid.length}).`,
    });
  }
  const others = valid.filter((a) => a.toLowerCase() !== inviter.email.toLowerCase());
  for (let i = 0; i < others.length; i++) await hit(db(), `invite:${inviter.id}`, LIMITS.invite);
  await db().transaction(async (tx) => {
    for (const email of others) await invite(tx, inviter, email, "student");
  });
  const n = others.length;
  return {
    status: 200,
    message: `Invitation${n === 1 ? "" : "s"} sent to ${n} address${n === 1 ? "" : "es"}. Each link works for ${INVITATION_TTL_DAYS} days.`,
  };
}

export async function inviteTeacher(ctx: RequestContext, input: { email: string }): Promise<ActionState> {
  const inviter = ctx.user;
  if (!inviter) throw unauthorized();
  await hit(db(), `invite:${inviter.id}`, LIMITS.invite);
  await db().transaction((tx) => invite(tx, inviter, input.email.trim(), "teacher"));
  return { status: 200, message: `Invitation to teach sent to ${input.email.trim()}.` };
}
