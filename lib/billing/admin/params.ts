// The admin money tables' query parameters. The same parameters drive the table
// route, its CSV export and the page's URL, so a reload or an export shows exactly what was filtered.
// Unknown parameters and values are refused with 422 naming the parameter, never ignored: a typo in a
// filter must not silently widen what an admin exports.
import { z } from "zod";
import { unprocessable } from "@/lib/auth/errors";
import { day as sharedDay } from "@/lib/validation/text";
import { enrolmentStatusEnum, paymentStatusEnum, subscriptionStatusEnum } from "@/db/schema";
import { PAYMENT_SORTS, type PaymentsQuery } from "@/db/queries/admin-payments";
import {
  ENROLMENT_SORTS,
  MEMBERSHIP_SORTS,
  type EnrolmentsQuery,
  type MembershipsQuery,
} from "@/db/queries/admin-members";

export const PAGE_SIZE_MAX = 100;
export const PAGE_SIZE_DEFAULT = 25;

// Years 1900–2999 (lib/validation/text.ts): a year 0000 reaches PostgreSQL as an error, not an empty table.
const day = sharedDay();
const common = {
  plan: z.uuid({ error: "must be a plan id" }).optional(),
  from: day.optional(),
  to: day.optional(),
  // A name or address fragment: line breaks and other control characters never occur in either.
  q: z
    .string()
    .trim()
    .max(100, "must be at most 100 characters")
    .regex(/^\P{Cc}*$/u, "must not contain line breaks or other control characters")
    .optional(),
  dir: z.enum(["asc", "desc"], { error: "must be asc or desc" }).default("desc"),
  page: z.coerce
    .number({ error: "must be a whole number from 1" })
    .int("must be a whole number from 1")
    .min(1, "must be a whole number from 1")
    .default(1),
  pageSize: z.coerce
    .number({ error: `must be a whole number from 1 to ${PAGE_SIZE_MAX}` })
    .int(`must be a whole number from 1 to ${PAGE_SIZE_MAX}`)
    .min(1, `must be a whole number from 1 to ${PAGE_SIZE_MAX}`)
    .max(PAGE_SIZE_MAX, `must be a whole number from 1 to ${PAGE_SIZE_MAX}`)
    .default(PAGE_SIZE_DEFAULT),
};
const oneOf = <T extends readonly [string, ...string[]]>(values: T) =>
  z.enum(values, { error: `must be one of: ${values.join(", ")}` });

const inRange = (v: { from?: string; to?: string }) => !v.from || !v.to || v.from <= v.to;
const rangeError = { message: "must not be before from", path: ["to"] };

export const paymentsQuery = z
  .strictObject({
    ...common,
    status: oneOf(paymentStatusEnum.enumValues).optional(),
    sort: oneOf(PAYMENT_SORTS).default("date"),
  })
  .refine(inRange, rangeError);
export const membershipsQuery = z
  .strictObject({
    ...common,
    status: oneOf(subscriptionStatusEnum.enumValues).optional(),
    sort: oneOf(MEMBERSHIP_SORTS).default("date"),
  })
  .refine(inRange, rangeError);
export const enrolmentsQuery = z
  .strictObject({
    ...common,
    status: oneOf(enrolmentStatusEnum.enumValues).optional(),
    course: z.uuid({ error: "must be a course id" }).optional(),
    sort: oneOf(ENROLMENT_SORTS).default("date"),
  })
  .refine(inRange, rangeError);

export type { EnrolmentsQuery, MembershipsQuery, PaymentsQuery };
export type ListQuery = PaymentsQuery | MembershipsQuery | EnrolmentsQuery;

/** What the guard hands over: every query parameter as given (checked below, with 422s). */
export const rawQuery = z.record(z.string(), z.union([z.string(), z.array(z.string())]));

/** Parses the query or throws 422 with each bad parameter named; empty values count as absent. */
export function parseQuery<S extends z.ZodType>(schema: S, raw: Record<string, unknown>): z.output<S> {
  const present = Object.fromEntries(Object.entries(raw).filter(([, v]) => v !== "" && v !== undefined));
  const parsed = schema.safeParse(present);
  if (parsed.success) return parsed.data;
  const fields: Record<string, string> = {};
  for (const issue of parsed.error.issues) {
    if (issue.code === "unrecognized_keys")
      for (const k of issue.keys) fields[k] ??= "is not a parameter of this table";
    else fields[String(issue.path[0] ?? "query")] ??= issue.message;
  }
  const named = Object.entries(fields).map(([k, m]) => `${k} ${m}`);
  throw unprocessable(`The table's parameters are not valid: ${named.join("; ")}.`, fields);
}

/** A JSON body as the guard hands it over (checked by the route with 422s). */
export const rawBody = z.record(z.string(), z.unknown());
