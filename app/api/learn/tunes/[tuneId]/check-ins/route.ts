import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { checkInRung, rungCheckInInput } from "@/lib/teaching/course-check-in";
import { personOf, privateJson } from "@/lib/teaching/learn-respond";

export const dynamic = "force-dynamic";

/** Checks in a stage of a course's tune: 201 (on a self-paced course the next stage is open at once); 409 when not open. */
export const POST = guardRoute({ action: "checkin:create", input: rungCheckInInput }, async (ctx, input) => {
  const { tuneId, ...body } = input;
  return privateJson({ checkIn: await checkInRung(db(), personOf(ctx), tuneId, body) }, 201);
});
