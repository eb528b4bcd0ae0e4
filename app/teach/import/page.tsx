import type { Metadata } from "next";
import { ImportForm } from "@/components/import/import-form";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Import tunes" };

export default async function ImportPage() {
  await requireArea("area:teach");
  return (
    <PageContainer className="flex max-w-3xl flex-col gap-6">
      <header>
        <p className="text-small font-semibold tracking-widest text-cedar uppercase">Import</p>
        <h1 className="text-h2 font-semibold">Import a file of tunes</h1>
        <p className="mt-2 text-bark">
          Every tune is checked on its own: the good ones are saved even when others in the file have problems.
        </p>
      </header>
      <QueryProvider>
        <ImportForm />
      </QueryProvider>
    </PageContainer>
  );
}
