// Shared by the student's route handlers (app/api/learn/**): the signed-in person and private answers.
import type { RequestContext } from "@/lib/auth/context";
import { unauthorized } from "@/lib/auth/errors";
import type { Person } from "./learn-assignment";

/** The guard has already refused visitors for every learn action; this narrows the type. */
export function personOf(ctx: RequestContext): Person {
  if (!ctx.user) throw unauthorized();
  return { id: ctx.user.id, role: ctx.user.role };
}

/** Answers are one person's own data: no shared cache may keep them. */
export function privateJson(body: unknown, status = 200): Response {
  return Response.json(body, { status, headers: { "cache-control": "private, no-store" } });
}
