// Refunds, charges and payment intents (Stripe API reference: "Refunds", "Charges", "PaymentIntents").
// A refund names a charge or a payment intent; its amount defaults to what is left unrefunded, and
// asking for more than that is refused as Stripe refuses it (400, amount_too_large; a charge refunded
// in full answers charge_already_refunded). Each refund sends charge.refunded and refund.created.
import { money, type Handler } from "../context";
import { invalidParam, requestError } from "../errors";
import { expand, paginate } from "../expand";
import { listOf, render } from "../render";
import { newId } from "../state";
import type { Charge, Refund } from "../types";

const REASONS = ["duplicate", "fraudulent", "requested_by_customer"] as const;

function chargeFor(
  fake: Parameters<Handler>[0]["fake"],
  chargeId: string | undefined,
  intentId: string | undefined,
): Charge {
  if (chargeId) return fake.store.get("charge", chargeId, "charge");
  const pi = fake.store.get("payment_intent", intentId ?? "", "payment_intent");
  const ch = pi.latest_charge ? fake.store.find("charge", pi.latest_charge) : undefined;
  if (!ch || pi.status !== "succeeded") {
    throw requestError(
      `This PaymentIntent (${pi.id}) does not have a successful charge to refund.`,
      "charge_not_refundable",
      "payment_intent",
    );
  }
  return ch;
}

const createRefund: Handler = ({ fake, params }) => {
  const chargeId = params.str("charge");
  const intentId = params.str("payment_intent");
  if (!chargeId && !intentId) {
    throw requestError(
      "One of the following params should be provided for this request: charge or payment_intent.",
      "parameter_missing",
      "charge",
    );
  }
  const charge = chargeFor(fake, chargeId, intentId);
  if (intentId && charge.payment_intent !== intentId)
    throw invalidParam("payment_intent", `The charge ${charge.id} does not belong to ${intentId}.`);
  if (charge.status !== "succeeded")
    throw requestError(
      `Charge ${charge.id} has not succeeded, so it cannot be refunded.`,
      "charge_not_refundable",
      "charge",
    );
  const remaining = charge.amount - charge.amount_refunded;
  if (remaining <= 0)
    throw requestError(`Charge ${charge.id} has already been refunded.`, "charge_already_refunded", "charge");
  const amount = params.int("amount") ?? remaining;
  if (amount < 1) throw invalidParam("amount", "Invalid positive integer", "parameter_invalid_integer");
  if (amount > remaining) {
    throw requestError(
      `Refund amount (${money(amount, charge.currency)}) is greater than unrefunded amount on charge (${money(remaining, charge.currency)})`,
      "amount_too_large",
      "amount",
    );
  }
  const refund = fake.store.put<Refund>({
    id: newId("re"),
    object: "refund",
    created: fake.clock.now(),
    amount,
    currency: charge.currency,
    charge: charge.id,
    payment_intent: charge.payment_intent,
    reason: params.oneOf("reason", REASONS) ?? null,
    status: "succeeded",
    metadata: params.metadata(),
    receipt_number: null,
  });
  const before = { amount_refunded: charge.amount_refunded, refunded: charge.refunded };
  charge.amount_refunded += amount;
  charge.refunded = charge.amount_refunded === charge.amount;
  fake.hooks.emit("charge.refunded", charge, before);
  fake.hooks.emit("refund.created", refund);
  return expand(fake.store, render(fake.store, refund), params);
};

const getRefund: Handler = ({ fake, params, ids }) =>
  expand(fake.store, render(fake.store, fake.store.get("refund", ids[0] ?? "")), params);

const listRefunds: Handler = ({ fake, params }) => {
  const charge = params.str("charge");
  const intent = params.str("payment_intent");
  const page = paginate(
    fake.store
      .all("refund")
      .filter((r) => (!charge || r.charge === charge) && (!intent || r.payment_intent === intent)),
    params,
  );
  return expand(
    fake.store,
    listOf(
      "/v1/refunds",
      page.data.map((r) => render(fake.store, r)),
      page.hasMore,
    ),
    params,
  );
};

const getCharge: Handler = ({ fake, params, ids }) =>
  expand(fake.store, render(fake.store, fake.store.get("charge", ids[0] ?? "")), params);

const listCharges: Handler = ({ fake, params }) => {
  const customer = params.str("customer");
  const intent = params.str("payment_intent");
  const page = paginate(
    fake.store
      .all("charge")
      .filter((c) => (!customer || c.customer === customer) && (!intent || c.payment_intent === intent)),
    params,
  );
  return expand(
    fake.store,
    listOf(
      "/v1/charges",
      page.data.map((c) => render(fake.store, c)),
      page.hasMore,
    ),
    params,
  );
};

const getIntent: Handler = ({ fake, params, ids }) =>
  expand(fake.store, render(fake.store, fake.store.get("payment_intent", ids[0] ?? "")), params);

export function moneyRoutes(): Array<[string, RegExp, Handler]> {
  return [
    ["POST", /^\/v1\/refunds$/, createRefund],
    ["GET", /^\/v1\/refunds$/, listRefunds],
    ["GET", /^\/v1\/refunds\/([^/]+)$/, getRefund],
    ["GET", /^\/v1\/charges$/, listCharges],
    ["GET", /^\/v1\/charges\/([^/]+)$/, getCharge],
    ["GET", /^\/v1\/payment_intents\/([^/]+)$/, getIntent],
  ];
}
