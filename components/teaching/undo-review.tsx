"use client";
// Taking back a "needs more time" while its note has not gone yet (the server allows 10 minutes).
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useEffect, useState } from "react";
import { Button } from "@/components/ui/button";
import { errorWords, fetchJson } from "@/lib/catalogue/fetch-json";
import { REVIEW_KEY, ROSTER_KEY } from "./query-keys";

export function UndoReview({
  undo,
  onUndone,
}: {
  undo: { checkInId: string; student: string; until: number };
  onUndone: (words: string) => void;
}) {
  const qc = useQueryClient();
  const [open, setOpen] = useState(() => Date.now() < undo.until);
  useEffect(() => {
    const t = setTimeout(() => setOpen(false), Math.max(0, undo.until - Date.now()));
    return () => clearTimeout(t);
  }, [undo.until]);
  const take = useMutation({
    mutationFn: () => fetchJson(`/api/teach/review/${undo.checkInId}/undo`, { method: "POST" }),
    onSuccess: async () => {
      onUndone(`Undone: ${undo.student}'s check-in waits for your review again, and no note was sent.`);
      await qc.invalidateQueries({ queryKey: REVIEW_KEY });
      await qc.invalidateQueries({ queryKey: ROSTER_KEY });
    },
  });
  if (!open) return null;
  return (
    <span className="mt-2 flex flex-wrap items-center gap-3">
      <Button variant="secondary" size="sm" disabled={take.isPending} onClick={() => take.mutate()}>
        Undo “needs more time”
      </Button>
      {take.isError ? <span className="font-semibold text-berry">{errorWords(take.error)}</span> : null}
    </span>
  );
}
