import type { Metadata } from "next";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { TuneEditor } from "@/components/tune-editor/tune-editor";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "New tune" };

export default async function NewTunePage() {
  await requireArea("area:teach");
  return (
    <PageContainer>
      <QueryProvider>
        <TuneEditor saved={null} />
      </QueryProvider>
    </PageContainer>
  );
}
