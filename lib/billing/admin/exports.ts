// The CSV files behind each admin table's "Export CSV": the same filters and order as the table,
// every matching row (no paging), money as decimals beside its currency.
import type { Tx as Db } from "@/db/queries/auth";
import { enrolmentsBatch, membershipsBatch } from "@/db/queries/admin-members";
import { paymentsBatch } from "@/db/queries/admin-payments";
import { csvResponse, decimalOf, keysetRows, safeText, stamp, type CsvColumn } from "./csv";
import type { EnrolmentsQuery, MembershipsQuery, PaymentsQuery } from "./params";

type PaymentCsvRow = Awaited<ReturnType<typeof paymentsBatch>>[number];
type MembershipCsvRow = Awaited<ReturnType<typeof membershipsBatch>>[number];
type EnrolmentCsvRow = Awaited<ReturnType<typeof enrolmentsBatch>>[number];

const iso = (d: Date | null) => (d ? d.toISOString() : "");

export const PAYMENT_CSV: CsvColumn<PaymentCsvRow>[] = [
  { header: "Date", value: (r) => iso(r.createdAt) },
  { header: "Receipt", value: (r) => safeText(r.receiptNumber) },
  { header: "Name", value: (r) => safeText(r.name) },
  { header: "E-mail", value: (r) => safeText(r.email) },
  { header: "Plan", value: (r) => safeText(r.plan) },
  { header: "Kind", value: (r) => r.kind },
  { header: "Status", value: (r) => r.status },
  { header: "Amount", value: (r) => decimalOf(r.amount, r.currency) },
  { header: "Refunded", value: (r) => decimalOf(r.refundedAmount, r.currency) },
  { header: "Currency", value: (r) => r.currency },
  { header: "Failure", value: (r) => safeText(r.failureMessage) },
  { header: "Payment id", value: (r) => r.id },
];

export const MEMBERSHIP_CSV: CsvColumn<MembershipCsvRow>[] = [
  { header: "Started", value: (r) => iso(r.startedAt) },
  { header: "Name", value: (r) => safeText(r.name) },
  { header: "E-mail", value: (r) => safeText(r.email) },
  { header: "Plan", value: (r) => safeText(r.plan) },
  { header: "Price", value: (r) => decimalOf(r.amount, r.currency) },
  { header: "Currency", value: (r) => r.currency },
  { header: "Interval", value: (r) => r.interval },
  { header: "Status", value: (r) => r.status },
  { header: "Period end", value: (r) => iso(r.currentPeriodEnd) },
  { header: "Cancels at period end", value: (r) => (r.cancelAtPeriodEnd ? "yes" : "no") },
  { header: "Grace until", value: (r) => iso(r.graceUntil) },
  { header: "Ended", value: (r) => iso(r.endedAt) },
  { header: "Membership id", value: (r) => r.id },
];

export const ENROLMENT_CSV: CsvColumn<EnrolmentCsvRow>[] = [
  { header: "Enrolled", value: (r) => iso(r.enrolledAt) },
  { header: "Name", value: (r) => safeText(r.name) },
  { header: "E-mail", value: (r) => safeText(r.email) },
  { header: "Course", value: (r) => safeText(r.course) },
  { header: "Status", value: (r) => r.status },
  { header: "Membership", value: (r) => r.membership ?? "none" },
  { header: "Plan", value: (r) => safeText(r.plan) },
  { header: "Ended", value: (r) => iso(r.endedAt) },
  { header: "Teacher", value: (r) => safeText(r.teacher) },
  { header: "Enrolment id", value: (r) => r.id },
];

export const paymentsCsv = (db: Db, q: PaymentsQuery) =>
  csvResponse(
    `payments-${stamp()}.csv`,
    keysetRows((c, n) => paymentsBatch(db, q, c, n)),
    PAYMENT_CSV,
  );
export const membershipsCsv = (db: Db, q: MembershipsQuery) =>
  csvResponse(
    `memberships-${stamp()}.csv`,
    keysetRows((c, n) => membershipsBatch(db, q, c, n)),
    MEMBERSHIP_CSV,
  );
export const enrolmentsCsv = (db: Db, q: EnrolmentsQuery) =>
  csvResponse(
    `enrolments-${stamp()}.csv`,
    keysetRows((c, n) => enrolmentsBatch(db, q, c, n)),
    ENROLMENT_CSV,
  );
