"use server";

// Thin server actions: the real request's context into the guarded actions of lib/auth/actions.
// Next.js checks these calls' Origin itself (issue 4 §6).
import * as guarded from "@/lib/auth/actions";
import type { ActionState } from "@/lib/auth/action-state";
import { runAction } from "@/lib/auth/next-context";

export async function signUp(_prev: ActionState, form: FormData) {
  return runAction(guarded.signUpAction, form);
}
export async function signIn(_prev: ActionState, form: FormData) {
  return runAction(guarded.signInAction, form);
}
export async function requestReset(_prev: ActionState, form: FormData) {
  return runAction(guarded.requestResetAction, form);
}
export async function resetPassword(_prev: ActionState, form: FormData) {
  return runAction(guarded.resetPasswordAction, form);
}
export async function verifyEmail(_prev: ActionState, form: FormData) {
  return runAction(guarded.verifyEmailAction, form);
}
export async function acceptInvitation(_prev: ActionState, form: FormData) {
  return runAction(guarded.acceptInvitationAction, form);
}
