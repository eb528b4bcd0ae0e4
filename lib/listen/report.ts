// From the alignment to what the teacher reads: each bar's notes as heard, its verdict and reasons,
// the extra notes, where the playing stopped, the tempo and the intonation.
import { PAUSE_SECONDS, semitonesOff, type Step } from "./align";
import { pitchName, type Score } from "./expected";
import type { HeardNote } from "./notes";
import { summarise } from "./summary";
import { tempoOf, type TimedVisit } from "./tempo";
import type { BarReport, ExtraNote, HeardNoteReport, ListenResult, StopReport } from "./types";

/** A note this far from the recording's own tuning is worth a listen (cents; about a quarter of a semitone). */
export const OUT_OF_TUNE = 25;
// A silence this long inside the music, with no restart, is a stop (seconds).
const STOP_SECONDS = 1.5;

interface Visit extends TimedVisit {
  note: number;
  heard: number | null;
}

const cents = (midi: number) => Math.round((midi - Math.round(midi)) * 100);
const round2 = (x: number) => Math.round(x * 100) / 100;

function median(values: number[]): number | null {
  if (!values.length) return null;
  const s = [...values].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : Math.round((s[m - 1] + s[m]) / 2);
}

/** Walks the alignment: the visits to written notes in playing order, extras, and where it stopped. */
function walk(steps: Step[], score: Score, heard: HeardNote[]) {
  const visits: Visit[] = [];
  const extras: { heard: number; bar: number | null; ornament: boolean; after: number }[] = [];
  const stops: StopReport[] = [];
  let beat = 0;
  let segment = 0;
  let pass = -1;
  let lastBar: number | null = null;
  let position = 0;
  for (const s of steps) {
    if (s.kind === "jump") {
      position = s.to;
      if (s.free) continue;
      segment++;
      lastBar = null;
      const before = s.heard > 0 ? heard[s.heard - 1] : null;
      const last = visits[visits.length - 1];
      if (before && last)
        stops.push({
          at: round2(before.end),
          bar: score.notes[last.note].bar,
          restartBar: score.notes[s.to]?.bar ?? null,
        });
      continue;
    }
    if (s.kind === "extra") {
      const last = visits[visits.length - 1];
      // short notes around an ornamented note are the ornament's own (a roll, a cut, grace notes)
      const ornament = Boolean((last && score.notes[last.note].ornament) || score.notes[position]?.ornament);
      extras.push({
        heard: s.heard,
        bar: last && position < score.notes.length ? score.notes[last.note].bar : null,
        ornament,
        after: visits.length, // the visits before it
      });
      continue;
    }
    const note = score.notes[s.note];
    if (note.bar !== lastBar) pass++;
    lastBar = note.bar;
    const h = s.kind === "match" ? s.heard : null;
    visits.push({ note: s.note, heard: h, bar: note.bar, pass, beat, at: h === null ? null : heard[h].start, segment });
    beat += note.span;
    position = s.note + 1;
  }
  // An extra note late in the time between two notes of different bars, just before the bar line, is
  // the next bar's (a note added on the way into a bar).
  for (const x of extras) {
    const before = visits[x.after - 1];
    const next = visits.slice(x.after).find((v) => v.at !== null);
    if (before?.at == null || next?.at == null || before.bar === next.bar || before.segment !== next.segment) continue;
    if (heard[x.heard].start >= before.at + 0.75 * (next.at - before.at)) x.bar = next.bar;
  }
  return { visits, extras, stops, position };
}

/** Times for missed notes: between the heard notes around them, by their beats. */
function placeMisses(visits: Visit[]): Map<Visit, number> {
  const placed = new Map<Visit, number>();
  const timed = visits.filter((v) => v.at !== null);
  for (const v of visits) {
    if (v.at !== null) continue;
    const before = [...timed].reverse().find((t) => t.segment === v.segment && t.beat < v.beat);
    const after = timed.find((t) => t.segment === v.segment && t.beat > v.beat);
    if (before?.at != null && after?.at != null)
      placed.set(v, before.at + ((v.beat - before.beat) / (after.beat - before.beat)) * (after.at - before.at));
    else if (before?.at != null) placed.set(v, before.at);
    else if (after?.at != null) placed.set(v, after.at);
  }
  return placed;
}

export function buildReport(
  score: Score,
  heard: HeardNote[],
  steps: Step[],
  seconds: number,
  expectedTempo: number | null,
): ListenResult {
  const flats = score.notes.some((n) => n.name.includes("b"));
  const walked = walk(steps, score, heard);
  const { visits, stops } = walked;
  // Pauses inside the music without a restart are stops too.
  for (let k = 1; k < visits.length; k++) {
    const a = visits[k - 1];
    const b = visits[k];
    if (a.heard === null || b.heard === null || a.segment !== b.segment) continue;
    if (heard[b.heard].start - heard[a.heard].end >= Math.max(STOP_SECONDS, PAUSE_SECONDS))
      stops.push({ at: round2(heard[a.heard].end), bar: a.bar, restartBar: b.bar });
  }
  const lastHeard = [...visits].reverse().find((v) => v.heard !== null);
  const remaining = score.notes.slice(walked.position);
  const remainingBeats = remaining.reduce((a, n) => a + n.span, 0);
  if (remaining.length && lastHeard && lastHeard.heard !== null) {
    if (remainingBeats < 1) {
      // the last note or two not heard: missed notes, not a stop
      for (const n of remaining)
        visits.push({
          note: n.index,
          heard: null,
          bar: n.bar,
          pass: lastHeard.pass + 1,
          beat: 0,
          at: null,
          segment: -1,
        });
    } else stops.push({ at: round2(heard[lastHeard.heard].end), bar: lastHeard.bar, restartBar: null });
  }
  stops.sort((a, b) => a.at - b.at);

  const rightCents = visits
    .filter((v) => v.heard !== null && semitonesOff(heard[v.heard].midi, score.notes[v.note].midi) === 0)
    .map((v) => cents(heard[v.heard as number].midi));
  const tuning = median(rightCents);
  const missedAt = placeMisses(visits);

  const bars: BarReport[] = score.bars.map((b) => {
    const mine = visits.filter((v) => v.bar === b.number && v.note >= b.first && v.note < b.end);
    const reasons: string[] = [];
    const notes: HeardNoteReport[] = mine.map((v) => {
      const e = score.notes[v.note];
      const at = v.at ?? missedAt.get(v) ?? null;
      if (v.heard === null) {
        reasons.push(`${e.name} not heard`);
        return { expected: e.name, heard: null, cents: null, at: at === null ? null : round2(at), off: null };
      }
      const h = heard[v.heard];
      const off = semitonesOff(h.midi, e.midi);
      const c = cents(h.midi);
      const name = pitchName(Math.round(h.midi), flats);
      if (off !== 0) {
        const n = Math.abs(off);
        reasons.push(`${name} heard for ${e.name} (${n} semitone${n === 1 ? "" : "s"} ${off > 0 ? "high" : "low"})`);
      } else if (Math.abs(c - (tuning ?? 0)) >= OUT_OF_TUNE)
        reasons.push(`${e.name} ${Math.abs(c)} cents ${c > 0 ? "sharp" : "flat"}`);
      return { expected: e.name, heard: name, cents: c, at: round2(h.start), off };
    });
    const visited = new Set(mine.map((v) => v.note));
    for (let k = b.first; k < b.end; k++)
      if (!visited.has(k)) notes.push({ expected: score.notes[k].name, heard: null, cents: null, at: null, off: null });
    const passes = new Set(mine.filter((v) => v.heard !== null).map((v) => v.pass));
    for (const x of walked.extras.filter((x) => x.bar === b.number && !x.ornament))
      reasons.push(`an extra ${pitchName(Math.round(heard[x.heard].midi), flats)}`);
    const heardOnce = passes.size > 0;
    if (heardOnce && visited.size < b.end - b.first) reasons.push("stopped in this bar");
    const firstAt = mine.find((v) => v.at !== null)?.at ?? null;
    const barCents = median(notes.filter((n) => n.off === 0 && n.cents !== null).map((n) => n.cents as number));
    return {
      bar: b.number,
      verdict: b.end === b.first ? "clean" : !heardOnce ? "missed" : reasons.length ? "check" : "clean",
      at: firstAt === null ? null : round2(firstAt),
      heardTimes: passes.size,
      cents: barCents,
      reasons: heardOnce ? reasons : ["not played"],
      notes,
    };
  });

  const extra: ExtraNote[] = walked.extras.map((x) => {
    const h = heard[x.heard];
    return {
      heard: pitchName(Math.round(h.midi), flats),
      cents: cents(h.midi),
      at: round2(h.start),
      bar: x.bar,
      ornament: x.ornament,
    };
  });
  const beatsOf = new Map(score.bars.map((b) => [b.number, b.beats]));
  const tempo = tempoOf(
    visits.filter((v) => v.segment >= 0),
    score.beatName,
    (bar) => beatsOf.get(bar) ?? 0,
    expectedTempo,
  );
  const result: Omit<ListenResult, "summary"> = {
    tempo,
    bars,
    extra,
    stoppedAt: stops[0]?.at ?? null,
    stops,
    tuningCents: tuning,
    seconds: round2(seconds),
    notesHeard: heard.length,
  };
  return { ...result, summary: summarise(result) };
}
