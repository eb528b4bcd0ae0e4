// The guarded server actions of courses (lib/auth/guard.ts); the "use server" files beside the forms
// pass the real request's context to these, tests pass their own.
import { z } from "zod";
import { db } from "@/db/client";
import { guardAction } from "@/lib/auth/guard";
import { unauthorized } from "@/lib/auth/errors";
import { startCourse } from "@/lib/billing/enrol";

/** A member starts a course from its catalogue page and lands on its ladder. */
export const startCourseAction = guardAction(
  "billing:manage",
  z.object({ courseId: z.uuid("Say which course to start.") }),
  async (ctx, input) => {
    if (!ctx.user) throw unauthorized();
    const r = await startCourse(db(), ctx.user, input.courseId);
    return { status: 200, redirectTo: `/learn/courses/${encodeURIComponent(r.slug)}` };
  },
);
