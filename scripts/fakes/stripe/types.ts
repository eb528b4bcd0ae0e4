// The stand-in's stored objects. They follow the shapes of Stripe's API (version pinned by the SDK,
// `Stripe.API_VERSION`) for the fields the app reads; rarely used nullable fields are filled in when
// rendered (render.ts). Ids point at other stored objects; expand= swaps them for the objects.
export type Metadata = Record<string, string>;
export type Json = string | number | boolean | null | Json[] | { [key: string]: Json };
export type JsonObject = { [key: string]: Json };

export type Interval = "day" | "week" | "month" | "year";

export interface Customer {
  id: string;
  object: "customer";
  created: number;
  email: string | null;
  name: string | null;
  description: string | null;
  metadata: Metadata;
  balance: number;
  currency: string | null;
  invoice_prefix: string;
  next_invoice_sequence: number;
  delinquent: boolean;
  invoice_settings: { default_payment_method: string | null };
}

export interface Product {
  id: string;
  object: "product";
  created: number;
  updated: number;
  active: boolean;
  name: string;
  description: string | null;
  metadata: Metadata;
  default_price: string | null;
}

export interface Price {
  id: string;
  object: "price";
  created: number;
  active: boolean;
  currency: string;
  unit_amount: number;
  product: string;
  nickname: string | null;
  lookup_key: string | null;
  metadata: Metadata;
  type: "recurring" | "one_time";
  recurring: { interval: Interval; interval_count: number } | null;
}

export interface PaymentMethod {
  id: string;
  object: "payment_method";
  created: number;
  customer: string | null;
  type: "card";
  card: { brand: string; last4: string; exp_month: number; exp_year: number; funding: string; country: string };
  billing_details: { name: string | null; email: string | null };
  metadata: Metadata;
}

export interface CheckoutSession {
  id: string;
  object: "checkout.session";
  created: number;
  expires_at: number;
  mode: "subscription" | "setup";
  status: "open" | "complete" | "expired";
  payment_status: "paid" | "unpaid" | "no_payment_required";
  customer: string | null;
  customer_email: string | null;
  client_reference_id: string | null;
  success_url: string | null;
  cancel_url: string | null;
  metadata: Metadata;
  currency: string | null;
  line_items: { price: string; quantity: number }[];
  amount_subtotal: number | null;
  amount_total: number | null;
  subscription: string | null;
  invoice: string | null;
  setup_intent: string | null;
  subscription_data: { metadata: Metadata };
  setup_intent_data: { metadata: Metadata };
  last_error: string | null;
  url: string | null;
  /** Filled when the person completes the page. */
  customer_details?: { email: string | null; name: string | null };
}

export interface SubscriptionItem {
  id: string;
  object: "subscription_item";
  created: number;
  price: string;
  quantity: number;
  current_period_start: number;
  current_period_end: number;
  metadata: Metadata;
  subscription: string;
}

export type SubscriptionStatus =
  "incomplete" | "incomplete_expired" | "trialing" | "active" | "past_due" | "canceled" | "unpaid" | "paused";

export interface Subscription {
  id: string;
  object: "subscription";
  created: number;
  start_date: number;
  customer: string;
  currency: string;
  status: SubscriptionStatus;
  items: SubscriptionItem[];
  billing_cycle_anchor: number;
  cancel_at_period_end: boolean;
  cancel_at: number | null;
  canceled_at: number | null;
  ended_at: number | null;
  cancellation_details: { comment: string | null; feedback: string | null; reason: string | null };
  default_payment_method: string | null;
  latest_invoice: string | null;
  metadata: Metadata;
  /** Proration lines waiting for the next invoice (proration_behavior=create_prorations). */
  pending_lines?: InvoiceLine[];
}

export interface InvoiceLine {
  id: string;
  object: "line_item";
  amount: number;
  currency: string;
  description: string;
  quantity: number;
  period: { start: number; end: number };
  price: string;
  proration: boolean;
  subscription: string | null;
  subscription_item: string | null;
  metadata: Metadata;
}

export interface InvoicePayment {
  id: string;
  object: "invoice_payment";
  created: number;
  amount_paid: number | null;
  amount_requested: number;
  currency: string;
  invoice: string;
  is_default: boolean;
  status: "open" | "paid" | "canceled";
  payment: { type: "payment_intent"; payment_intent: string };
  status_transitions: { canceled_at: number | null; paid_at: number | null };
}

export type BillingReason = "subscription_create" | "subscription_cycle" | "subscription_update" | "manual";

export interface Invoice {
  id: string;
  object: "invoice";
  created: number;
  customer: string;
  currency: string;
  status: "draft" | "open" | "paid" | "void" | "uncollectible";
  billing_reason: BillingReason;
  number: string | null;
  receipt_number: string | null;
  subscription: string | null;
  lines: InvoiceLine[];
  subtotal: number;
  total: number;
  starting_balance: number;
  ending_balance: number | null;
  amount_due: number;
  amount_paid: number;
  amount_remaining: number;
  attempt_count: number;
  attempted: boolean;
  next_payment_attempt: number | null;
  period_start: number;
  period_end: number;
  metadata: Metadata;
  payments: InvoicePayment[];
  status_transitions: {
    finalized_at: number | null;
    paid_at: number | null;
    voided_at: number | null;
    marked_uncollectible_at: number | null;
  };
  /** Previews only: the moment prorations were computed for (parent.subscription_details.subscription_proration_date). */
  proration_date?: number;
}

export interface CardError {
  code: string;
  decline_code: string;
  message: string;
}

export interface PaymentIntent {
  id: string;
  object: "payment_intent";
  created: number;
  amount: number;
  amount_received: number;
  currency: string;
  customer: string | null;
  payment_method: string | null;
  latest_charge: string | null;
  description: string | null;
  status: "succeeded" | "requires_payment_method";
  metadata: Metadata;
  last_payment_error: (CardError & { type: "card_error" }) | null;
}

export interface Charge {
  id: string;
  object: "charge";
  created: number;
  amount: number;
  amount_captured: number;
  amount_refunded: number;
  currency: string;
  customer: string | null;
  description: string | null;
  paid: boolean;
  captured: boolean;
  refunded: boolean;
  status: "succeeded" | "failed";
  failure_code: string | null;
  failure_message: string | null;
  outcome: { type: string; seller_message: string; reason: string | null; network_status: string };
  payment_intent: string | null;
  payment_method: string | null;
  receipt_number: string | null;
  payment_method_details: {
    type: "card";
    card: { brand: string; last4: string; exp_month: number; exp_year: number };
  } | null;
  metadata: Metadata;
}

export interface Refund {
  id: string;
  object: "refund";
  created: number;
  amount: number;
  currency: string;
  charge: string;
  payment_intent: string | null;
  reason: "duplicate" | "fraudulent" | "requested_by_customer" | null;
  status: "succeeded";
  metadata: Metadata;
  receipt_number: string | null;
}

export type Stored =
  | Customer
  | Product
  | Price
  | PaymentMethod
  | CheckoutSession
  | Subscription
  | Invoice
  | PaymentIntent
  | Charge
  | Refund;
export type StoredKind = Stored["object"];

export interface Delivery {
  status: "pending" | "delivered" | "failed" | "not_sent";
  attempts: number;
  next_attempt_at: number | null;
  last_status: number | null;
  last_error: string | null;
  delivered_at: number | null;
}

export interface EventRecord {
  id: string;
  object: "event";
  api_version: string;
  created: number;
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: string;
  data: { object: JsonObject; previous_attributes?: JsonObject };
  delivery: Delivery;
}
