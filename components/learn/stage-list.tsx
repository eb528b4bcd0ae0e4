// The stages of an assignment with their state; colour is never the only cue (each says its state).
import type { LearnAssignment, LearnStage } from "@/lib/teaching/learn-assignment";
import { cx } from "@/components/ui/cx";

const WORDS: Record<LearnStage["state"], string> = {
  locked: "Locked",
  open: "Open",
  checked_in: "Checked in",
  signed_off: "Signed off",
};
const TONE: Record<LearnStage["state"], string> = {
  locked: "bg-sawdust text-bark",
  open: "bg-rosin-tint text-cedar",
  checked_in: "bg-slate-tint text-slate",
  signed_off: "bg-spruce-tint text-spruce",
};

function lockedWhy(a: LearnAssignment, s: LearnStage): string | null {
  if (s.state !== "locked") return null;
  if (!a.musicOpen) return a.closedWhy ?? null;
  const prev = a.stages.find((p) => p.index === s.index - 1);
  return prev ? `Opens when stage ${prev.index} (${prev.name}) is signed off.` : null;
}

export function StageList({ assignment }: { assignment: LearnAssignment }) {
  return (
    <ol className="flex flex-col gap-2" aria-label="Stages">
      {assignment.stages.map((s) => {
        const why = lockedWhy(assignment, s);
        const feedback = s.checkIn?.feedback && s.checkIn.status !== "waiting" ? s.checkIn.feedback : null;
        return (
          <li
            key={s.index}
            data-stage={s.index}
            data-state={s.state}
            className="rounded-knot border border-line bg-paper px-4 py-3"
          >
            <div className="flex flex-wrap items-center justify-between gap-2">
              <span className="font-semibold">{`Stage ${s.index}: ${s.name}`}</span>
              <span className={cx("rounded-knot px-2 py-0.5 text-small font-semibold", TONE[s.state])}>
                {WORDS[s.state]}
              </span>
            </div>
            {why ? <p className="mt-1 text-small text-bark">{why}</p> : null}
            {s.state === "checked_in" ? (
              <p className="mt-1 text-small text-bark">Your check-in waits for your teacher&apos;s review.</p>
            ) : null}
            {s.state === "open" && s.checkIn?.status === "needs_more_time" ? (
              <p className="mt-1 text-small text-bark">Your teacher asked for more time on this stage.</p>
            ) : null}
            {feedback ? (
              <blockquote className="mt-2 border-l-4 border-line pl-3 whitespace-pre-line">{feedback}</blockquote>
            ) : null}
          </li>
        );
      })}
    </ol>
  );
}
