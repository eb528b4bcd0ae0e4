"use server";

import * as guarded from "@/lib/auth/actions";
import type { ActionState } from "@/lib/auth/action-state";
import { runAction } from "@/lib/auth/next-context";

export async function inviteStudents(_prev: ActionState, form: FormData) {
  return runAction(guarded.inviteStudentsAction, form);
}
