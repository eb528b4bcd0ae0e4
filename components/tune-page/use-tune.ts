"use client";
// The tune page's data, fetched from the route handlers with TanStack Query (issue 5 item 7).
import { keepPreviousData, useQuery } from "@tanstack/react-query";
import type { StageAbcJson, TuneJson } from "@/lib/catalogue/api-types";
import { fetchJson } from "@/lib/catalogue/fetch-json";

export const base = (tuneId: string) => `/api/tunes/${encodeURIComponent(tuneId)}`;
export const tuneKeys = {
  tune: (id: string) => ["tune", id] as const,
  stage: (id: string, index: number) => ["tune", id, "stage", index] as const,
  notes: (id: string) => ["tune", id, "notes"] as const,
};

export function useTune(tuneId: string) {
  return useQuery({ queryKey: tuneKeys.tune(tuneId), queryFn: () => fetchJson<TuneJson>(base(tuneId)) });
}

export function useStage(tuneId: string, index: number | null) {
  return useQuery({
    queryKey: tuneKeys.stage(tuneId, index ?? 0),
    queryFn: () => fetchJson<StageAbcJson>(`${base(tuneId)}/stages/${index}`),
    enabled: index !== null,
    placeholderData: keepPreviousData, // the last stage stays on screen while the next one loads
    staleTime: 5 * 60_000, // a stage's music changes only when the teacher edits the tune
  });
}
