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
