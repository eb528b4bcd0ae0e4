// The browser's side of the teacher routes: JSON in and out, and a refusal as an error that keeps
// the server's words — including, for a tune, its problems at line and column.
import { ApiError, errorWords, fetchJson } from "@/lib/catalogue/fetch-json";
import type { Problem } from "@/lib/abc/types";

export { ApiError, errorWords };

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

type Body = { problems?: Problem[]; planReasons?: string[] };

/** fetchJson, with a tune's refusal (problems at line and column, plan reasons) as a ProblemsError. */
export async function teachFetch<T>(url: string, init: { method?: string; body?: unknown } = {}): Promise<T> {
  try {
    return await fetchJson<T>(url, init);
  } catch (error) {
    const e: Body = error instanceof ApiError ? (error.body as Body) : {};
    if (error instanceof ApiError && (e.problems || e.planReasons)) {
      throw new ProblemsError(error.message, e.problems ?? [], e.planReasons ?? []);
    }
    throw error;
  }
}
