import type { Metadata } from "next";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { SelfCheckIns } from "@/components/teaching/self-check-ins";
import { LinkButton } from "@/components/ui/link-button";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Self-paced check-ins" };

export default async function SelfCheckInsPage() {
  await requireArea("area:teach");
  return (
    <PageContainer className="flex flex-col gap-6">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <p className="text-small font-semibold tracking-widest text-cedar uppercase">Check-ins</p>
          <h1 className="text-h2 font-semibold">Self-paced check-ins</h1>
          <p className="max-w-prose text-bark">
            On a self-paced course each check-in opens the next stage at once. Here are your members&apos; check-ins of
            the last month, newest first: listen, and leave a word if you like.
          </p>
        </div>
        <LinkButton href="/teach/review" variant="secondary">
          Review queue
        </LinkButton>
      </header>
      <QueryProvider>
        <SelfCheckIns />
      </QueryProvider>
    </PageContainer>
  );
}
