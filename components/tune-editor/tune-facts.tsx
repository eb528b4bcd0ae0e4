// Title, type, key and meter as the ABC states them (read, not typed twice).
import type { TuneType } from "@/lib/tunes/header";

export interface TuneFactsProps {
  title: string;
  tuneType: TuneType;
  keyName: string;
  meter: string;
}

export function TuneFacts({ title, tuneType, keyName, meter }: TuneFactsProps) {
  const facts: [string, string, string][] = [
    ["Title", title || "—", "T:"],
    ["Type", tuneType, "R:"],
    ["Key", keyName || "—", "K:"],
    ["Meter", meter || "—", "M:"],
  ];
  return (
    <div>
      <dl className="grid grid-cols-2 gap-x-6 gap-y-2 sm:grid-cols-4" aria-label="Read from the ABC">
        {facts.map(([label, value, field]) => (
          <div key={label} className="rounded-knot border border-line bg-paper px-3 py-2">
            <dt className="text-caption text-bark">
              {label} <span className="font-mono">({field})</span>
            </dt>
            <dd className="font-semibold" data-fact={label.toLowerCase()}>
              {value}
            </dd>
          </div>
        ))}
      </dl>
      {tuneType === "other" ? (
        <p className="mt-1 text-caption text-bark">
          Add an R: line (for example R:reel or R:slip jig) to give the tune its type.
        </p>
      ) : null}
    </div>
  );
}
