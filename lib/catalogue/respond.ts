// Answers of the catalogue routes: the data is per person, so no shared cache may keep it.
export const PRIVATE = { "cache-control": "private, no-store" } as const;

export function json(body: unknown, status = 200): Response {
  return Response.json(body, { status, headers: PRIVATE });
}
