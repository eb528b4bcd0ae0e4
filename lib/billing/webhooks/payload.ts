// What the webhook route needs of a delivery besides the SDK's check: the signature's timestamp and a
// copy of the event that PostgreSQL can store.

/** The SDK's own default (stripe-node Webhook.DEFAULT_TOLERANCE): five minutes either way. */
export const TOLERANCE_SECONDS = 300;

/** The `t=` of a Stripe-Signature header (Stripe docs: "Check the webhook signatures"), or null. */
export function signedAt(header: string | null): number | null {
  const t = header
    ?.split(",")
    .map((part) => part.trim())
    .find((part) => part.startsWith("t="))
    ?.slice(2);
  return t && /^\d{1,12}$/.test(t) ? Number(t) : null;
}

/**
 * The value with every NUL in its strings and keys replaced by U+FFFD: jsonb (and text) cannot hold
 * "\u0000" (PostgreSQL docs, "JSON Types"), and Stripe's objects may carry one in free text such as
 * metadata. Everything else is kept as sent.
 */
export function storable<T>(value: T): T {
  if (typeof value === "string") return value.replaceAll("\u0000", "\ufffd") as T;
  if (Array.isArray(value)) return value.map(storable) as T;
  if (value && typeof value === "object") {
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [storable(k), storable(v)])) as T;
  }
  return value;
}
