// Stripe's error bodies and statuses (Stripe docs: "Errors" and "Error codes"): { error: { type, code,
// message, param, decline_code, doc_url } }. The SDK turns them into StripeInvalidRequestError,
// StripeCardError, StripeAuthenticationError by `type` and status. Messages follow Stripe's wording
// as remembered (from memory), which is enough for the SDK and for people reading logs.
import type { CardError } from "./types";

export interface ErrorBody {
  type: "invalid_request_error" | "card_error" | "api_error" | "idempotency_error";
  message: string;
  code?: string;
  param?: string;
  decline_code?: string;
  charge?: string;
  payment_intent?: { id: string };
  doc_url?: string;
}

export class StripeFakeError extends Error {
  constructor(
    readonly status: number,
    readonly body: ErrorBody,
  ) {
    super(body.message);
  }
}

const docUrl = (code: string) => `https://stripe.com/docs/error-codes/${code.replace(/_/g, "-")}`;

export function missingParam(param: string): StripeFakeError {
  return new StripeFakeError(400, {
    type: "invalid_request_error",
    code: "parameter_missing",
    param,
    message: `Missing required param: ${param}.`,
    doc_url: docUrl("parameter_missing"),
  });
}

/** A present but unacceptable value. Stripe names a specific code for some cases (integer, empty). */
export function invalidParam(param: string, message: string, code?: string): StripeFakeError {
  return new StripeFakeError(400, {
    type: "invalid_request_error",
    param,
    message,
    ...(code ? { code, doc_url: docUrl(code) } : {}),
  });
}

export function requestError(message: string, code?: string, param?: string): StripeFakeError {
  return new StripeFakeError(400, {
    type: "invalid_request_error",
    message,
    ...(code ? { code, doc_url: docUrl(code) } : {}),
    ...(param ? { param } : {}),
  });
}

export function notFound(noun: string, id: string, param = "id"): StripeFakeError {
  return new StripeFakeError(404, {
    type: "invalid_request_error",
    code: "resource_missing",
    param,
    message: `No such ${noun}: '${id}'`,
    doc_url: docUrl("resource_missing"),
  });
}

export function unknownRoute(method: string, path: string): StripeFakeError {
  return new StripeFakeError(404, {
    type: "invalid_request_error",
    message: `Unrecognized request URL (${method}: ${path}). This stand-in speaks only the part of Stripe's API the app uses.`,
  });
}

/** 401 as Stripe answers it: the key masked but for its last four characters. */
export function badKey(given: string | null): StripeFakeError {
  const message = given
    ? `Invalid API Key provided: ${given.slice(0, 8)}${"*".repeat(Math.max(0, given.length - 12))}${given.slice(-4)}`
    : "You did not provide an API key. You need to provide your API key in the Authorization header, using Bearer auth (e.g. 'Authorization: Bearer YOUR_SECRET_KEY').";
  return new StripeFakeError(401, { type: "invalid_request_error", message });
}

export function cardError(err: CardError, charge?: string, paymentIntent?: string): StripeFakeError {
  return new StripeFakeError(402, {
    type: "card_error",
    code: err.code,
    decline_code: err.decline_code,
    message: err.message,
    doc_url: docUrl(err.code),
    ...(charge ? { charge } : {}),
    ...(paymentIntent ? { payment_intent: { id: paymentIntent } } : {}),
  });
}
