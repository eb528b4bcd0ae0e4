import type { Metadata } from "next";
import { PageContainer } from "@/components/layout/page-container";
import { StagePrint } from "@/components/tune-page/stage-print";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Print a stage" };

export default async function LearnPrintPage(props: {
  params: Promise<{ tuneId: string }>;
  searchParams: Promise<{ stage?: string }>;
}) {
  const user = await requireArea("area:learn");
  const { tuneId } = await props.params;
  const { stage } = await props.searchParams;
  return (
    <PageContainer>
      <StagePrint viewer={user} tuneId={tuneId} stage={stage} backHref={`/learn/tunes/${tuneId}`} />
    </PageContainer>
  );
}
