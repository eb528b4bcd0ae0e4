// Answers shared by the tune routes.
import type { Problem } from "@/lib/abc/types";
import type { ProblemsBody } from "./api-types";

export const NO_STORE = { "cache-control": "no-store" };

/** 422 with the engine's problems (line and column) and the plan's reasons: nothing was stored. */
export function problemsResponse(problems: Problem[], planReasons: string[] = [], notes: Problem[] = []): Response {
  const error = planReasons.length
    ? "The stage plan needs changing; nothing was saved."
    : "The ABC has problems; nothing was saved.";
  const body: ProblemsBody = { error, problems, planReasons, notes };
  return Response.json(body, { status: 422, headers: NO_STORE });
}
