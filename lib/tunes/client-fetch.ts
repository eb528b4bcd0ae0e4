// The browser's side of the teacher routes: JSON in and out, and a refusal as an error that keeps
// the server's words — including, for a tune, its problems at line and column.
import { ApiError } from "@/lib/catalogue/fetch-json";
import type { Problem } from "@/lib/abc/types";

export { ApiError };

/** A 422 from a tune save or stage edit: nothing was stored, and here is why. */
export class ProblemsError extends ApiError {
  constructor(
    message: string,
    readonly problems: Problem[],
    readonly planReasons: string[],
  ) {
    super(422, message);
  }
}

type Body = { error?: string; fieldErrors?: Record<string, string>; problems?: Problem[]; planReasons?: string[] };

export async function teachFetch<T>(url: string, init: { method?: string; body?: unknown } = {}): Promise<T> {
  let res: Response;
  try {
    res = await fetch(url, {
      method: init.method ?? "GET",
      headers: init.body === undefined ? undefined : { "content-type": "application/json" },
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
      credentials: "same-origin",
    });
  } catch {
    throw new ApiError(0, "We couldn't reach Rosinwood. Check your connection and try again.");
  }
  if (res.status === 204) return undefined as T;
  const body: unknown = await res.json().catch(() => null);
  if (!res.ok) {
    const e: Body = body && typeof body === "object" ? (body as Body) : {};
    const message = e.error ?? `Something went wrong (${res.status}).`;
    if (e.problems || e.planReasons) throw new ProblemsError(message, e.problems ?? [], e.planReasons ?? []);
    throw new ApiError(res.status, message, e.fieldErrors ?? {});
  }
  return body as T;
}

export function errorWords(error: unknown): string {
  return error instanceof Error ? error.message : "Something went wrong.";
}
