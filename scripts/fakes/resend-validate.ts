import type { FakeEmail } from "./resend-store";

type Checked =
  | { ok: true; email: Pick<FakeEmail, "from" | "to" | "subject" | "html" | "text"> }
  | { ok: false; name: "validation_error" | "missing_required_field"; message: string };

// Loose on purpose: enough to catch a malformed address, not a full RFC 5322 parser.
const ADDRESS = /^(?:[^<>]*<\s*[^<>\s@]+@[^<>\s@]+\.[^<>\s@]+\s*>|[^<>\s@]+@[^<>\s@]+\.[^<>\s@]+)$/;

/** The checks Resend makes on a send that matter here (Resend API reference, "Send Email": from, to ≤ 50, subject required). */
export function validateEmail(body: unknown): Checked {
  if (typeof body !== "object" || body === null) return invalid("validation_error", "The body must be a JSON object.");
  const b = body as Record<string, unknown>;
  for (const field of ["from", "to", "subject"] as const) {
    if (b[field] === undefined || b[field] === null || b[field] === "")
      return invalid("missing_required_field", `Missing \`${field}\` field.`);
  }
  if (typeof b.from !== "string" || !ADDRESS.test(b.from)) {
    return invalid(
      "validation_error",
      "Invalid `from` field. The email address needs to follow the `email@example.com` or `Name <email@example.com>` format.",
    );
  }
  const to = typeof b.to === "string" ? [b.to] : b.to;
  if (!Array.isArray(to) || to.length === 0 || to.length > 50)
    return invalid("validation_error", "`to` must hold 1 to 50 addresses.");
  for (const address of to) {
    if (typeof address !== "string" || !ADDRESS.test(address))
      return invalid("validation_error", `Invalid \`to\` field: ${String(address)}.`);
  }
  if (typeof b.subject !== "string") return invalid("validation_error", "`subject` must be a string.");
  const html = typeof b.html === "string" ? b.html : null;
  const text = typeof b.text === "string" ? b.text : null;
  if (html === null && text === null) return invalid("missing_required_field", "Missing `html` or `text` field.");
  return { ok: true, email: { from: b.from, to: to as string[], subject: b.subject, html, text } };
}

function invalid(name: "validation_error" | "missing_required_field", message: string): Checked {
  return { ok: false, name, message };
}
