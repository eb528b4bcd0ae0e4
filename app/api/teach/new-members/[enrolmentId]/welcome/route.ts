import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { sendWelcome, welcomeInput } from "@/lib/courses/members";
import { editorOf } from "@/lib/tunes/access";
import { NO_STORE } from "@/lib/tunes/respond";

export const dynamic = "force-dynamic";

/** The teacher's welcome note to a member they follow, e-mailed once (a second one answers 409). */
export const POST = guardRoute({ action: "members:welcome", input: welcomeInput }, async (ctx, input) => {
  const member = await sendWelcome(db(), editorOf(ctx.user), input.enrolmentId, input.note, new Date());
  return Response.json({ member }, { status: 201, headers: NO_STORE });
});
