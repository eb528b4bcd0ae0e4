// One rung of a ladder: its tune, its state in words and a mark (never colour alone), what opens
// the next rung, and — when locked — why.
import Link from "next/link";
import type { LadderRungJson, RungState } from "@/lib/catalogue/api-types";
import { tuneWords } from "@/components/catalogue/tune-words";
import { cx } from "@/components/ui/cx";

const STATE: Record<RungState, { words: string; mark: string; box: string }> = {
  done: { words: "Done", mark: "✓", box: "border-spruce bg-spruce-tint text-spruce" },
  inProgress: { words: "In progress", mark: "◐", box: "border-cedar bg-rosin-tint text-cedar" },
  open: { words: "Open", mark: "○", box: "border-slate bg-slate-tint text-slate" },
  locked: { words: "Locked", mark: "🔒︎", box: "border-grain border-dashed bg-sawdust text-bark" },
};

export function RungItem({ rung, last }: { rung: LadderRungJson; last: boolean }) {
  const s = STATE[rung.state];
  const locked = rung.state === "locked";
  const need = `stage ${rung.requiredStage}${rung.requiredStageName ? ` (${rung.requiredStageName})` : ""}`;
  return (
    <li className={cx("flex flex-col gap-2 rounded-knot border p-4 sm:flex-row sm:items-start sm:gap-4", locked ? "border-dashed border-grain bg-sawdust" : "border-line bg-paper")} data-rung-state={rung.state}>
      <span className={cx("inline-flex w-fit shrink-0 items-center gap-1.5 rounded-sm border px-2 py-0.5 text-small font-semibold", s.box)}>
        <span aria-hidden="true">{s.mark}</span>
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
        {locked ? (
          <p className="text-small font-semibold text-ink" data-locked-reason>{`Why it is locked: ${rung.reason ?? "not open yet."}`}</p>
        ) : !last ? (
          <p className="text-small text-bark">{`The next rung opens when you reach ${need} here.`}</p>
        ) : null}
      </div>
      {!locked ? (
        <Link href={`/learn/tunes/${rung.tuneId}`} className="shrink-0 self-start font-semibold" aria-label={`Practise ${rung.tuneTitle}`}>
          {rung.state === "done" ? "Practise again" : "Practise"}
        </Link>
      ) : null}
    </li>
  );
}
