import { z } from "zod";
import { db } from "@/db/client";
import { unauthorized } from "@/lib/auth/errors";
import { guardRoute } from "@/lib/auth/guard";
import { feedAddress, revokeCalendarToken, rotateCalendarToken } from "@/lib/calendar/tokens";

export const dynamic = "force-dynamic";

const NO_STORE = { "cache-control": "no-store" };

/** The guard has checked the action; this only narrows the type. */
function signedIn<T>(user: T | null): T {
  if (!user) throw unauthorized();
  return user;
}

/** Creates the caller's private feed address, or replaces it (the old address stops working). */
export const POST = guardRoute({ action: "calendar:manage", input: z.object({}) }, async (ctx) => {
  const me = signedIn(ctx.user);
  const token = await rotateCalendarToken(db(), me.id);
  return Response.json({ url: feedAddress(token) }, { headers: NO_STORE });
});

/** Turns the feed off: the address answers 404 from now on. */
export const DELETE = guardRoute({ action: "calendar:manage", input: z.object({}) }, async (ctx) => {
  const me = signedIn(ctx.user);
  await revokeCalendarToken(db(), me.id);
  return new Response(null, { status: 204, headers: NO_STORE });
});
