// A performance of a stage as a list of notes to render, with the truth of what was played: the
// repeats taken, a tempo that may drift, a late start, a stop and restart, and known faults (wrong,
// missed and extra notes, notes played sharp or flat). The renderer plays it; tests compare what the
// listening aid heard with this truth.
import { readScore, type Score } from "./expected";
import { seeded, type RenderNote } from "./render";

export interface PerformOptions {
  bpm: number; // beats of the meter per minute at the start
  /** Tempo change over the whole performance: 0.1 ends 10 % faster, −0.1 10 % slower (linear in beats). */
  drift?: number;
  repeats?: "play" | "skip";
  lateStart?: number; // seconds of silence first
  /** Share of notes given each fault (0–1), chosen by `seed`. */
  faults?: { wrong?: number; missed?: number; extra?: number; detune?: number; detuneCents?: number };
  /** Stop after this many notes played, pause, and start again from the start of `restartBar`. */
  stop?: { afterNotes: number; pauseSeconds: number; restartBar: number };
  seed?: number;
  /** How much of a note's time it sounds (the rest is the bow's change). */
  legato?: number;
}

export type Played = "right" | "wrong" | "missed" | "detuned";

export interface TruthNote {
  note: number; // index of the written note (Score.notes)
  bar: number;
  played: Played;
  midi: number | null; // what was played, null when missed
  cents: number;
  at: number; // when it started (or was due), seconds
  beat: number; // beats into the performance
}

export interface Performance {
  score: Score;
  notes: RenderNote[];
  truth: TruthNote[];
  extras: { midi: number; at: number; afterNote: number }[];
  seconds: number;
  /** The performance's beat → seconds map (the tempo the renderer played). */
  timeAt: (beat: number) => number;
}

/** The order the written notes are played in: through each repeat once (or not), over first endings. */
export function playingOrder(score: Score, repeats: "play" | "skip"): number[] {
  const order: number[] = [];
  const taken = new Set<number>();
  let p = 0;
  for (let guard = 0; guard < score.notes.length * 4 + 8; guard++) {
    const back = score.jumps.findIndex((j, k) => j.from === p && j.to < j.from && !taken.has(k));
    const over = score.jumps.find(
      (j) => j.from === p && j.to > j.from && [...taken].some((k) => score.jumps[k].from > p && score.jumps[k].to <= p),
    );
    if (over) p = over.to;
    else if (back >= 0 && repeats === "play") {
      taken.add(back);
      p = score.jumps[back].to;
      continue;
    } else if (back >= 0) taken.add(back);
    if (p >= score.notes.length) break;
    order.push(p++);
  }
  return order;
}

export function perform(abc: string, opts: PerformOptions): Performance {
  const read = readScore(abc);
  if (!read.ok) throw new Error(read.problems.map((p) => p.message).join("; "));
  const score = read.score;
  const random = seeded(opts.seed ?? 1);
  let order = playingOrder(score, opts.repeats ?? "play");
  if (opts.stop) {
    const { afterNotes, restartBar } = opts.stop;
    // again from the start of the latest pass through restartBar before the stop
    let restart = -1;
    for (let i = 0; i < Math.min(afterNotes, order.length); i++)
      if (score.notes[order[i]].bar === restartBar && score.notes[order[i - 1]]?.bar !== restartBar) restart = i;
    if (restart < 0) throw new Error(`bar ${restartBar} is not played before note ${afterNotes}`);
    order = [...order.slice(0, afterNotes), -1, ...order.slice(restart)];
  }
  const totalBeats = order.reduce((a, k) => a + (k >= 0 ? score.notes[k].span : 0), 0);
  // The tempo is linear in beats (bpm·(1 + c·beat)), so time is its integral: 60·ln(1 + c·beat)/(bpm·c).
  const c = (opts.drift ?? 0) / Math.max(1, totalBeats);
  const timeAt = (beat: number) =>
    Math.abs(c) < 1e-12 ? (60 * beat) / opts.bpm : (60 * Math.log(1 + c * beat)) / (opts.bpm * c);
  const legato = opts.legato ?? 0.95;
  const f = opts.faults ?? {};
  const notes: RenderNote[] = [];
  const truth: TruthNote[] = [];
  const extras: Performance["extras"] = [];
  let beat = 0;
  let shift = opts.lateStart ?? 0;
  order.forEach((k, i) => {
    if (k < 0) {
      shift += opts.stop?.pauseSeconds ?? 2;
      return;
    }
    const n = score.notes[k];
    const at = shift + timeAt(beat);
    const length = timeAt(beat + n.span) - timeAt(beat);
    beat += n.span;
    const prev = score.notes[order[i - 1]]?.midi;
    const next = score.notes[order[i + 1]]?.midi;
    // Faults only where they are unambiguous: never on the first notes, never between equal neighbours.
    const free = i >= 2 && prev !== n.midi && next !== n.midi && prev !== undefined && next !== undefined;
    const roll = random();
    let edge = 0;
    const pick = (share: number | undefined) => free && share !== undefined && roll >= edge && roll < (edge += share);
    const base: Omit<TruthNote, "played" | "midi" | "cents"> = { note: k, bar: n.bar, at, beat: beat - n.span };
    if (pick(f.missed)) {
      truth.push({ ...base, played: "missed", midi: null, cents: 0 });
      return;
    }
    if (pick(f.wrong)) {
      const choices = [-2, -1, 1, 2].map((d) => n.midi + d).filter((m) => m !== prev && m !== next);
      const midi = choices[Math.floor(random() * choices.length)];
      truth.push({ ...base, played: "wrong", midi, cents: 0 });
      notes.push({ midi, start: at, duration: length * legato });
      return;
    }
    if (pick(f.detune)) {
      const cents = (random() < 0.5 ? -1 : 1) * (f.detuneCents ?? 30);
      truth.push({ ...base, played: "detuned", midi: n.midi, cents });
      notes.push({ midi: n.midi, cents, start: at, duration: length * legato });
      return;
    }
    truth.push({ ...base, played: "right", midi: n.midi, cents: 0 });
    if (pick(f.extra) && length > 0.16) {
      // the note cut to half its time and an extra note, a third away from every neighbour, in the other half
      const midi = [3, -3, 4, -4].map((d) => n.midi + d).find((m) => m !== prev && m !== next) ?? n.midi + 5;
      notes.push({ midi: n.midi, start: at, duration: (length / 2) * legato });
      notes.push({ midi, start: at + length / 2, duration: (length / 2) * legato });
      extras.push({ midi, at: at + length / 2, afterNote: k });
      return;
    }
    notes.push({ midi: n.midi, start: at, duration: length * legato });
  });
  return { score, notes, truth, extras, seconds: shift + timeAt(beat) + 0.5, timeAt };
}
