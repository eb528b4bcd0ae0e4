// Money is held as integer minor units with an ISO 4217 code; Intl knows each currency's number of
// minor digits (ISO 4217: GBP, EUR and USD have two), so the amount is scaled by what it reports.
export const CURRENCIES = ["GBP", "EUR", "USD"] as const;
export type Currency = (typeof CURRENCIES)[number];

export function formatMoney(minor: number, currency: string): string {
  const fmt = new Intl.NumberFormat("en-GB", { style: "currency", currency: currency.toUpperCase() });
  const digits = fmt.resolvedOptions().maximumFractionDigits ?? 2;
  return fmt.format(minor / 10 ** digits);
}

export function formatDay(date: Date, timeZone = "Europe/London"): string {
  return new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone }).format(date);
}

export const intervalWord = (interval: "month" | "year"): string => (interval === "month" ? "a month" : "a year");
