import type { Metadata } from "next";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { TuneLoader } from "@/components/tune-editor/tune-loader";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Tune editor" };

export default async function EditTunePage({ params }: { params: Promise<{ tuneId: string }> }) {
  await requireArea("area:teach"); // layouts are not re-run on client navigation
  const { tuneId } = await params;
  return (
    <PageContainer>
      <QueryProvider>
        <TuneLoader tuneId={tuneId} />
      </QueryProvider>
    </PageContainer>
  );
}
