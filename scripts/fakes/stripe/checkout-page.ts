// The stand-in's card page, /pay/<session id>: plain server-rendered HTML that takes the place of the
// provider's hosted payment page while Rosinwood runs locally. Its words and look are the project's own
// (card-form.ts); a person types a test card and the form posts back here.
import { money, type Fake } from "./context";
import { blankCardForm, checkCardForm, declineWords, type CardField, type CardFormState } from "./card-form";
import { completeSession } from "./objects/checkout-complete";
import { freshSession } from "./objects/checkout";
import { Params, parseForm } from "./params";
import type { CheckoutSession } from "./types";

export interface PageResult {
  status: number;
  html?: string;
  location?: string;
}

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function paying(fake: Fake, s: CheckoutSession): string {
  if (s.mode === "setup")
    return "<p>Keep a card on file for the next renewals. Nothing is taken now unless a payment is overdue.</p>";
  const rows = s.line_items.map((li) => {
    const price = fake.store.get("price", li.price);
    const name = fake.store.find("product", price.product)?.name ?? price.id;
    const every = price.recurring
      ? `, then every ${price.recurring.interval_count > 1 ? `${price.recurring.interval_count} ${price.recurring.interval}s` : price.recurring.interval}`
      : "";
    return `<li>${esc(name)}: ${esc(money(price.unit_amount * li.quantity, price.currency))}${esc(every)}</li>`;
  });
  return `<h2>What this pays for</h2><ul class="items">${rows.join("")}</ul>
<p class="now">Taken from the card now: <strong>${esc(money(s.amount_total ?? 0, s.currency ?? "gbp"))}</strong></p>`;
}

function field(id: CardField, label: string, value: string, f: CardFormState, extra: string): string {
  const err = f.errors[id];
  return `<p class="field"><label for="${id}">${label}</label>
<input id="${id}" name="${id}" value="${esc(value)}" ${extra}${err ? ` aria-invalid="true" aria-describedby="${id}-error"` : ""}>
${err ? `<span class="error" id="${id}-error">${esc(err)}</span>` : ""}</p>`;
}

function form(fake: Fake, s: CheckoutSession, f: CardFormState): string {
  const button =
    s.mode === "setup" ? "Keep this card" : `Pay ${esc(money(s.amount_total ?? 0, s.currency ?? "gbp"))} now`;
  return `${paying(fake, s)}
${f.alert ? `<p role="alert" class="alert">${esc(f.alert)}</p>` : ""}
<form method="post" action="/pay/${esc(s.id)}" novalidate>
${field("number", "Card number", f.number, f, 'inputmode="numeric" autocomplete="cc-number" placeholder="e.g. 4242 4242 4242 4242"')}
${field("expiry", "Expiry date (month / year)", f.expiry, f, 'autocomplete="cc-exp" placeholder="08 / 29"')}
${field("cvc", "Security code (CVC)", f.cvc, f, 'inputmode="numeric" autocomplete="cc-csc" placeholder="3 digits"')}
${field("name", "Name on card", f.name, f, 'autocomplete="cc-name" placeholder="as printed on the card"')}
<button type="submit">${button}</button>
</form>`;
}

function page(fake: Fake, s: CheckoutSession, f: CardFormState): string {
  const body =
    s.status === "open"
      ? form(fake, s, f)
      : `<p role="status">${s.status === "complete" ? "This payment has already gone through." : "This payment page has timed out. Go back to the school and start again."}</p>`;
  const leave = s.cancel_url ? `<p><a href="${esc(s.cancel_url)}">Leave without paying</a></p>` : "";
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Local payment stand-in</title><style>
body{font-family:Georgia,serif;background:#fffdf8;color:#1d1d1d;margin:0;padding:1.5rem 1rem;line-height:1.45}
main{max-width:30rem;margin:0 auto}h1{font-size:1.5rem;margin:0 0 .5rem}h2{font-size:1.05rem;margin:1.25rem 0 .25rem}
.note{border-left:4px solid #556b2f;padding:.25rem .75rem;margin:0 0 1rem}
.field{margin:.9rem 0 0;display:flex;flex-direction:column;gap:.25rem}label{font-weight:bold}
input{font:inherit;padding:.5rem;border:2px solid #555;border-radius:0;max-width:100%;box-sizing:border-box}
.error{color:#8b0000}.alert{border:2px solid #8b0000;color:#8b0000;padding:.5rem .75rem}
button{font:inherit;font-weight:bold;margin-top:1.25rem;padding:.6rem 1.2rem;background:#556b2f;color:#fff;border:0;cursor:pointer}
</style></head><body><main>
<h1>Local payment stand-in</h1>
<p class="note">This page is part of Rosinwood's own development set-up. It takes the place of the payment
provider's card page while the school runs on this machine: no card is charged and no money moves.</p>
${body}${leave}
<h2>Test cards it knows</h2><ul>
<li>4242 4242 4242 4242: paid</li><li>4000 0000 0000 0002: turned down</li>
<li>4000 0000 0000 9995: turned down, not enough money</li><li>4000 0000 0000 0341: kept on file, but later payments fail</li>
</ul><p>Use any expiry date still to come and any three digits as the security code.
The numbers are the provider's published test cards.</p>
</main></body></html>`;
}

export function payPage(fake: Fake, method: string, id: string, body: string): PageResult {
  let s: CheckoutSession;
  try {
    s = freshSession(fake, id);
  } catch {
    return {
      status: 404,
      html: "<!doctype html><title>Not found</title><p>There is no payment with that address.</p>",
    };
  }
  if (method !== "POST" || s.status !== "open") return { status: 200, html: page(fake, s, blankCardForm()) };
  const form = new Params(parseForm(body));
  const f: CardFormState = {
    ...blankCardForm(),
    number: form.str("number") ?? "",
    expiry: form.str("expiry") ?? "",
    cvc: form.str("cvc") ?? "",
    name: form.str("name") ?? "",
  };
  const input = checkCardForm(f, fake.clock.now());
  if (!input) return { status: 422, html: page(fake, s, f) };
  const outcome = completeSession(fake, s, input);
  if (!outcome.ok) return { status: 402, html: page(fake, s, { ...f, cvc: "", alert: declineWords(outcome.error) }) };
  return { status: 303, location: (s.success_url ?? "/").replace("{CHECKOUT_SESSION_ID}", s.id) };
}
