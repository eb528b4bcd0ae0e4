"use server";

import { revalidatePath } from "next/cache";
import * as guarded from "@/lib/auth/actions";
import type { ActionState } from "@/lib/auth/action-state";
import { runAction } from "@/lib/auth/next-context";

export async function inviteTeacher(_prev: ActionState, form: FormData) {
  return runAction(guarded.inviteTeacherAction, form);
}
export async function changeRole(_prev: ActionState, form: FormData) {
  const state = await runAction(guarded.changeRoleAction, form);
  if (state.status === 200) revalidatePath("/admin/people");
  return state;
}
