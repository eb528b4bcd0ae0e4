import { z } from "zod";
import type { Cookie } from "lucia";
import { env } from "@/lib/env";
import { CONTROL_MESSAGE, findControlCharacter, withoutControlCharacters } from "@/lib/validation/text";
import type { ActionState } from "./action-state";
import { loadContext, type RequestContext } from "./context";
import { HttpError, raceConflict, RateLimitedError, UNEXPECTED_FAILURE, unprocessable } from "./errors";
import { can, type Action } from "./permissions";

// The one server-side check (ENGINEERING.md): every server action and route handler is wrapped
// by one of the two functions below, which load the session, ask the permission table, validate
// the input with zod and turn failures into 400/401/403/404/409/422/429 answers.

/** A server action with its context made explicit; app/**\/actions.ts passes the real one. */
export type GuardedAction = (ctx: RequestContext, input: FormData | Record<string, unknown>) => Promise<ActionState>;

type Run<S extends z.ZodType, R> = (ctx: RequestContext, input: z.output<S>) => Promise<R>;

function formToObject(input: FormData | Record<string, unknown>): Record<string, unknown> {
  if (!(input instanceof FormData)) return input;
  const out: Record<string, unknown> = {};
  for (const [key, value] of input.entries()) {
    if (key.startsWith("$ACTION") || typeof value !== "string") continue; // React's own fields
    out[key] = value;
  }
  return out;
}

function fieldErrorsOf(error: z.ZodError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = String(issue.path[0] ?? "form");
    out[key] ??= issue.message;
  }
  return out;
}

/** Text fields to keep in the form after a failed submit; secrets are never sent back. */
function echo(raw: Record<string, unknown>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(raw))
    if (typeof v === "string" && !/password|token/i.test(k)) out[k] = withoutControlCharacters(v);
  return out;
}

/** The one rule for text input (lib/validation/text.ts): a control character is refused, naming its field. */
function refuseControlCharacters(input: unknown): void {
  const found = findControlCharacter(input);
  if (!found) return;
  const problem = `${CONTROL_MESSAGE} (${found.char} found)`;
  throw unprocessable(`“${found.field}” ${problem}.`, { [found.field]: problem });
}

function permissionFailure(ctx: RequestContext): HttpError {
  return ctx.user ? new HttpError(403, "Your account can't do that.") : new HttpError(401, "Please sign in first.");
}

function unexpected(error: unknown): HttpError {
  const race = raceConflict(error);
  if (race) return race;
  console.error(error);
  return new HttpError(500, UNEXPECTED_FAILURE);
}

export function guardAction<S extends z.ZodType>(
  action: Action,
  schema: S,
  run: Run<S, ActionState | void>,
): GuardedAction {
  return async (ctx, input) => {
    const raw = formToObject(input);
    try {
      if (!can(ctx.user?.role ?? "visitor", action)) throw permissionFailure(ctx);
      refuseControlCharacters(raw);
      const parsed = schema.safeParse(raw);
      if (!parsed.success) {
        return {
          status: 400,
          message: "Please check the highlighted fields.",
          fieldErrors: fieldErrorsOf(parsed.error),
          values: echo(raw),
        };
      }
      return (await run(ctx, parsed.data)) ?? { status: 200 };
    } catch (e) {
      const error = e instanceof HttpError ? e : unexpected(e);
      return { status: error.status, message: error.message, fieldErrors: error.fieldErrors, values: echo(raw) };
    }
  };
}

type RouteArgs = { params: Promise<Record<string, string | string[]>> };
export type GuardedRoute = (req: Request, args: RouteArgs) => Promise<Response>;

/** Cross-site requests carry another Origin (or Sec-Fetch-Site: cross-site); browsers always send one on a cross-site POST. */
function sameOrigin(req: Request): boolean {
  const origin = req.headers.get("origin");
  if (origin) return origin === new URL(env().APP_URL).origin;
  const site = req.headers.get("sec-fetch-site");
  return !site || site === "same-origin" || site === "none";
}

async function readInput(req: Request, from: "query" | "json" | "form"): Promise<Record<string, unknown>> {
  if (from === "query") return Object.fromEntries(new URL(req.url).searchParams);
  if (from === "form") return formToObject(await req.formData());
  const body: unknown = await req.json().catch(() => null);
  return body && typeof body === "object" && !Array.isArray(body) ? (body as Record<string, unknown>) : {};
}

function withCookies(res: Response, cookies: Cookie[]): Response {
  for (const c of cookies) res.headers.append("set-cookie", c.serialize());
  return res;
}

export function guardRoute<S extends z.ZodType>(
  opts: { action: Action; input: S; from?: "query" | "json" | "form" },
  run: (ctx: RequestContext, input: z.output<S>, req: Request) => Promise<Response>,
): GuardedRoute {
  return async (req, args) => {
    const from = opts.from ?? (req.method === "GET" || req.method === "HEAD" ? "query" : "json");
    const cookies: Cookie[] = [];
    try {
      const mutating = !["GET", "HEAD", "OPTIONS"].includes(req.method);
      if (mutating && !sameOrigin(req)) throw new HttpError(403, "Cross-site request refused.");
      const ctx = await loadContext(req.headers, (c) => cookies.push(c));
      if (!can(ctx.user?.role ?? "visitor", opts.action)) throw permissionFailure(ctx);
      const params = (await args?.params) ?? {};
      const input = { ...(await readInput(req, from)), ...params };
      refuseControlCharacters(input);
      const parsed = opts.input.safeParse(input);
      if (!parsed.success) throw new HttpError(400, "The request is not valid.", fieldErrorsOf(parsed.error));
      return withCookies(await run(ctx, parsed.data, req), cookies);
    } catch (e) {
      const error = e instanceof HttpError ? e : unexpected(e);
      const headers: Record<string, string> = { "cache-control": "no-store" };
      if (error instanceof RateLimitedError) headers["retry-after"] = String(error.retryAfterSeconds);
      const body = { error: error.message, fieldErrors: error.fieldErrors };
      return withCookies(Response.json(body, { status: error.status, headers }), cookies);
    }
  };
}
