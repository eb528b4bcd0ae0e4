import type { Metadata } from "next";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { WelcomeWait } from "@/components/billing/welcome-wait";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Welcome" };

export default async function WelcomePage({ searchParams }: { searchParams: Promise<{ course?: string }> }) {
  await requireArea("billing:manage");
  const { course } = await searchParams;
  return (
    <PageContainer className="flex max-w-prose flex-col gap-4">
      <h1 className="text-h2 font-semibold">Welcome to the school</h1>
      <QueryProvider>
        <WelcomeWait course={course && /^[a-z0-9-]{1,120}$/.test(course) ? course : null} />
      </QueryProvider>
    </PageContainer>
  );
}
