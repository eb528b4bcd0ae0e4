import type { Metadata } from "next";
import { PageContainer } from "@/components/layout/page-container";
import { QueryProvider } from "@/components/providers/query-provider";
import { TunePage } from "@/components/tune-page/tune-page";
import { getCurrentUser } from "@/lib/auth/current-user";

export const metadata: Metadata = { title: "Taster tune" };
export const dynamic = "force-dynamic";

/** A taster rung's tune, open to anyone; any other tune answers with why it is closed. */
export default async function TasterTunePage({ params }: { params: Promise<{ tuneId: string }> }) {
  const [{ tuneId }, user] = await Promise.all([params, getCurrentUser()]);
  return (
    <PageContainer>
      <QueryProvider>
        <TunePage tuneId={tuneId} area="public" notes={user !== null} />
      </QueryProvider>
    </PageContainer>
  );
}
