"use client";
// The tune page's data, fetched from the route handlers with TanStack Query (issue 5 item 7).
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { NoteJson, StageAbcJson, TuneJson } from "@/lib/catalogue/api-types";
import { fetchJson } from "@/lib/catalogue/fetch-json";
import type { NoteInput } from "@/lib/catalogue/schemas";

const base = (tuneId: string) => `/api/tunes/${encodeURIComponent(tuneId)}`;
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
    staleTime: 5 * 60_000, // a stage's music changes only when the teacher edits the tune
  });
}

export function useNotes(tuneId: string, enabled: boolean) {
  return useQuery({
    queryKey: tuneKeys.notes(tuneId),
    queryFn: async () => (await fetchJson<{ notes: NoteJson[] }>(`${base(tuneId)}/notes`)).notes,
    enabled,
  });
}

/** Add, change and delete notes; each refreshes the list from the server when it settles. */
export function useNoteMutations(tuneId: string) {
  const client = useQueryClient();
  const settle = { onSettled: () => client.invalidateQueries({ queryKey: tuneKeys.notes(tuneId) }) };
  return {
    add: useMutation({ mutationFn: (v: NoteInput) => fetchJson<NoteJson>(`${base(tuneId)}/notes`, { method: "POST", body: v }), ...settle }),
    change: useMutation({
      mutationFn: ({ id, ...v }: NoteInput & { id: string }) => fetchJson<NoteJson>(`${base(tuneId)}/notes/${id}`, { method: "PATCH", body: v }),
      ...settle,
    }),
    remove: useMutation({ mutationFn: (id: string) => fetchJson<void>(`${base(tuneId)}/notes/${id}`, { method: "DELETE" }), ...settle }),
  };
}
