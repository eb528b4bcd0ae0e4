// The phrase map in words: parts and phrases with their form letters, the twins and what differs,
// the patterns across parts, and the learning load.
import { barsText, phraseLabel, twinWords } from "@/components/notation";
import type { PhraseMap, Twin } from "@/lib/abc/phrase-types";

export interface PhrasePanelProps {
  map: PhraseMap;
  /** Distinct phrases with the swaps the teacher accepted. */
  acceptedLoad: number;
  acceptedCount: number;
}

function differenceWords(t: Twin): string {
  if (t.kind === "exact") return "identical";
  return t.differences
    .map(
      (d) =>
        `bar ${d.secondBar} beat ${Number.isInteger(d.beat) ? d.beat : d.beat.toFixed(1)}: ${d.secondNote} where ${t.first} has ${d.firstNote}`,
    )
    .join("; ");
}

export function PhrasePanel({ map, acceptedLoad, acceptedCount }: PhrasePanelProps) {
  const phrases = map.parts.flatMap((p) => p.phrases).length;
  return (
    <div className="flex flex-col gap-5">
      <div className="rounded-knot border border-line bg-sawdust px-4 py-3" data-testid="learning-load">
        <p className="font-semibold">Learning load</p>
        <p className="text-small">
          {phrases} phrases on the page, <strong>{map.learningLoad.distinct} distinct</strong> to learn;{" "}
          {map.learningLoad.afterSwaps} if every near twin is swapped; <strong>{acceptedLoad}</strong> with the{" "}
          {acceptedCount} swap{acceptedCount === 1 ? "" : "s"} you accepted.
        </p>
      </div>
      <div className="grid gap-3 md:grid-cols-2">
        {map.parts.map((part) => (
          <section
            key={part.label}
            className="rounded-knot border border-line bg-paper p-3"
            aria-label={`Part ${part.label}`}
          >
            <h4 className="font-semibold">Part {part.label}</h4>
            <p className="text-caption text-bark">
              {part.countedBars} bars; {part.grouping.reason}
              {part.endings ? `; ${part.endings}` : ""}
            </p>
            <ul className="mt-2 flex flex-col gap-1 text-small">
              {part.phrases.map((p) => (
                <li key={p.id}>
                  <span className="font-mono font-semibold">{phraseLabel(p)}</span> · {barsText(p)}
                  {twinWords(map, p.id) ? <span className="text-bark"> — {twinWords(map, p.id)}</span> : null}
                </li>
              ))}
            </ul>
          </section>
        ))}
      </div>
      <section aria-labelledby="twins-heading">
        <h4 id="twins-heading" className="font-semibold">
          Twins
        </h4>
        {map.twins.length ? (
          <ul className="mt-1 flex flex-col gap-1 text-small">
            {map.twins.map((t) => (
              <li key={`${t.first}-${t.second}`}>
                <span className="font-semibold">
                  {t.second} {t.kind === "exact" ? "=" : "≈"} {t.first}
                </span>{" "}
                (
                {t.kind === "exact"
                  ? "exact twin"
                  : `near twin, ${t.differingNotes} note${t.differingNotes === 1 ? "" : "s"} differ`}
                {t.partial ? ", compared over the shorter" : ""}): {differenceWords(t)}
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-small text-bark">No phrase repeats another.</p>
        )}
      </section>
      <section aria-labelledby="patterns-heading">
        <h4 id="patterns-heading" className="font-semibold">
          Patterns across the tune
        </h4>
        {map.patterns.length ? (
          <ul className="mt-1 list-disc pl-5 text-small">
            {map.patterns.map((p, i) => (
              <li key={i}>{p.description}</li>
            ))}
          </ul>
        ) : (
          <p className="text-small text-bark">
            None of the usual patterns (phrase 1 = phrase 3, shared last phrase, shared second half).
          </p>
        )}
      </section>
    </div>
  );
}
