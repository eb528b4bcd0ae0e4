import type { CurrentUser } from "@/lib/auth/current-user";
import { HttpError, unauthorized } from "@/lib/auth/errors";
import { StorageConfigError } from "./s3";

export const NO_STORE = { "cache-control": "no-store" };

/** Storage that is not configured is the operator's problem: 503 with the missing setting's name. */
export async function withStorage<T>(run: () => Promise<T>): Promise<T> {
  try {
    return await run();
  } catch (e) {
    if (e instanceof StorageConfigError) throw new HttpError(503, e.message);
    throw e;
  }
}

/** The signed-in person; the guard has already checked the action, this only narrows the type. */
export function signedIn(user: CurrentUser | null): CurrentUser {
  if (!user) throw unauthorized();
  return user;
}
