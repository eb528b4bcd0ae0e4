"use server";

import type { ActionState } from "@/lib/auth/action-state";
import { runAction } from "@/lib/auth/next-context";
import * as guarded from "@/lib/courses/actions";

export async function startCourse(_prev: ActionState, form: FormData) {
  return runAction(guarded.startCourseAction, form);
}
