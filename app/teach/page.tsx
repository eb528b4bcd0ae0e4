import type { Metadata } from "next";
import { PageContainer } from "@/components/layout/page-container";
import { Card, CardTitle } from "@/components/ui/card";
import { LinkButton } from "@/components/ui/link-button";
import { TableShell, TBody, Td, Th, THead } from "@/components/ui/table";
import { db } from "@/db/client";
import { listRoster } from "@/db/queries/people";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "Roster" };

export default async function RosterPage() {
  const user = await requireArea("area:teach");
  // Only this teacher's own students: the query is keyed by the signed-in teacher, never by a parameter.
  const roster = await listRoster(db(), user.id);
  return (
    <PageContainer className="flex flex-col gap-6">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <p className="text-small font-semibold tracking-widest text-cedar uppercase">Roster</p>
          <h1 className="text-h2 font-semibold">Your students</h1>
        </div>
        <LinkButton href="/teach/invite">Invite students</LinkButton>
      </header>
      {roster.length ? (
        <TableShell caption={`${roster.length} student${roster.length === 1 ? "" : "s"}`}>
          <THead>
            <tr>
              <Th>Name</Th>
              <Th>E-mail</Th>
            </tr>
          </THead>
          <TBody>
            {roster.map((s) => (
              <tr key={s.id}>
                <Td className="font-semibold">{s.name}</Td>
                <Td>{s.email}</Td>
              </tr>
            ))}
          </TBody>
        </TableShell>
      ) : (
        <Card tone="warm" className="max-w-prose">
          <CardTitle level={2}>No students yet</CardTitle>
          <p className="text-bark">Invite your students by e-mail; each one joins this roster when they accept.</p>
        </Card>
      )}
    </PageContainer>
  );
}
