import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { checkIn, parseCheckIn } from "@/lib/teaching/check-in";
import { personOf, privateJson } from "@/lib/teaching/learn-respond";

export const dynamic = "force-dynamic";

// The body's fields are checked in lib/teaching/check-in.ts so each wrong one is named (422).
const input = z.looseObject({ id: z.string().min(1).max(100) });

/** Checks in a stored recording on the open stage: 201; a stage not open (or a second check-in) 409. */
export const POST = guardRoute({ action: "checkin:create", input }, async (ctx, raw) => {
  const { id, ...body } = raw;
  const result = await checkIn(db(), personOf(ctx), { assignmentStudentId: id, ...parseCheckIn(body) });
  return privateJson({ checkIn: result }, 201);
});
