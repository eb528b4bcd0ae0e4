// Starting a membership through Stripe Checkout (issue 7 item 3). Nothing about the membership is
// written here: the webhook handlers write it when Stripe says the payment went through.
import type { Tx as Db } from "@/db/queries/auth";
import { findCourse } from "@/db/queries/catalogue";
import { customerOf, findPlan, setCustomer } from "@/db/queries/billing";
import { membershipsOf } from "@/db/queries/membership";
import { conflict, notFound } from "@/lib/auth/errors";
import { env } from "@/lib/env";
import { standingOf } from "./gate";
import type { Stripe } from "./stripe";

type Person = { id: string; email: string; name: string };

/** The person's Stripe customer, created once and remembered on users.stripe_customer_id. */
export async function ensureCustomer(db: Db, stripe: Stripe, person: Person): Promise<string> {
  const known = await customerOf(db, person.id);
  if (known) return known;
  // The key makes a double click create one customer (Stripe docs: "Idempotent requests").
  const customer = await stripe.customers.create(
    { email: person.email, name: person.name, metadata: { userId: person.id } },
    { idempotencyKey: `customer:${person.id}` },
  );
  await setCustomer(db, person.id, customer.id);
  return customer.id;
}

const appUrl = () => env().APP_URL.replace(/\/$/, "");

export async function startCheckout(
  db: Db,
  stripe: Stripe,
  person: Person,
  input: { planId: string; courseId?: string | undefined },
): Promise<{ url: string }> {
  const plan = await findPlan(db, input.planId);
  if (!plan || plan.retiredAt || !plan.stripePriceId) throw notFound("That plan is not on offer.");
  const course = input.courseId ? await findCourse(db, input.courseId) : null;
  if (input.courseId && (!course || !course.published)) throw notFound("We couldn't find that course.");
  const now = new Date();
  if ((await membershipsOf(db, person.id)).some((m) => m.status !== "past_due" && standingOf(m, now).good)) {
    throw conflict("You are already a member: change your plan on the billing page.");
  }
  const customer = await ensureCustomer(db, stripe, person);
  const metadata: Record<string, string> = {
    userId: person.id,
    planId: plan.id,
    ...(course ? { courseId: course.id } : {}),
  };
  const back = course ? `&course=${encodeURIComponent(course.slug)}` : "";
  const session = await stripe.checkout.sessions.create({
    mode: "subscription",
    customer,
    line_items: [{ price: plan.stripePriceId, quantity: 1 }],
    metadata,
    subscription_data: { metadata },
    client_reference_id: person.id,
    // Stripe fills {CHECKOUT_SESSION_ID} in (Stripe docs: "Customize redirect behavior").
    success_url: `${appUrl()}/learn/billing/welcome?session_id={CHECKOUT_SESSION_ID}${back}`,
    cancel_url: `${appUrl()}/plans${course ? `?course=${encodeURIComponent(course.slug)}` : ""}`,
  });
  if (!session.url) throw new Error(`Stripe returned checkout session ${session.id} without a url`);
  return { url: session.url };
}
