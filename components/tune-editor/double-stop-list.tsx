"use client";
// The note each double stop keeps in the stages before double stops come back, bar by bar, with
// the reason the engine read it so; a teacher turns a bar to its other voice (saved with the tune).
import { Button } from "@/components/ui/button";
import type { StopChoice, Voice } from "@/lib/abc/double-stops";

export interface DoubleStopListProps {
  choices: readonly StopChoice[];
  turned: Readonly<Record<string, Voice>>;
  onTurn: (barIndex: number, voice: Voice | null) => void;
}

const letter = (name: string): string => name.replace(/-?\d+$/, "");

function why(c: StopChoice): string {
  switch (c.reason) {
    case "held":
      return `the ${c.keep === "upper" ? "lower" : "upper"} note is held or struck again while this one moves`;
    case "open":
      return `the open ${letter(c.otherName)} string rings beside it`;
    case "continues":
      return "the tune goes on from this open string";
    case "cadence":
      return "the tonic on the open string closes the phrase";
    case "parallel":
      return "both voices move together: the top line is the tune";
    case "teacher":
      return "turned by you";
    case "setting":
      return "the side chosen for the whole tune";
    default:
      return "the melody usually rides on top";
  }
}

interface BarStops {
  barIndex: number;
  bar: number;
  part: string;
  list: StopChoice[];
}

function byBar(choices: readonly StopChoice[]): BarStops[] {
  const bars: BarStops[] = [];
  for (const c of choices) {
    const last = bars[bars.length - 1];
    if (last?.barIndex === c.barIndex) last.list.push(c);
    else bars.push({ barIndex: c.barIndex, bar: c.bar, part: c.part, list: [c] });
  }
  return bars;
}

export function DoubleStopList({ choices, turned, onTurn }: DoubleStopListProps) {
  const bars = byBar(choices);
  if (bars.length === 0) return null;
  return (
    <details className="rounded-knot border border-line px-2 py-1 text-caption" data-testid="double-stops">
      <summary className="cursor-pointer font-semibold">
        Double stops: the note kept in {bars.length} bar{bars.length === 1 ? "" : "s"}
      </summary>
      <p className="py-1 text-bark">
        Until double stops come back, each keeps the note read as the tune. Turn a bar if your students should keep the
        other note.
      </p>
      <ul className="flex flex-col gap-1">
        {bars.map((b) => {
          const own = turned[String(b.barIndex)];
          const upper = b.list.every((c) => c.keep === "upper");
          const other: Voice = upper ? "lower" : "upper";
          const where = `bar ${b.bar}${b.part !== "A" || bars.some((x) => x.part !== "A") ? ` (${b.part})` : ""}`;
          return (
            <li key={b.barIndex} className="flex flex-col gap-1 border-t border-line pt-1" data-bar={b.barIndex}>
              <span>
                <span className="font-semibold">{where[0]?.toUpperCase() + where.slice(1)}:</span>{" "}
                {b.list.map((c) => `keeps ${c.keptName}, not ${c.otherName} — ${why(c)}`).join("; ")}
              </span>
              <span>
                {own ? (
                  <Button size="sm" variant="quiet" onClick={() => onTurn(b.barIndex, null)}>
                    Back to the notes read for {where}
                  </Button>
                ) : (
                  <Button size="sm" variant="secondary" onClick={() => onTurn(b.barIndex, other)}>
                    Keep the {other} note in {where}
                  </Button>
                )}
              </span>
            </li>
          );
        })}
      </ul>
    </details>
  );
}
