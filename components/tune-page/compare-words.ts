// A setting comparison (lib/abc/compare.ts) in plain words for the tune page.
import type { BarComparison, NoteDifference, NoteSide } from "@/lib/abc/compare";

const side = (s: NoteSide | null): string =>
  !s ? "nothing" : s.note === "rest" ? "a rest" : `${s.note} (${s.duration})`;

export function differenceWords(d: NoteDifference): string {
  const at = `Beat ${Number.isInteger(d.beat) ? d.beat : d.beat.toFixed(2)}`;
  if (d.kind === "pitch") return `${at}: this stage plays ${side(d.first)}, the other setting ${side(d.second)}.`;
  if (d.kind === "duration")
    return `${at}: same note, held differently — ${side(d.first)} here, ${side(d.second)} there.`;
  if (d.kind === "onlyInFirst") return `${at}: only this stage starts a note here (${side(d.first)}).`;
  return `${at}: only the other setting starts a note here (${side(d.second)}).`;
}

export function barWords(b: BarComparison): string {
  const where = `Part ${b.part}, ${b.place}`;
  if (b.status === "onlyInFirst") return `${where}: only in this stage.`;
  if (b.status === "onlyInSecond") return `${where}: only in the other setting.`;
  const count = b.differences.length;
  return `${where}: ${count} difference${count === 1 ? "" : "s"}${b.lengthDiffers ? ", and the bar's length differs" : ""}.`;
}
