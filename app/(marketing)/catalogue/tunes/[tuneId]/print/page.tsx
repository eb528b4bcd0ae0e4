import type { Metadata } from "next";
import { PageContainer } from "@/components/layout/page-container";
import { StagePrint } from "@/components/tune-page/stage-print";
import { getCurrentUser } from "@/lib/auth/current-user";

export const metadata: Metadata = { title: "Print a stage" };
export const dynamic = "force-dynamic";

export default async function TasterPrintPage(props: {
  params: Promise<{ tuneId: string }>;
  searchParams: Promise<{ stage?: string }>;
}) {
  const [{ tuneId }, { stage }, user] = await Promise.all([props.params, props.searchParams, getCurrentUser()]);
  return (
    <PageContainer>
      <StagePrint viewer={user} tuneId={tuneId} stage={stage} backHref={`/catalogue/tunes/${tuneId}`} />
    </PageContainer>
  );
}
