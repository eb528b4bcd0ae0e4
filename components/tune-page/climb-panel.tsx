"use client";
// The tune page's check-in panel for a member climbing a course: how its stages open (the course's
// pace), the stage being worked on and what opens next, the check-in itself and the teacher's words.
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { Alert } from "@/components/ui/alert";
import { fetchJson } from "@/lib/catalogue/fetch-json";
import { opensNextWords, PACE_NAME, paceWords } from "@/lib/teaching/climb-words";
import type { ClimbJson } from "@/lib/teaching/course-check-in";
import { ClimbForm } from "./climb-form";
import { tuneKeys } from "./use-tune";

const climbKey = (tuneId: string) => ["tune", tuneId, "climb"] as const;

const STATUS: Record<string, string> = {
  waiting: "waiting for your teacher",
  signed_off: "signed off",
  needs_more_time: "needs more time",
  withdrawn: "withdrawn",
};

export function ClimbPanel({ tuneId, onOpened }: { tuneId: string; onOpened: (stage: number) => void }) {
  const qc = useQueryClient();
  const [done, setDone] = useState<string | null>(null);
  const climb = useQuery({
    queryKey: climbKey(tuneId),
    queryFn: () => fetchJson<ClimbJson | { why: string }>(`/api/learn/tunes/${encodeURIComponent(tuneId)}/climb`),
  });
  if (!climb.data) return null;
  if ("why" in climb.data)
    return (
      <p className="rounded-knot border border-line bg-paper p-4 text-bark" data-testid="climb-closed">
        {climb.data.why}
      </p>
    );
  const c = climb.data;
  const current = c.stages.find((s) => s.index === c.current) ?? null;
  const next = current ? (c.stages.find((s) => s.index === current.index + 1) ?? null) : null;
  const words = paceWords(c.course.pace, c.course.teacherName);
  async function checkedIn(opened: number | null) {
    if (!current) return;
    setDone(
      opened
        ? `Stage ${current.index} is checked in, and stage ${opened} (${c.stages.find((s) => s.index === opened)?.name ?? ""}) is open now.`
        : c.course.pace === "self_paced"
          ? `Stage ${current.index} is checked in: that was the tune's last stage.`
          : `Stage ${current.index} is checked in and waits for ${c.course.teacherName}.`,
    );
    await Promise.all([
      qc.invalidateQueries({ queryKey: climbKey(tuneId) }),
      qc.invalidateQueries({ queryKey: tuneKeys.tune(tuneId), exact: true }),
      qc.invalidateQueries({ queryKey: ["ladder"] }),
      qc.invalidateQueries({ queryKey: ["courses", "mine"] }),
    ]);
    if (opened) onOpened(opened);
  }
  return (
    <section aria-labelledby="climb-title" className="flex flex-col gap-4 rounded-knot border border-line bg-paper p-4">
      <header className="flex flex-col gap-1">
        <h2 id="climb-title" className="font-serif text-h3 font-semibold">
          Check in a stage
        </h2>
        <p className="text-small text-bark" data-testid="climb-pace">
          <span className="font-semibold text-ink">{`${PACE_NAME[c.course.pace]} course. `}</span>
          {words}
        </p>
      </header>
      {done ? (
        <Alert tone="success" live>
          {done}
        </Alert>
      ) : null}
      {current?.state === "open" ? (
        <>
          <p data-testid="climb-next">
            <span className="font-semibold">{`Stage ${current.index} (${current.name}). `}</span>
            {opensNextWords(c.course.pace, c.course.teacherName, next)}
          </p>
          <ClimbForm key={current.index} tuneId={tuneId} stage={current} onDone={(o) => void checkedIn(o)} />
        </>
      ) : current?.state === "checked_in" ? (
        <p data-testid="climb-next">{`Stage ${current.index} (${current.name}) is checked in and waits for ${c.course.teacherName}'s review.`}</p>
      ) : (
        <p data-testid="climb-next">Every stage of this tune is checked in. Well played.</p>
      )}
      <CheckInHistory stages={c.stages} />
    </section>
  );
}

function CheckInHistory({ stages }: { stages: ClimbJson["stages"] }) {
  const seen = stages.filter((s) => s.checkIn);
  if (!seen.length) return null;
  return (
    <div className="flex flex-col gap-2">
      <h3 className="font-semibold">Your check-ins</h3>
      <ul className="flex flex-col gap-2">
        {seen.map((s) => (
          <li key={s.index} className="text-small">
            {`Stage ${s.index} (${s.name}): ${STATUS[s.checkIn?.status ?? ""] ?? ""}, self-rating ${s.checkIn?.selfRating} of 5, ${s.checkIn?.recorded ? "with a recording" : "played from memory"}.`}
            {s.checkIn?.feedback ? <span className="block italic">{`“${s.checkIn.feedback}”`}</span> : null}
          </li>
        ))}
      </ul>
    </div>
  );
}
