"use client";
// The listening aid's strip: one button per bar of the stage, marked by what was heard — a word and a
// shape for each verdict (a level line: as written; a raised notch: listen here; an open gap: not
// played), colour only helping. Each button's name says the bar, the verdict and why, for screen
// readers; pressing it plays the recording from that bar.
import { clock } from "@/lib/listen/summary";
import type { BarReport, Verdict } from "@/lib/listen/types";
import { cx } from "@/components/ui/cx";

const WORDS: Record<Verdict, string> = { clean: "as written", check: "listen", missed: "not played" };
const TONE: Record<Verdict, string> = {
  clean: "border-line bg-paper text-spruce",
  check: "border-cedar bg-rosin-tint text-cedar",
  missed: "border-dashed border-grain bg-sawdust text-bark",
};

/** The verdict's shape: drawn, so it does not hang on a font's glyphs. */
function Mark({ verdict }: { verdict: Verdict }) {
  return (
    <svg viewBox="0 0 24 10" width="24" height="10" aria-hidden="true" className="block">
      {verdict === "clean" ? <path d="M2 5H22" stroke="currentColor" strokeWidth="2.5" /> : null}
      {verdict === "check" ? (
        <path d="M2 8H8L12 2L16 8H22" fill="none" stroke="currentColor" strokeWidth="2.5" strokeLinejoin="round" />
      ) : null}
      {verdict === "missed" ? <path d="M2 5H8M16 5H22" stroke="currentColor" strokeWidth="2.5" /> : null}
    </svg>
  );
}

const barName = (b: BarReport): string => (b.bar === 0 ? "pickup" : `bar ${b.bar}`);

const why = (b: BarReport): string => (b.verdict === "clean" ? "" : `: ${b.reasons.join("; ")}`);
const playsFrom = (b: BarReport): string => (b.at === null ? "" : `. Plays from ${clock(b.at)}`);

/** The bar's verdict as a sentence, e.g. "Bar 6, listen: A4 not heard. Plays from 0:07". */
export function barWords(b: BarReport): string {
  return `Bar ${b.bar}, ${WORDS[b.verdict]}${why(b)}${playsFrom(b)}`;
}

/** The button's name begins with the words it shows, as they read (WCAG 2.2 §2.5.3, label in name). */
const buttonName = (b: BarReport): string => `${barName(b)} ${WORDS[b.verdict]}${why(b)}${playsFrom(b)}`;

export function BarStrip({
  bars,
  selected,
  onSelect,
  label,
}: {
  bars: BarReport[];
  selected: number | null;
  onSelect: (bar: BarReport) => void;
  label: string;
}) {
  return (
    <ol aria-label={label} className="flex flex-wrap gap-1.5" data-testid="bar-strip">
      {bars.map((b) => (
        <li key={b.bar}>
          <button
            type="button"
            data-bar={b.bar}
            data-verdict={b.verdict}
            data-at={b.at ?? undefined}
            aria-pressed={selected === b.bar}
            aria-label={buttonName(b)}
            title={b.verdict === "clean" ? undefined : b.reasons.join("; ")}
            disabled={b.at === null}
            onClick={() => onSelect(b)}
            className={cx(
              "flex min-w-14 flex-col items-center gap-0.5 rounded-knot border-2 px-2 py-1 text-caption",
              "focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-cedar",
              "disabled:cursor-default",
              TONE[b.verdict],
              selected === b.bar ? "ring-3 ring-slate" : "",
            )}
          >
            {/* The spaces keep the shown words apart for assistive technology; the flex layout ignores them. */}
            <span className="font-semibold text-ink">{barName(b)}</span> <Mark verdict={b.verdict} />{" "}
            <span>{WORDS[b.verdict]}</span>
          </button>
        </li>
      ))}
    </ol>
  );
}
