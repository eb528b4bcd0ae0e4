"use client";
// Margin notes through their route handlers; kept apart from use-tune.ts so the mutation code loads
// with the notes panel, not with the page.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { NoteJson } from "@/lib/catalogue/api-types";
import { fetchJson } from "@/lib/catalogue/fetch-json";
import type { NoteInput } from "@/lib/catalogue/schemas";
import { base, tuneKeys } from "./use-tune";

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
    add: useMutation({
      mutationFn: (v: NoteInput) => fetchJson<NoteJson>(`${base(tuneId)}/notes`, { method: "POST", body: v }),
      ...settle,
    }),
    change: useMutation({
      mutationFn: ({ id, ...v }: NoteInput & { id: string }) =>
        fetchJson<NoteJson>(`${base(tuneId)}/notes/${id}`, { method: "PATCH", body: v }),
      ...settle,
    }),
    remove: useMutation({
      mutationFn: (id: string) => fetchJson<void>(`${base(tuneId)}/notes/${id}`, { method: "DELETE" }),
      ...settle,
    }),
  };
}
