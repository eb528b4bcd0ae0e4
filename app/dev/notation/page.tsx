// Development page for the music components (issue 5 item 6): every piece on one tune, for
// browser checks and the e2e test. Absent in production unless DEMO_DEV_PAGES=true.
import { notFound } from "next/navigation";
import type { Metadata } from "next";
import { analyze } from "@/lib/abc";
import { PageContainer } from "@/components/layout/page-container";
import { DEMO_OPEN_STAGES, DEMO_REASON, DEMO_TUNE, devPagesOn } from "./demo-tune";
import { NotationDemo } from "./notation-demo";

export const dynamic = "force-dynamic"; // the switch is read per request, not baked in at build
export const metadata: Metadata = { title: "Music components (development)", robots: { index: false } };

export default function NotationDevPage() {
  if (!devPagesOn()) notFound();
  const result = analyze(DEMO_TUNE);
  if (!result.ok) throw new Error(result.problems.map((p) => `${p.line}:${p.column} ${p.message}`).join("; "));
  const { stages, phraseMap, title } = result.value;
  const choices = stages.map((s) => ({
    index: s.index,
    name: s.name,
    abc: s.abc,
    locked: s.index > DEMO_OPEN_STAGES,
    reason: s.index > DEMO_OPEN_STAGES ? DEMO_REASON : undefined,
  }));
  return (
    <PageContainer className="flex flex-col gap-6">
      <div>
        <h1 className="text-h2">{title}</h1>
        <p className="text-bark">Development page: the tune page&apos;s music components on a tune written for it.</p>
      </div>
      <NotationDemo stages={choices} phraseMap={phraseMap} />
    </PageContainer>
  );
}
