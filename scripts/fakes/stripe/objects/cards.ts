// Stripe's published test cards (Stripe docs: "Testing" — cards by brand, declined payments) and what
// each does here. A stored PaymentMethod keeps only the last four digits, as Stripe's does, and those
// are distinct across this table, so behaviour is looked up by them (imported demo cards too).
import type { Fake } from "../context";
import { newId } from "../state";
import type { CardError, Charge, PaymentIntent, PaymentMethod } from "../types";

type Behaviour = "succeeds" | "declined" | "charge_fails";

interface TestCard {
  number: string;
  brand: string;
  funding: string;
  behaviour: Behaviour;
  error?: CardError;
}

const DECLINED: CardError = {
  code: "card_declined",
  decline_code: "generic_decline",
  message: "Your card was declined.",
};

export const TEST_CARDS: TestCard[] = [
  { number: "4242424242424242", brand: "visa", funding: "credit", behaviour: "succeeds" },
  { number: "4000056655665556", brand: "visa", funding: "debit", behaviour: "succeeds" },
  { number: "5555555555554444", brand: "mastercard", funding: "credit", behaviour: "succeeds" },
  { number: "378282246310005", brand: "amex", funding: "credit", behaviour: "succeeds" },
  { number: "4000000000000002", brand: "visa", funding: "credit", behaviour: "declined", error: DECLINED },
  {
    number: "4000000000009995",
    brand: "visa",
    funding: "credit",
    behaviour: "declined",
    error: { code: "card_declined", decline_code: "insufficient_funds", message: "Your card has insufficient funds." },
  },
  {
    number: "4000000000000069",
    brand: "visa",
    funding: "credit",
    behaviour: "declined",
    error: { code: "expired_card", decline_code: "expired_card", message: "Your card has expired." },
  },
  {
    number: "4000000000000127",
    brand: "visa",
    funding: "credit",
    behaviour: "declined",
    error: { code: "incorrect_cvc", decline_code: "incorrect_cvc", message: "Your card's security code is incorrect." },
  },
  // "Attaching this card to a Customer object succeeds, but attempts to charge the customer fail."
  { number: "4000000000000341", brand: "visa", funding: "credit", behaviour: "charge_fails", error: DECLINED },
];

/** Luhn check (ISO/IEC 7812-1), the check every card form makes before asking the network. */
export function luhnOk(digits: string): boolean {
  let sum = 0;
  for (let i = 0; i < digits.length; i++) {
    let d = Number(digits[digits.length - 1 - i]);
    if (i % 2 === 1) d = d * 2 > 9 ? d * 2 - 9 : d * 2;
    sum += d;
  }
  return digits.length >= 12 && sum % 10 === 0;
}

export function findTestCard(number: string): TestCard | undefined {
  return TEST_CARDS.find((c) => c.number === number);
}

function byLast4(last4: string): TestCard | undefined {
  return TEST_CARDS.find((c) => c.number.endsWith(last4));
}

/** A card that cannot even be saved (checked when Checkout confirms, in either mode). */
export function attachError(card: TestCard): CardError | null {
  return card.behaviour === "declined" ? (card.error ?? DECLINED) : null;
}

export function createPaymentMethod(
  fake: Fake,
  card: TestCard,
  exp: { month: number; year: number },
  name: string,
  customer: string | null,
): PaymentMethod {
  return fake.store.put<PaymentMethod>({
    id: newId("pm"),
    object: "payment_method",
    created: fake.clock.now(),
    customer,
    type: "card",
    card: {
      brand: card.brand,
      last4: card.number.slice(-4),
      exp_month: exp.month,
      exp_year: exp.year,
      funding: card.funding,
      country: "GB",
    },
    billing_details: { name, email: null },
    metadata: {},
  });
}

function receiptNumber(fake: Fake): string {
  const n = fake.store.nextNumber();
  return `${1000 + (n % 9000)}-${String(n).padStart(4, "0").slice(-4)}`;
}

export interface ChargeResult {
  intent: PaymentIntent;
  charge: Charge;
  error: CardError | null;
}

/** One payment attempt: a PaymentIntent and its Charge, succeeded or failed by the card's behaviour. */
export function chargeCard(
  fake: Fake,
  args: {
    amount: number;
    currency: string;
    customer: string | null;
    paymentMethod: PaymentMethod | undefined;
    description: string;
  },
): ChargeResult {
  const now = fake.clock.now();
  const pm = args.paymentMethod;
  const card = pm ? byLast4(pm.card.last4) : undefined;
  const error: CardError | null = !pm
    ? {
        code: "payment_method_missing",
        decline_code: "",
        message: "The customer has no attached payment source or default payment method.",
      }
    : card && card.behaviour !== "succeeds"
      ? (card.error ?? DECLINED)
      : null;
  const intentId = newId("pi");
  const charge = fake.store.put<Charge>({
    id: newId("ch"),
    object: "charge",
    created: now,
    amount: args.amount,
    amount_captured: error ? 0 : args.amount,
    amount_refunded: 0,
    currency: args.currency,
    customer: args.customer,
    description: args.description,
    paid: !error,
    captured: !error,
    refunded: false,
    status: error ? "failed" : "succeeded",
    failure_code: error?.code ?? null,
    failure_message: error?.message ?? null,
    outcome: error
      ? {
          type: "issuer_declined",
          seller_message: "The bank did not return any further details with this decline.",
          reason: error.decline_code,
          network_status: "declined_by_network",
        }
      : {
          type: "authorized",
          seller_message: "Payment complete.",
          reason: null,
          network_status: "approved_by_network",
        },
    payment_intent: intentId,
    payment_method: pm?.id ?? null,
    receipt_number: error ? null : receiptNumber(fake),
    payment_method_details: pm
      ? {
          type: "card",
          card: {
            brand: pm.card.brand,
            last4: pm.card.last4,
            exp_month: pm.card.exp_month,
            exp_year: pm.card.exp_year,
          },
        }
      : null,
    metadata: {},
  });
  const intent = fake.store.put<PaymentIntent>({
    id: intentId,
    object: "payment_intent",
    created: now,
    amount: args.amount,
    amount_received: error ? 0 : args.amount,
    currency: args.currency,
    customer: args.customer,
    payment_method: pm?.id ?? null,
    latest_charge: charge.id,
    description: args.description,
    status: error ? "requires_payment_method" : "succeeded",
    metadata: {},
    last_payment_error: error ? { type: "card_error", ...error } : null,
  });
  return { intent, charge, error };
}
