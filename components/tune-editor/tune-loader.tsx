"use client";
// Loads a saved tune through its route, then hands it to the editor.
import { useQuery } from "@tanstack/react-query";
import { Alert } from "@/components/ui/alert";
import type { TuneView } from "@/lib/tunes/api-types";
import { errorWords, teachFetch } from "@/lib/tunes/client-fetch";
import { TuneEditor } from "./tune-editor";

export function TuneLoader({ tuneId }: { tuneId: string }) {
  const query = useQuery({
    queryKey: ["teach-tune", tuneId],
    queryFn: () => teachFetch<TuneView>(`/api/teach/tunes/${tuneId}`),
  });
  if (query.isPending) return <p className="text-bark">Loading the tune…</p>;
  if (query.isError) return <Alert tone="error">{errorWords(query.error)}</Alert>;
  // Not keyed: after a save the editor keeps the teacher's text, which now equals what was stored.
  return <TuneEditor saved={query.data} />;
}
