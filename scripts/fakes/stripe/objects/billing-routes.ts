// Subscriptions and invoices (Stripe API reference: "Subscriptions", "Invoices"): retrieve, list, update
// (cancel at period end and resume, plan change with prorations, default card), cancel now; invoice
// lines, paying an open invoice, and invoices.createPreview (POST /v1/invoices/create_preview, the
// SDK 23 name for what was the "upcoming invoice").
import type { Handler } from "../context";
import { cardError, notFound, requestError } from "../errors";
import { expand, paginate } from "../expand";
import { line, listOf, render } from "../render";
import { newId } from "../state";
import type { Invoice } from "../types";
import { createInvoice, draftInvoice, payInvoice } from "./invoices-engine";
import { cancelNow, currentPeriod, invoiceOutcome, updateSubscription } from "./lifecycle";
import { planChange, previewLines, readItemChanges, type ProrationBehavior } from "./proration";

const BEHAVIORS = ["create_prorations", "always_invoice", "none"] as const;
const STATUSES = [
  "active",
  "past_due",
  "unpaid",
  "canceled",
  "incomplete",
  "incomplete_expired",
  "trialing",
  "paused",
  "all",
  "ended",
] as const;

const getSub: Handler = ({ fake, params, ids }) =>
  expand(fake.store, render(fake.store, fake.store.get("subscription", ids[0] ?? "")), params);

const listSubs: Handler = ({ fake, params }) => {
  const customer = params.str("customer");
  const price = params.str("price");
  const status = params.oneOf("status", STATUSES);
  const all = fake.store.all("subscription").filter(
    (s) =>
      (!customer || s.customer === customer) &&
      (!price || s.items.some((i) => i.price === price)) &&
      // Without status, Stripe lists every subscription that is not canceled.
      (status === "all" ||
        (status === undefined
          ? s.status !== "canceled"
          : status === "ended"
            ? s.status === "canceled"
            : s.status === status)),
  );
  const page = paginate(all, params);
  return expand(
    fake.store,
    listOf(
      "/v1/subscriptions",
      page.data.map((s) => render(fake.store, s)),
      page.hasMore,
    ),
    params,
  );
};

const updateSub: Handler = ({ fake, params, ids }) => {
  const sub = fake.store.get("subscription", ids[0] ?? "");
  const onlyMeta = Object.keys(params.raw).every(
    (k) => k === "metadata" || k === "cancellation_details" || k === "expand",
  );
  if (sub.status === "canceled" && !onlyMeta) {
    throw requestError("A canceled subscription can only update its cancellation_details and metadata.");
  }
  const behavior: ProrationBehavior = params.oneOf("proration_behavior", BEHAVIORS) ?? "create_prorations";
  const now = fake.clock.now();
  const t = params.int("proration_date") ?? now;
  const changes = readItemChanges(fake, sub, params.list("items"), "items");
  const pm = params.has("default_payment_method") ? (params.nullableStr("default_payment_method") ?? null) : undefined;
  if (pm) fake.store.get("payment_method", pm, "default_payment_method");
  let inv: Invoice | undefined;
  let failed = false;
  updateSubscription(fake, sub, () => {
    sub.metadata = params.metadata(sub.metadata);
    if (pm !== undefined) sub.default_payment_method = pm;
    const cd = params.obj("cancellation_details");
    if (cd)
      sub.cancellation_details = {
        ...sub.cancellation_details,
        comment: cd.nullableStr("comment") ?? sub.cancellation_details.comment,
        feedback: cd.nullableStr("feedback") ?? sub.cancellation_details.feedback,
      };
    const atEnd = params.bool("cancel_at_period_end");
    if (atEnd !== undefined) {
      sub.cancel_at_period_end = atEnd;
      sub.cancel_at = atEnd ? currentPeriod(sub).end : null;
      // Stripe: canceled_at is the time of the request that asked for the cancellation.
      sub.canceled_at = atEnd ? now : null;
      sub.cancellation_details = { ...sub.cancellation_details, reason: atEnd ? "cancellation_requested" : null };
    }
    if (params.has("cancel_at")) {
      const at = params.str("cancel_at") === "" ? null : (params.int("cancel_at") ?? null);
      sub.cancel_at = at;
      sub.canceled_at = at === null ? null : now;
    }
    if (changes.length === 0) return;
    const pc = planChange(fake, sub, changes, behavior, t);
    for (const c of pc.changes) {
      c.item.price = c.price.id;
      c.item.quantity = c.quantity;
      if (pc.reset) {
        c.item.current_period_start = pc.reset.start;
        c.item.current_period_end = pc.reset.end;
      }
    }
    if (pc.reset) sub.billing_cycle_anchor = pc.reset.start;
    const pending = sub.pending_lines ?? [];
    if (pc.reset || (behavior === "always_invoice" && pc.prorations.length > 0)) {
      inv = createInvoice(fake, {
        sub,
        lines: [...pending, ...pc.prorations, ...(pc.reset?.lines ?? [])],
        reason: "subscription_update",
      });
      sub.pending_lines = [];
      failed = payInvoice(fake, inv, sub) !== null;
      if (failed && sub.status === "active") sub.status = "past_due";
    } else if (behavior === "create_prorations") {
      sub.pending_lines = [...pending, ...pc.prorations];
    }
  });
  if (inv) invoiceOutcome(fake, inv, sub, failed);
  return expand(fake.store, render(fake.store, sub), params);
};

const cancelSub: Handler = ({ fake, params, ids }) => {
  const sub = fake.store.get("subscription", ids[0] ?? "");
  // Stripe answers a second cancel as if the subscription were gone.
  if (sub.status === "canceled") throw notFound("subscription", sub.id);
  cancelNow(fake, sub, "cancellation_requested");
  return expand(fake.store, render(fake.store, sub), params);
};

const getInvoice: Handler = ({ fake, params, ids }) =>
  expand(fake.store, render(fake.store, fake.store.get("invoice", ids[0] ?? "")), params);

const listInvoices: Handler = ({ fake, params }) => {
  const customer = params.str("customer");
  const subscription = params.str("subscription");
  const status = params.str("status");
  const all = fake.store
    .all("invoice")
    .filter(
      (i) =>
        (!customer || i.customer === customer) &&
        (!subscription || i.subscription === subscription) &&
        (!status || i.status === status),
    );
  const page = paginate(all, params);
  return expand(
    fake.store,
    listOf(
      "/v1/invoices",
      page.data.map((i) => render(fake.store, i)),
      page.hasMore,
    ),
    params,
  );
};

const invoiceLines: Handler = ({ fake, params, ids }) => {
  const inv = fake.store.get("invoice", ids[0] ?? "");
  const page = paginate(inv.lines, params);
  return listOf(
    `/v1/invoices/${inv.id}/lines`,
    page.data.map((l) => line(fake.store, inv.id, l)),
    page.hasMore,
  );
};

const payOpenInvoice: Handler = ({ fake, params, ids }) => {
  const inv = fake.store.get("invoice", ids[0] ?? "");
  if (inv.status !== "open") throw requestError("Invoice is already paid", "invoice_not_open");
  const sub = fake.store.get("subscription", inv.subscription ?? "", "subscription");
  const pmId = params.str("payment_method");
  const pm = pmId ? fake.store.get("payment_method", pmId, "payment_method") : undefined;
  let error: ReturnType<typeof payInvoice> = null;
  updateSubscription(fake, sub, () => {
    error = payInvoice(fake, inv, sub, pm);
    const stillOpen = fake.store.all("invoice").some((i) => i.subscription === sub.id && i.status === "open");
    if (!error && sub.status === "past_due" && !stillOpen) sub.status = "active";
  });
  invoiceOutcome(fake, inv, sub, error !== null);
  fake.store.save();
  if (error) throw cardError(error, undefined, inv.payments.at(-1)?.payment.payment_intent);
  return expand(fake.store, render(fake.store, inv), params);
};

const preview: Handler = ({ fake, params }) => {
  const subId = params.str("subscription");
  if (!subId)
    throw requestError(
      "The stand-in previews subscription invoices only: pass `subscription`.",
      "parameter_missing",
      "subscription",
    );
  const sub = fake.store.get("subscription", subId, "subscription");
  const customer = params.str("customer");
  if (customer && customer !== sub.customer)
    throw requestError(`The subscription ${sub.id} does not belong to customer ${customer}.`, undefined, "customer");
  const details = params.obj("subscription_details");
  const behavior: ProrationBehavior = details?.oneOf("proration_behavior", BEHAVIORS) ?? "create_prorations";
  const t = details?.int("proration_date") ?? fake.clock.now();
  const changes = details ? readItemChanges(fake, sub, details.list("items"), "subscription_details[items]") : [];
  const endsAtPeriodEnd = details?.bool("cancel_at_period_end") ?? sub.cancel_at_period_end;
  if (sub.status === "canceled" || (endsAtPeriodEnd && changes.length === 0)) {
    throw requestError(`No upcoming invoices for customer: ${sub.customer}`, "invoice_upcoming_none");
  }
  const pc = planChange(fake, sub, changes, behavior, t);
  const draft = draftInvoice(fake, {
    sub,
    lines: previewLines(fake, sub, pc, behavior),
    id: `upcoming_${newId("in")}`,
    reason: pc.reset || behavior === "always_invoice" ? "subscription_update" : "subscription_cycle",
  });
  if (pc.prorations.length > 0 || pc.reset) draft.proration_date = t;
  if (!pc.reset && !(behavior === "always_invoice" && pc.prorations.length > 0)) {
    // A renewal preview: it would be made, and charged, at the end of the current period.
    const { start, end } = currentPeriod(sub);
    Object.assign(draft, { created: end, next_payment_attempt: end, period_start: start, period_end: end });
  }
  return expand(fake.store, render(fake.store, draft), params);
};

export function billingRoutes(): Array<[string, RegExp, Handler]> {
  return [
    ["GET", /^\/v1\/subscriptions$/, listSubs],
    ["GET", /^\/v1\/subscriptions\/([^/]+)$/, getSub],
    ["POST", /^\/v1\/subscriptions\/([^/]+)$/, updateSub],
    ["DELETE", /^\/v1\/subscriptions\/([^/]+)$/, cancelSub],
    ["POST", /^\/v1\/invoices\/create_preview$/, preview],
    ["GET", /^\/v1\/invoices$/, listInvoices],
    ["GET", /^\/v1\/invoices\/([^/]+)$/, getInvoice],
    ["GET", /^\/v1\/invoices\/([^/]+)\/lines$/, invoiceLines],
    ["POST", /^\/v1\/invoices\/([^/]+)\/pay$/, payOpenInvoice],
  ];
}
