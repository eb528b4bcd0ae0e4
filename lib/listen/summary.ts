// The one line a teacher reads first: "3 bars to listen to: 5, 6, 14; tempo 92→84 bpm".
import type { ListenResult } from "./types";

/** Bar numbers as a short list: runs of three or more become ranges ("5, 6, 9–12"). */
export function barList(bars: number[]): string {
  const sorted = [...new Set(bars)].sort((a, b) => a - b);
  const parts: string[] = [];
  for (let i = 0; i < sorted.length;) {
    let j = i;
    while (j + 1 < sorted.length && sorted[j + 1] === sorted[j] + 1) j++;
    if (j - i >= 2) parts.push(`${sorted[i]}–${sorted[j]}`);
    else for (let k = i; k <= j; k++) parts.push(String(sorted[k]));
    i = j + 1;
  }
  return parts.join(", ");
}

export function clock(seconds: number): string {
  const s = Math.max(0, Math.round(seconds));
  return `${Math.floor(s / 60)}:${String(s % 60).padStart(2, "0")}`;
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

export function summarise(r: Omit<ListenResult, "summary">): string {
  if (r.notesHeard === 0) return "No playing heard in the recording.";
  const check = r.bars.filter((b) => b.verdict === "check").map((b) => b.bar);
  const missed = r.bars.filter((b) => b.verdict === "missed").map((b) => b.bar);
  const parts: string[] = [];
  parts.push(
    check.length
      ? `${plural(check.length, "bar")} to listen to: ${barList(check)}`
      : missed.length
        ? "every bar played sounded as written"
        : "every bar sounded as written",
  );
  if (missed.length) parts.push(`${missed.length === 1 ? "bar" : "bars"} ${barList(missed)} not played`);
  const stop = r.stops[0];
  if (stop)
    parts.push(
      stop.restartBar === null
        ? `stopped in bar ${stop.bar} (${clock(stop.at)})`
        : `stopped in bar ${stop.bar} (${clock(stop.at)}), on again from bar ${stop.restartBar}`,
    );
  if (r.tempo.start !== null && r.tempo.end !== null)
    parts.push(`tempo ${Math.round(r.tempo.start)}→${Math.round(r.tempo.end)} bpm`);
  if (r.tuningCents !== null && Math.abs(r.tuningCents) >= 15)
    parts.push(`tuned ${Math.abs(r.tuningCents)} cents ${r.tuningCents > 0 ? "sharp" : "flat"}`);
  const line = parts.join("; ");
  return `${line.charAt(0).toUpperCase()}${line.slice(1)}.`;
}
