// One rung of a ladder: its tune, its state in words and a mark (never colour alone), what opens
// the next rung, and — when locked — why.
import Link from "next/link";
import type { LadderRungJson, RungState } from "@/lib/catalogue/api-types";
import { tuneWords } from "@/lib/catalogue/tune-words";
import { cx } from "@/components/ui/cx";

const STATE: Record<RungState, { words: string; mark: string; box: string }> = {
  done: { words: "Done", mark: "✓", box: "border-spruce bg-spruce-tint text-spruce" },
  inProgress: { words: "In progress", mark: "◐", box: "border-cedar bg-rosin-tint text-cedar" },
  open: { words: "Open", mark: "○", box: "border-slate bg-slate-tint text-slate" },
  locked: { words: "Locked", mark: "", box: "border-grain border-dashed bg-sawdust text-bark" },
};

// Drawn, not a character: the lock has no glyph in many system fonts.
function LockIcon() {
  return (
    <svg aria-hidden="true" viewBox="0 0 12 14" className="size-3" fill="none" stroke="currentColor" strokeWidth="1.5">
      <path d="M3 6V4a3 3 0 0 1 6 0v2" />
      <rect x="1.5" y="6" width="9" height="7" rx="1.5" fill="currentColor" stroke="none" />
    </svg>
  );
}

export function RungItem({ rung, last, climbing }: { rung: LadderRungJson; last: boolean; climbing: boolean }) {
  const s = STATE[rung.state];
  const locked = rung.state === "locked";
  const need = `stage ${rung.requiredStage}${rung.requiredStageName ? ` (${rung.requiredStageName})` : ""}`;
  return (
    <li
      className={cx(
        "flex flex-col gap-2 rounded-knot border p-4 sm:flex-row sm:items-start sm:gap-4",
        locked ? "border-dashed border-grain bg-sawdust" : "border-line bg-paper",
      )}
      data-rung-state={rung.state}
    >
      <span
        className={cx(
          "inline-flex w-fit shrink-0 items-center gap-1.5 rounded-sm border px-2 py-0.5 text-small font-semibold",
          s.box,
        )}
      >
        {locked ? <LockIcon /> : <span aria-hidden="true">{s.mark}</span>}
        {s.words}
      </span>
      <div className="flex flex-1 flex-col gap-1">
        <h3 className="font-semibold">
          <span className="text-bark">{`Rung ${rung.position}: `}</span>
          {locked ? rung.tuneTitle : <Link href={`/learn/tunes/${rung.tuneId}`}>{rung.tuneTitle}</Link>}
          {rung.isTaster ? <span className="ml-2 text-caption font-normal text-bark">(free taster)</span> : null}
        </h3>
        <p className="text-small text-bark">
          {tuneWords(rung)}
          {!locked && rung.stageCount > 0 ? ` · reached stage ${rung.reached} of ${rung.stageCount}` : ""}
        </p>
        {!locked && climbing && rung.nextStageName !== null ? (
          <p className="text-small" data-next-stage>
            {`Next: check in stage ${rung.reached + 1}${rung.nextStageName ? ` (${rung.nextStageName})` : ""} on the tune page.`}
          </p>
        ) : null}
        {locked ? (
          <p
            className="text-small font-semibold text-ink"
            data-locked-reason
          >{`Why it is locked: ${rung.reason ?? "not open yet."}`}</p>
        ) : last ? null : rung.state === "done" ? (
          <p className="text-small text-bark">{`You reached ${need} here, so the next rung is open.`}</p>
        ) : (
          <p className="text-small text-bark">{`The next rung opens when you reach ${need} here.`}</p>
        )}
      </div>
      {!locked ? (
        <Link href={`/learn/tunes/${rung.tuneId}`} className="shrink-0 self-start font-semibold">
          {/* The name read out says which tune; the words shown stay short (and part of that name). */}
          Practise<span className="sr-only"> {rung.tuneTitle}</span>
          {rung.state === "done" ? " again" : ""}
        </Link>
      ) : null}
    </li>
  );
}
