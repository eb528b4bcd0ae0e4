import type { Metadata } from "next";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { TuneList } from "@/components/tune-editor/tune-list";
import { LinkButton } from "@/components/ui/link-button";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Tunes" };

export default async function TeachTunesPage() {
  const user = await requireArea("area:teach");
  return (
    <PageContainer className="flex flex-col gap-6">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <p className="text-small font-semibold tracking-widest text-cedar uppercase">Tunes</p>
          <h1 className="text-h2 font-semibold">{user.role === "admin" ? "Every teacher's tunes" : "Your tunes"}</h1>
        </div>
        <div className="flex flex-wrap gap-2">
          <LinkButton href="/teach/import" variant="secondary">
            Import a file
          </LinkButton>
          <LinkButton href="/teach/tunes/new">Write a new tune</LinkButton>
        </div>
      </header>
      <QueryProvider>
        <TuneList showTeacher={user.role === "admin"} />
      </QueryProvider>
    </PageContainer>
  );
}
