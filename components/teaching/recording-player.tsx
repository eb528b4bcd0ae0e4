"use client";
// The student's recording: a short-lived presigned address from the recordings route, asked for when
// the card shows (it expires, so it is never fetched ahead or kept).
import { useQuery } from "@tanstack/react-query";
import { errorWords, fetchJson } from "@/lib/catalogue/fetch-json";

export function RecordingPlayer({ uploadId, label }: { uploadId: string | null; label: string }) {
  const q = useQuery({
    queryKey: ["recording", uploadId],
    queryFn: () => fetchJson<{ url: string }>(`/api/recordings/${uploadId}/playback`),
    enabled: uploadId !== null,
    staleTime: 60_000,
  });
  if (!uploadId) return <p className="text-small text-bark">No recording with this check-in.</p>;
  if (q.isPending) return <p className="text-small text-bark">Loading the recording…</p>;
  if (q.isError) return <p className="text-small text-berry">{errorWords(q.error)}</p>;
  return <audio controls preload="metadata" src={q.data.url} aria-label={label} className="w-full" />;
}
