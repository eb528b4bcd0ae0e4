// The payment stand-in's card form (scripts/fakes/stripe/card-form.ts): each wrong field gets its own
// sentence, in the project's words; test card numbers are Stripe's published ones (Stripe docs: "Testing").
import { describe, expect, it } from "vitest";
import { blankCardForm, checkCardForm, declineWords, readExpiry } from "@/scripts/fakes/stripe/card-form";

const NOW = Date.UTC(2026, 5, 15) / 1000; // 15 June 2026

function errorsFor(fields: Partial<Record<"number" | "expiry" | "cvc" | "name", string>>) {
  const f = {
    ...blankCardForm(),
    number: "4242 4242 4242 4242",
    expiry: "12 / 34",
    cvc: "123",
    name: "Ada",
    ...fields,
  };
  const input = checkCardForm(f, NOW);
  return { input, errors: f.errors };
}

describe("the stand-in's card form", () => {
  it("takes a good test card and gives its details, with no sentence beside any field", () => {
    const { input, errors } = errorsFor({});
    expect(errors).toEqual({});
    expect(input?.card.number).toBe("4242424242424242");
    expect(input?.exp).toEqual({ month: 12, year: 2034 });
    expect(input?.name).toBe("Ada");
  });

  it.each([
    ["", "Type the number printed on the card."],
    ["4242 4242", "That card number is too short."],
    ["4242 4242 4242 4242 4242", "That card number is too long."],
    ["4242-4242-abcd-4242", "A card number has only digits (spaces between groups are fine)."],
    ["4242 4242 4242 4241", "That card number has a typo somewhere: its last digit does not check out."],
    // 4111 1111 1111 1111 passes the Luhn check (ISO/IEC 7812-1) but is not in the stand-in's table.
    ["4111 1111 1111 1111", "This stand-in takes only the test cards listed at the foot of the page."],
  ])("card number %j: %s", (number, sentence) => {
    const { input, errors } = errorsFor({ number });
    expect(input).toBeNull();
    expect(errors.number).toBe(sentence);
  });

  it("says what is wrong with the expiry date, and that a card from last month has expired", () => {
    expect(readExpiry("1234", NOW)).toBe("Write the expiry date as month / year, for example 08 / 29.");
    expect(readExpiry("13/30", NOW)).toBe("There is no month 13: use 01 to 12.");
    expect(readExpiry("05/26", NOW)).toBe("That card has expired.");
    expect(readExpiry("06/26", NOW)).toEqual({ month: 6, year: 2026 }); // good to the end of its month
    expect(readExpiry("7 / 2031", NOW)).toEqual({ month: 7, year: 2031 });
    expect(errorsFor({ expiry: "01/20" }).errors.expiry).toBe("That card has expired.");
  });

  it("asks for three digits of security code, or four on an American Express card", () => {
    expect(errorsFor({ cvc: "12" }).errors.cvc).toBe("The security code is 3 digits: on the back of the card.");
    const amex = errorsFor({ number: "3782 822463 10005", cvc: "123" });
    expect(amex.errors.cvc).toBe("The security code is 4 digits: on the front of the card.");
    expect(errorsFor({ number: "3782 822463 10005", cvc: "1234" }).errors).toEqual({});
  });

  it("asks for the name on the card, and reports every wrong field at once", () => {
    const { errors } = errorsFor({ number: "", expiry: "", cvc: "", name: "  " });
    expect(Object.keys(errors).sort()).toEqual(["cvc", "expiry", "name", "number"]);
    expect(errors.name).toBe("Type the name as it is printed on the card.");
  });

  it("turns Stripe's decline codes into its own sentences", () => {
    expect(declineWords({ code: "card_declined", decline_code: "generic_decline" })).toBe(
      "That card was turned down by its bank. Try another card.",
    );
    expect(declineWords({ code: "card_declined", decline_code: "insufficient_funds" })).toMatch(
      /^That card does not have enough money on it/,
    );
    expect(declineWords({ code: "expired_card", decline_code: "expired_card" })).toBe(
      "That card has expired. Try another card.",
    );
    expect(declineWords({ code: "incorrect_cvc", decline_code: "" })).toMatch(/^That security code does not match/);
  });
});
