// The browser's side of the catalogue routes: JSON in, JSON out, and a refusal as an error that
// keeps the server's words (why a stage is locked, which field is wrong).
import type { ErrorJson } from "./api-types";

export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly fieldErrors: Record<string, string> = {},
    /** The refusal's whole JSON body, for callers that read more than the message (a tune's problems). */
    readonly body: Record<string, unknown> = {},
  ) {
    super(message);
  }
}

export async function fetchJson<T>(url: string, init: { method?: string; body?: unknown } = {}): Promise<T> {
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
    const raw = body && typeof body === "object" ? (body as Record<string, unknown>) : {};
    const e = raw as Partial<ErrorJson>;
    throw new ApiError(res.status, e.error ?? `Something went wrong (${res.status}).`, e.fieldErrors ?? {}, raw);
  }
  return body as T;
}

/** Words for a failed query, to show in place of the data. */
export function errorWords(error: unknown): string {
  return error instanceof Error ? error.message : "Something went wrong.";
}
