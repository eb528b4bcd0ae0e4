/** An expected failure with the status the guard answers with; anything else becomes a 500. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly fieldErrors?: Record<string, string>,
  ) {
    super(message);
  }
}

/** What a person is told when the server failed in a way nobody planned for (the details go to the log). */
export const UNEXPECTED_FAILURE = "Something went wrong on our side. Please try again.";

export const badRequest = (message: string, fieldErrors?: Record<string, string>) =>
  new HttpError(400, message, fieldErrors);
export const unauthorized = (message = "Please sign in first.") => new HttpError(401, message);
export const forbidden = (message = "Your account can't do that.") => new HttpError(403, message);
export const notFound = (message = "We couldn't find that.") => new HttpError(404, message);
export const conflict = (message: string) => new HttpError(409, message);
export const unprocessable = (message: string, fieldErrors?: Record<string, string>) =>
  new HttpError(422, message, fieldErrors);

export class RateLimitedError extends HttpError {
  constructor(readonly retryAfterSeconds: number) {
    const minutes = Math.max(1, Math.ceil(retryAfterSeconds / 60));
    super(429, `Too many attempts. Please try again in ${minutes} minute${minutes === 1 ? "" : "s"}.`);
  }
}

/** The SQLSTATE of a PostgreSQL error, also when drizzle wrapped it (DrizzleQueryError's cause). */
export function sqlState(e: unknown): string | null {
  for (let x = e, depth = 0; x && typeof x === "object" && depth < 4; x = (x as { cause?: unknown }).cause, depth++) {
    const code = (x as { code?: unknown }).code;
    if (typeof code === "string" && /^[0-9A-Z]{5}$/.test(code)) return code;
  }
  return null;
}

// PostgreSQL Appendix A "Error Codes": two writers met on a unique, foreign-key, check or exclusion
// rule, or one had to give way to the other (serialization failure, deadlock).
const RACES = new Set(["23505", "23503", "23514", "23P01", "40001", "40P01"]);
export const CHANGED_MEANWHILE = "Someone else changed this at the same moment. Reload the page and try again.";

/** A 409 for a write that lost a race with another (the guard's fallback; callers may say more). */
export function raceConflict(e: unknown, message = CHANGED_MEANWHILE): HttpError | null {
  const state = sqlState(e);
  return state && RACES.has(state) ? conflict(message) : null;
}
