"use client";
// The student's assignment page (issue 6 item 3): tune, due date in the student's zone, the teacher's
// note, the stages with their state, the current stage's music, and the check-in or its withdrawal.
import Link from "next/link";
import { lazy, Suspense, useState } from "react";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import { errorWords, fetchJson } from "@/lib/catalogue/fetch-json";
import type { LearnAssignment } from "@/lib/teaching/learn-assignment";
import { CheckInForm } from "./check-in-form";
import { StageList } from "./stage-list";

// abcjs and the player load only when there is music to show.
const AssignmentMusic = lazy(() => import("./assignment-music"));
const SelfCheckView = lazy(() => import("@/components/listening/self-check"));

function Withdraw({ checkInId, onDone }: { checkInId: string; onDone: () => void }) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function withdraw() {
    setBusy(true);
    setError(null);
    try {
      await fetchJson(`/api/learn/check-ins/${checkInId}`, { method: "DELETE" });
      onDone();
    } catch (e) {
      setError(errorWords(e));
    } finally {
      setBusy(false);
    }
  }
  return (
    <div className="flex flex-col gap-3">
      <p>Your check-in is waiting for your teacher. Until it is reviewed you can take it back and check in again.</p>
      {error ? (
        <Alert tone="error" live>
          {error}
        </Alert>
      ) : null}
      <div>
        <Button variant="secondary" onClick={() => void withdraw()} disabled={busy}>
          {busy ? "Withdrawing…" : "Withdraw check-in"}
        </Button>
      </div>
    </div>
  );
}

export function AssignmentView({ assignmentStudentId }: { assignmentStudentId: string }) {
  const key = ["learn", "assignment", assignmentStudentId];
  const client = useQueryClient();
  const q = useQuery({
    queryKey: key,
    queryFn: () => fetchJson<LearnAssignment>(`/api/learn/assignments/${assignmentStudentId}`),
    // While the listening aid is still hearing the last recording, ask again now and then.
    refetchInterval: (query) => (query.state.data?.selfCheck?.listening?.state === "listening" ? 4000 : false),
  });
  const refresh = () => void client.invalidateQueries({ queryKey: key });

  if (q.isPending)
    return (
      <p role="status" className="text-bark">
        Loading the assignment…
      </p>
    );
  if (q.isError)
    return (
      <Alert tone="error" title="This assignment could not be opened">
        {errorWords(q.error)} <Link href="/learn">Back to Today</Link>
      </Alert>
    );
  const a = q.data;
  const current = a.stages.find((s) => s.index === a.current) ?? null;
  const active = a.status === "active";
  return (
    <div className="flex flex-col gap-6">
      <header className="flex flex-col gap-1">
        <p className="text-small font-semibold tracking-widest text-cedar uppercase">Assignment</p>
        <h1 className="text-h2 font-semibold">{a.tune.title}</h1>
        <p data-testid="due">
          {`Due ${a.dueLocal} (${a.timeZone}) · from ${a.teacherName}`}
          {a.overdue ? (
            <span className="ml-2 rounded-knot bg-berry-tint px-2 py-0.5 text-small font-semibold text-berry">
              Overdue
            </span>
          ) : null}
        </p>
        {a.unlockRule === "self_check_in" ? (
          <p className="text-small text-bark">{`After ${a.unlockMinutes ?? 0} minutes of logged practice on this tune since a stage opened, your own check-in signs it off.`}</p>
        ) : null}
      </header>
      {!active ? (
        <Alert tone="info" title="Withdrawn">
          Your teacher withdrew this assignment; its stages can&apos;t change.
        </Alert>
      ) : null}
      {a.note ? (
        <Card tone="warm">
          <CardTitle level={2}>Note from your teacher</CardTitle>
          <p className="whitespace-pre-line">{a.note}</p>
        </Card>
      ) : null}
      {!a.musicOpen ? (
        <Alert tone="warning" title="The music is closed">
          {a.closedWhy}
        </Alert>
      ) : null}
      <section className="flex flex-col gap-3" aria-labelledby="stages-h">
        <h2 id="stages-h" className="font-serif text-h3 font-semibold">
          Stages
        </h2>
        <StageList assignment={a} />
      </section>
      {a.music ? (
        <section className="flex flex-col gap-3" aria-labelledby="music-h">
          <h2 id="music-h" className="font-serif text-h3 font-semibold">{`Stage ${a.music.index}: ${a.music.name}`}</h2>
          <Suspense
            fallback={
              <p role="status" className="text-bark">
                Getting the music ready…
              </p>
            }
          >
            <AssignmentMusic music={a.music} title={a.tune.title} />
          </Suspense>
        </section>
      ) : null}
      {active && a.musicOpen && current ? (
        <Card as="section" aria-labelledby="checkin-h" className="flex flex-col gap-3">
          <CardTitle level={2}>
            <span id="checkin-h">{`Check in stage ${current.index}`}</span>
          </CardTitle>
          {current.state === "open" ? (
            <CheckInForm
              assignmentStudentId={a.assignmentStudentId}
              stageIndex={current.index}
              stageName={current.name}
              onDone={refresh}
            />
          ) : current.checkIn?.status === "waiting" ? (
            <Withdraw checkInId={current.checkIn.id} onDone={refresh} />
          ) : null}
        </Card>
      ) : null}
      {a.selfCheck ? (
        <Card as="section" aria-labelledby="selfcheck-h" className="flex flex-col gap-3">
          <CardTitle level={2}>
            <span id="selfcheck-h">{`Your last recording: stage ${a.selfCheck.stageIndex}, as the app heard it`}</span>
          </CardTitle>
          <Suspense
            fallback={
              <p role="status" className="text-bark">
                Getting the recording ready…
              </p>
            }
          >
            <SelfCheckView selfCheck={a.selfCheck} title={a.tune.title} />
          </Suspense>
        </Card>
      ) : null}
      {active && a.current === null && a.stages.length > 0 ? (
        <Alert tone="success" title="All stages signed off">
          Well done: every stage of this tune is signed off.
        </Alert>
      ) : null}
    </div>
  );
}
