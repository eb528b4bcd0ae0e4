// The stand-in's card form: what it checks before asking the card network, and every sentence it
// shows, in Rosinwood's own words. Only the API behind it follows Stripe's shapes and error codes.
import { findTestCard, luhnOk } from "./objects/cards";
import type { CardInput } from "./objects/checkout-complete";
import type { CardError } from "./types";

export type CardField = "number" | "expiry" | "cvc" | "name";

export interface CardFormState {
  number: string;
  expiry: string;
  cvc: string;
  name: string;
  errors: Partial<Record<CardField, string>>;
  alert: string | null;
}

export const blankCardForm = (): CardFormState => ({
  number: "",
  expiry: "",
  cvc: "",
  name: "",
  errors: {},
  alert: null,
});

// Card numbers run from 12 to 19 digits (ISO/IEC 7812-1).
const SHORTEST = 12;
const LONGEST = 19;

function numberProblem(digits: string): string | null {
  if (!digits) return "Type the number printed on the card.";
  if (!/^\d+$/.test(digits)) return "A card number has only digits (spaces between groups are fine).";
  if (digits.length < SHORTEST) return "That card number is too short.";
  if (digits.length > LONGEST) return "That card number is too long.";
  if (!luhnOk(digits)) return "That card number has a typo somewhere: its last digit does not check out.";
  if (!findTestCard(digits)) return "This stand-in takes only the test cards listed at the foot of the page.";
  return null;
}

/** The expiry as month and year, or the sentence that says what is wrong with it. */
export function readExpiry(text: string, nowSeconds: number): { month: number; year: number } | string {
  const m = /^\s*(\d{1,2})\s*\/\s*(\d{2}|\d{4})\s*$/.exec(text);
  if (!m) return "Write the expiry date as month / year, for example 08 / 29.";
  const month = Number(m[1]);
  const year = m[2]?.length === 2 ? 2000 + Number(m[2]) : Number(m[2]);
  if (month < 1 || month > 12) return `There is no month ${month}: use 01 to 12.`;
  const today = new Date(nowSeconds * 1000);
  // A card is good to the end of its expiry month (common practice).
  if (year < today.getUTCFullYear() || (year === today.getUTCFullYear() && month < today.getUTCMonth() + 1)) {
    return "That card has expired.";
  }
  return { month, year };
}

/** Checks every field, writing a sentence beside each one that is wrong; the card details when all are right. */
export function checkCardForm(f: CardFormState, nowSeconds: number): CardInput | null {
  const digits = f.number.replace(/[\s-]/g, "");
  const number = numberProblem(digits);
  if (number) f.errors.number = number;
  const card = number ? undefined : findTestCard(digits);
  const exp = readExpiry(f.expiry, nowSeconds);
  if (typeof exp === "string") f.errors.expiry = exp;
  // American Express prints four digits on the front; the others three on the back (common practice).
  const cvcLength = card?.brand === "amex" ? 4 : 3;
  if (!new RegExp(`^\\d{${cvcLength}}$`).test(f.cvc.trim()))
    f.errors.cvc = `The security code is ${cvcLength} digits: ${cvcLength === 4 ? "on the front" : "on the back"} of the card.`;
  if (!f.name.trim()) f.errors.name = "Type the name as it is printed on the card.";
  if (!card || typeof exp === "string" || Object.keys(f.errors).length > 0) return null;
  return { card, exp, name: f.name.trim() };
}

/** What the page says when the network turns a card down, by Stripe's decline code. */
export function declineWords(error: Pick<CardError, "code" | "decline_code">): string {
  switch (error.decline_code || error.code) {
    case "insufficient_funds":
      return "That card does not have enough money on it for this payment. Try another card.";
    case "expired_card":
      return "That card has expired. Try another card.";
    case "incorrect_cvc":
      return "That security code does not match the card. Check the code and try again.";
    default:
      return "That card was turned down by its bank. Try another card.";
  }
}
