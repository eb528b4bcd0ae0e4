import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/db/client";
import { listPlans } from "@/db/queries/billing";
import { findCourse } from "@/db/queries/catalogue";
import { ChoosePlanButton } from "@/components/billing/choose-plan-button";
import { PageContainer } from "@/components/layout/page-container";
import { Card } from "@/components/ui/card";
import { LinkButton } from "@/components/ui/link-button";
import { getCurrentUser } from "@/lib/auth/current-user";
import { formatMoney } from "@/lib/billing/money";

export const metadata: Metadata = { title: "Membership plans" };
export const dynamic = "force-dynamic";

export default async function PlansPage({ searchParams }: { searchParams: Promise<{ course?: string }> }) {
  const [user, plans, q] = await Promise.all([getCurrentUser(), listPlans(db(), { activeOnly: true }), searchParams]);
  const course = q.course ? await findCourse(db(), q.course) : null;
  return (
    <PageContainer className="flex flex-col gap-8">
      <header className="flex max-w-prose flex-col gap-3">
        <p className="text-small font-semibold tracking-widest text-cedar uppercase">Membership</p>
        <h1 className="text-h2 font-semibold">Choose a membership plan</h1>
        <p className="text-bark">
          Taster tunes are open to everyone. A membership opens every course’s ladder, rung by rung, for as long as it
          runs. Cancel whenever you like: it stays open to the end of the period you paid for.
        </p>
        {course?.published ? <p className="text-bark">After paying you go straight to “{course.title}”.</p> : null}
      </header>
      {plans.length === 0 ? <p className="text-bark">No plans are on offer just now.</p> : null}
      <ul className="grid gap-6 sm:grid-cols-2">
        {plans.map((p) => (
          <Card as="li" key={p.id} className="flex flex-col gap-4">
            <h2 className="font-serif text-h3 font-semibold">{p.name}</h2>
            <p>
              <span className="text-h3 font-semibold">{formatMoney(p.amount, p.currency)}</span>{" "}
              <span className="text-bark">{p.interval === "month" ? "per month" : "per year"}</span>
            </p>
            <p className="text-bark">Opens: {p.opens}</p>
            {!user ? (
              <div className="flex flex-col gap-2">
                <LinkButton
                  href={`/sign-up?${new URLSearchParams({ plan: p.id, ...(course?.published ? { course: course.slug } : {}) })}`}
                >{`Choose ${p.name}`}</LinkButton>
                <p className="text-small text-bark">
                  Create an account first, or <Link href="/sign-in?next=/plans">sign in</Link> if you have one.
                </p>
              </div>
            ) : user.role === "student" ? (
              <ChoosePlanButton planId={p.id} planName={p.name} courseId={course?.published ? course.id : undefined} />
            ) : (
              <p className="text-small text-bark">
                Memberships are for students; teachers and admins open everything already.
              </p>
            )}
          </Card>
        ))}
      </ul>
    </PageContainer>
  );
}
