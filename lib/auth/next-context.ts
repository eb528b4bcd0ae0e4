import { cookies, headers } from "next/headers";
import { forbidden, redirect } from "next/navigation";
import type { ActionState } from "./action-state";
import { loadContext, type RequestContext } from "./context";
import { getCurrentUser, type CurrentUser } from "./current-user";
import type { GuardedAction } from "./guard";
import { can, type Action } from "./permissions";

// The Next.js side of the guard: the real request's headers and cookie jar. Kept apart from
// guard.ts so tests can call guarded actions with a context of their own.

export async function nextContext(): Promise<RequestContext> {
  const jar = await cookies();
  return loadContext(await headers(), (c) => jar.set(c.name, c.value, c.attributes));
}

/** What every thin `"use server"` export calls: run the guarded action, then follow its redirect. */
export async function runAction(guarded: GuardedAction, formData: FormData): Promise<ActionState> {
  const state = await guarded(await nextContext(), formData);
  if (state.status === 200 && state.redirectTo) redirect(state.redirectTo);
  return state;
}

/** For layouts and pages of an area: sign-in first; a role without the area gets the 403 page (app/forbidden.tsx). */
export async function requireArea(action: Action): Promise<CurrentUser> {
  const user = await getCurrentUser();
  if (!user) {
    // proxy.ts passes the address asked for, so signing in can lead back to it.
    const asked = (await headers()).get("x-rosinwood-path");
    redirect(asked ? `/sign-in?next=${encodeURIComponent(asked)}` : "/sign-in");
  }
  if (!can(user.role, action)) forbidden();
  return user;
}
