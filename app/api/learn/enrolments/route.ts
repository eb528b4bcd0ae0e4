import { z } from "zod";
import { db } from "@/db/client";
import { guardRoute } from "@/lib/auth/guard";
import { startCourse } from "@/lib/billing/enrol";

export const dynamic = "force-dynamic";

/** A member in good standing starts a course: an active enrolment (201; 200 when already enrolled). */
export const POST = guardRoute(
  {
    action: "billing:manage",
    input: z.object({
      courseId: z.string({ error: "Say which course to start." }).min(1, "Say which course to start."),
    }),
  },
  async (ctx, input) => {
    const user = ctx.user;
    if (!user) throw new Error("guarded route without a user");
    const r = await startCourse(db(), user, input.courseId);
    return Response.json(
      { enrolled: true, slug: r.slug },
      { status: r.created ? 201 : 200, headers: { "cache-control": "no-store" } },
    );
  },
);
