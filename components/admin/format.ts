// Money and dates on the admin pages: integer minor units shown through Intl.NumberFormat.
import { formatMoney } from "@/lib/billing/money";

export const money = (minor: number, currency: string) => formatMoney(minor, currency);

/** The currency's minor digits as Intl reports them (ISO 4217: GBP 2). */
export function minorDigits(currency: string): number {
  return new Intl.NumberFormat("en-GB", { style: "currency", currency }).resolvedOptions().maximumFractionDigits ?? 2;
}

/** "9.50" → 950 (GBP); null when it is not a plain amount with at most the currency's decimals. */
export function parseMajor(text: string, currency: string): number | null {
  const digits = minorDigits(currency);
  const m = text.trim().match(digits > 0 ? new RegExp(`^(\\d+)(?:\\.(\\d{1,${digits}}))?$`) : /^(\d+)$/);
  if (!m) return null;
  return Number(m[1]) * 10 ** digits + Number((m[2] ?? "").padEnd(digits, "0") || 0);
}

export const toMajor = (minor: number, currency: string) =>
  (minor / 10 ** minorDigits(currency)).toFixed(minorDigits(currency));

export const day = (iso: string | null) =>
  iso
    ? new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" }).format(
        new Date(iso),
      )
    : "—";

export const words = (s: string) => s.replaceAll("_", " ");
