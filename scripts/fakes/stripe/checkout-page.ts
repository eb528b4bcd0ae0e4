// The hosted checkout page, /pay/<session id>: plain server-rendered HTML standing in for Stripe's hosted
// Checkout (its own plain look, not the app's). A person types a test card; the form posts back here.
// Field checks mirror what a card form says before the network is asked (messages from memory).
import { money, type Fake } from "./context";
import { findTestCard, luhnOk } from "./objects/cards";
import { completeSession, type CardInput } from "./objects/checkout-complete";
import { freshSession } from "./objects/checkout";
import { Params, parseForm } from "./params";
import type { CheckoutSession } from "./types";

export interface PageResult {
  status: number;
  html?: string;
  location?: string;
}

interface FormState {
  number: string;
  expiry: string;
  cvc: string;
  name: string;
  errors: Partial<Record<"number" | "expiry" | "cvc" | "name", string>>;
  alert: string | null;
}

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function summary(fake: Fake, s: CheckoutSession): string {
  if (s.mode === "setup")
    return "<p>Save a card for future payments. You will not be charged now unless a payment is overdue.</p>";
  const rows = s.line_items.map((li) => {
    const price = fake.store.get("price", li.price);
    const name = fake.store.find("product", price.product)?.name ?? price.id;
    const per = price.recurring
      ? ` per ${price.recurring.interval_count > 1 ? `${price.recurring.interval_count} ` : ""}${price.recurring.interval}`
      : "";
    return `<li>${esc(name)} — ${esc(money(price.unit_amount * li.quantity, price.currency))}${esc(per)}</li>`;
  });
  return `<ul class="items">${rows.join("")}</ul><p class="total">Total due today: <strong>${esc(money(s.amount_total ?? 0, s.currency ?? "gbp"))}</strong></p>`;
}

function field(id: keyof FormState["errors"], label: string, value: string, f: FormState, extra: string): string {
  const err = f.errors[id];
  return `<div class="field"><label for="${id}">${label}</label>
<input id="${id}" name="${id}" value="${esc(value)}" ${extra}${err ? ` aria-invalid="true" aria-describedby="${id}-error"` : ""}>
${err ? `<p class="error" id="${id}-error">${esc(err)}</p>` : ""}</div>`;
}

function page(fake: Fake, s: CheckoutSession, f: FormState): string {
  const closed = s.status !== "open";
  const body = closed
    ? `<p role="status">${s.status === "complete" ? "This checkout is already complete." : "This checkout has expired. Go back and start again."}</p>`
    : `${summary(fake, s)}
${f.alert ? `<p role="alert" class="alert">${esc(f.alert)}</p>` : ""}
<form method="post" action="/pay/${esc(s.id)}" novalidate>
${field("number", "Card number", f.number, f, 'inputmode="numeric" autocomplete="cc-number" placeholder="1234 1234 1234 1234"')}
<div class="row">${field("expiry", "Expiry", f.expiry, f, 'autocomplete="cc-exp" placeholder="MM / YY"')}
${field("cvc", "CVC", f.cvc, f, 'inputmode="numeric" autocomplete="cc-csc" placeholder="123"')}</div>
${field("name", "Name on card", f.name, f, 'autocomplete="cc-name"')}
<button type="submit">${s.mode === "setup" ? "Save card" : "Pay"}</button>
</form>`;
  const cancel = s.cancel_url ? `<p><a href="${esc(s.cancel_url)}">Cancel and go back</a></p>` : "";
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Checkout — test payment</title><style>
body{font-family:system-ui,sans-serif;background:#f2f2f2;color:#222;margin:0;padding:1rem}
main{max-width:26rem;margin:0 auto;background:#fff;border:1px solid #ccc;border-radius:6px;padding:1.25rem}
.badge{display:inline-block;background:#ffe7a3;color:#5a4200;font-size:.75rem;padding:.1rem .4rem;border-radius:3px}
label{display:block;font-size:.85rem;margin:.6rem 0 .2rem}input{width:100%;box-sizing:border-box;padding:.55rem;font-size:1rem;border:1px solid #999;border-radius:4px}
.row{display:flex;gap:.75rem}.row .field{flex:1}.error{color:#a4000f;font-size:.85rem;margin:.2rem 0 0}
.alert{background:#fde8ea;border:1px solid #a4000f;color:#a4000f;padding:.6rem;border-radius:4px}
button{margin-top:1rem;width:100%;padding:.7rem;font-size:1rem;background:#333;color:#fff;border:0;border-radius:4px;cursor:pointer}
details{margin-top:1rem;font-size:.85rem}
</style></head><body><main>
<h1>Checkout <span class="badge">Test mode</span></h1>
<p>Local stand-in for Stripe's hosted payment page. No real card is charged.</p>
${body}${cancel}
<details><summary>Test cards</summary><ul>
<li>4242 4242 4242 4242 — succeeds</li><li>4000 0000 0000 0002 — declined</li>
<li>4000 0000 0000 9995 — declined, insufficient funds</li><li>4000 0000 0000 0341 — saved, but charges fail</li>
</ul><p>Any future expiry date, any three-digit CVC.</p></details>
</main></body></html>`;
}

function parseExpiry(text: string, now: number): { month: number; year: number } | string {
  const m = /^\s*(\d{1,2})\s*\/\s*(\d{2}|\d{4})\s*$/.exec(text);
  if (!m) return "Your card's expiration date is incomplete.";
  const month = Number(m[1]);
  const year = m[2]?.length === 2 ? 2000 + Number(m[2]) : Number(m[2]);
  if (month < 1 || month > 12) return "Your card's expiration date is invalid.";
  const today = new Date(now * 1000);
  if (year < today.getUTCFullYear() || (year === today.getUTCFullYear() && month < today.getUTCMonth() + 1)) {
    return "Your card's expiration date is in the past.";
  }
  return { month, year };
}

function check(fake: Fake, f: FormState): CardInput | null {
  const digits = f.number.replace(/[\s-]/g, "");
  const card = findTestCard(digits);
  if (!digits || !/^\d+$/.test(digits) || digits.length < 12) f.errors.number = "Your card number is incomplete.";
  else if (!luhnOk(digits)) f.errors.number = "Your card number is invalid.";
  else if (!card)
    f.errors.number = "Your card was declined. This is a test page: use one of Stripe's test cards (see below).";
  const exp = parseExpiry(f.expiry, fake.clock.now());
  if (typeof exp === "string") f.errors.expiry = exp;
  const cvcLength = card?.brand === "amex" ? 4 : 3;
  if (!new RegExp(`^\\d{${cvcLength}}$`).test(f.cvc.trim())) f.errors.cvc = "Your card's security code is incomplete.";
  if (!f.name.trim()) f.errors.name = "Enter the name on the card.";
  if (!card || typeof exp === "string" || Object.keys(f.errors).length > 0) return null;
  return { card, exp, name: f.name.trim() };
}

export function payPage(fake: Fake, method: string, id: string, body: string): PageResult {
  let s: CheckoutSession;
  try {
    s = freshSession(fake, id);
  } catch {
    return { status: 404, html: "<!doctype html><title>Not found</title><p>No such checkout session.</p>" };
  }
  const blank: FormState = { number: "", expiry: "", cvc: "", name: "", errors: {}, alert: null };
  if (method !== "POST" || s.status !== "open") return { status: 200, html: page(fake, s, blank) };
  const form = new Params(parseForm(body));
  const f: FormState = {
    ...blank,
    number: form.str("number") ?? "",
    expiry: form.str("expiry") ?? "",
    cvc: form.str("cvc") ?? "",
    name: form.str("name") ?? "",
  };
  const input = check(fake, f);
  if (!input) return { status: 422, html: page(fake, s, f) };
  const outcome = completeSession(fake, s, input);
  if (!outcome.ok) return { status: 402, html: page(fake, s, { ...f, cvc: "", alert: outcome.error.message }) };
  return { status: 303, location: (s.success_url ?? "/").replace("{CHECKOUT_SESSION_ID}", s.id) };
}
