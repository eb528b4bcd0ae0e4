import type { Metadata } from "next";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { ReviewQueue } from "@/components/teaching/review-queue";
import { LinkButton } from "@/components/ui/link-button";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Review queue" };

export default async function ReviewPage() {
  await requireArea("area:teach");
  return (
    <PageContainer className="flex flex-col gap-6">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <p className="text-small font-semibold tracking-widest text-cedar uppercase">Review</p>
          <h1 className="text-h2 font-semibold">Check-ins waiting</h1>
          <p className="text-bark">Oldest first. Signing off opens the next stage for that student only.</p>
        </div>
        <LinkButton href="/teach/assignments" variant="secondary">
          Assignments
        </LinkButton>
      </header>
      <QueryProvider>
        <ReviewQueue />
      </QueryProvider>
    </PageContainer>
  );
}
