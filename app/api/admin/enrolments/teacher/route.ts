import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { reassignInput, reassignTeacher } from "@/lib/courses/members";

export const dynamic = "force-dynamic";

/** The admin hands one or many enrolments to another teacher (who gets the students on their roster). */
export const POST = guardRoute({ action: "enrolments:reassign", input: reassignInput }, async (_ctx, input) => {
  const done = await reassignTeacher(db(), input, new Date());
  return Response.json(done, { headers: { "cache-control": "no-store" } });
});
