// Development print view of one open stage of the demo tune (PrintStage).
import { notFound } from "next/navigation";
import { analyze } from "@/lib/abc";
import { PageContainer } from "@/components/layout/page-container";
import { PrintStage } from "@/components/notation";
import { DEMO_OPEN_STAGES, DEMO_TUNE, devPagesOn } from "../demo-tune";

export const dynamic = "force-dynamic";

export default async function PrintDevPage({ searchParams }: { searchParams: Promise<{ stage?: string }> }) {
  if (!devPagesOn()) notFound();
  const wanted = Number((await searchParams).stage ?? "1");
  const result = analyze(DEMO_TUNE);
  if (!result.ok) notFound();
  const stage = result.value.stages.find((s) => s.index === wanted);
  if (!stage || stage.index > DEMO_OPEN_STAGES) notFound(); // a locked stage has no print view
  return (
    <PageContainer>
      <PrintStage abc={stage.abc} title={result.value.title} stageName={stage.name} />
    </PageContainer>
  );
}
