import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { billingSummary } from "@/lib/billing/account";

export const dynamic = "force-dynamic";

/** The signed-in member's plan, status, next charge, payments with refunds, and the plans they could change to. */
export const GET = guardRoute({ action: "billing:manage", input: z.object({}) }, async (ctx) => {
  const user = ctx.user;
  if (!user) throw new Error("guarded route without a user");
  return Response.json(await billingSummary(db(), user.id), { headers: { "cache-control": "no-store" } });
});
