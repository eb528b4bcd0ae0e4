"use client";
// The teacher's tunes (an admin's: everyone's), newest change first.
import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { Alert } from "@/components/ui/alert";
import { Card, CardTitle } from "@/components/ui/card";
import { TableShell, TBody, Td, Th, THead } from "@/components/ui/table";
import type { TuneSummary } from "@/lib/tunes/api-types";
import { errorWords, teachFetch } from "@/lib/tunes/client-fetch";

export function TuneList({ showTeacher }: { showTeacher: boolean }) {
  const query = useQuery({
    queryKey: ["teach-tunes"],
    queryFn: () => teachFetch<{ tunes: TuneSummary[] }>("/api/teach/tunes"),
  });
  if (query.isPending) return <p className="text-bark">Loading your tunes…</p>;
  if (query.isError) return <Alert tone="error">{errorWords(query.error)}</Alert>;
  const tunes = query.data.tunes;
  if (tunes.length === 0) {
    return (
      <Card tone="warm" className="max-w-prose">
        <CardTitle level={2}>No tunes yet</CardTitle>
        <p className="text-bark">Write a tune in ABC, or import a file of many.</p>
      </Card>
    );
  }
  return (
    <TableShell caption={`${tunes.length} tune${tunes.length === 1 ? "" : "s"}`}>
      <THead>
        <tr>
          <Th>Title</Th>
          <Th>Type</Th>
          <Th>Key</Th>
          <Th>Meter</Th>
          <Th>Stages</Th>
          {showTeacher ? <Th>Teacher</Th> : null}
          <Th>Changed</Th>
        </tr>
      </THead>
      <TBody>
        {tunes.map((t) => (
          <tr key={t.id}>
            <Td className="font-semibold">
              <Link href={`/teach/tunes/${t.id}`}>{t.title}</Link>
            </Td>
            <Td>{t.tuneType}</Td>
            <Td>{t.key}</Td>
            <Td>{t.meter}</Td>
            <Td>{t.stageCount}</Td>
            {showTeacher ? <Td>{t.teacherName}</Td> : null}
            <Td>
              {new Date(t.updatedAt).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric" })}
            </Td>
          </tr>
        ))}
      </TBody>
    </TableShell>
  );
}
