// Compare settings (issue 3 §7): two settings of one tune aligned bar by bar, with the notes that
// differ, so a student can adapt to another player's version.
import type { Bar, Fraction, MelodyNote, Problem, Result } from "./types";
import { buildModel, skeletonOf } from "./skeleton";
import { beatNumber, fullBarLength, pitchName, toNumber } from "./phrase-time";
import { findParts, type PartPlan } from "./phrase-parts";

export interface NoteSide {
  pitch: number | null; // MIDI, null for a rest
  note: string; // "D5", "rest"
  duration: string; // in whole notes, "1/8"
}

export interface NoteDifference {
  beat: number; // 1-based beat in the bar (of the first setting's meter)
  /** pitch: both play a note here, different pitches; duration: same pitch, other length;
   *  onlyInFirst / onlyInSecond: one setting starts a note here, the other holds or rests through. */
  kind: "pitch" | "duration" | "onlyInFirst" | "onlyInSecond";
  first: NoteSide | null; // the note starting here, or (for onlyInSecond) the one sounding
  second: NoteSide | null;
}

export interface BarComparison {
  part: string;
  /** Where the bar stands in its part: "pickup", "bar 3" (3rd counted bar of the first setting, or
   *  of the second when only it has the bar), "ending 2, bar 1". */
  place: string;
  firstBar: number | null; // bar number in each setting; null when only one setting has the bar
  secondBar: number | null;
  status: "equal" | "different" | "onlyInFirst" | "onlyInSecond";
  lengthDiffers: boolean;
  differences: NoteDifference[];
}

export interface Comparison {
  bars: BarComparison[];
  summary: { equal: number; different: number; onlyInFirst: number; onlyInSecond: number; notes: string[] };
}

export interface CompareOptions {
  /** "source" (default) compares the settings as written; "skeleton" compares their core melodies. */
  on?: "source" | "skeleton";
}

interface Shape {
  bars: Bar[];
  meter: Fraction;
}

export function compareSettings(a: string, b: string, opts: CompareOptions = {}): Result<Comparison> {
  const read = opts.on === "skeleton" ? skeletonOf : buildModel;
  const ra = read(a);
  const rb = read(b);
  const problems: Problem[] = [];
  if (!ra.ok) problems.push(...ra.problems.map((p) => ({ ...p, message: `first setting: ${p.message}` })));
  if (!rb.ok) problems.push(...rb.problems.map((p) => ({ ...p, message: `second setting: ${p.message}` })));
  const notes = [
    ...ra.notes.map((p) => ({ ...p, message: `first setting: ${p.message}` })),
    ...rb.notes.map((p) => ({ ...p, message: `second setting: ${p.message}` })),
  ];
  if (!ra.ok || !rb.ok) return { ok: false, problems, notes };
  return { ok: true, value: compareBars(ra.value, rb.value), notes };
}

/**
 * Bars of one part, grouped so the settings line up by part and place: pickups by order, the bars
 * as first played by an alignment that allows a bar added or missing in one setting, and other
 * endings by ending number and order.
 */
function groups(plan: PartPlan | undefined): { pickups: Bar[]; main: Bar[]; endings: Map<string, Bar> } {
  const endings = new Map<string, Bar>();
  for (const set of plan?.endingSets ?? []) {
    for (const alt of set.alternatives)
      alt.bars.forEach((b, i) => endings.set(`ending ${alt.ending}, bar ${i + 1}`, b));
  }
  return { pickups: plan?.pickups ?? [], main: plan?.main ?? [], endings };
}

/** Share of a bar's onsets that differ: 0 for equal bars, about 1 for unrelated ones. */
function barDistance(x: Bar, y: Bar, meter: Fraction): number {
  const d = diffNotes(x.notes, y.notes, meter).length;
  return d / Math.max(1, x.notes.length, y.notes.length);
}

// Two gaps cost more than one wholly different pair, so bars pair up unless a bar was really added.
const GAP_COST = 0.55;

/**
 * Needleman–Wunsch alignment of two bar sequences: pairs of indices, null where one side has no
 * bar. Two settings of one tune have about the same bars, so only a band around the diagonal is
 * filled (wide enough for the difference in length and a few bars added or missing): the cost
 * grows with the bar count, not with its square.
 */
function align(xs: Bar[], ys: Bar[], meter: Fraction): [number | null, number | null][] {
  const n = xs.length;
  const m = ys.length;
  const width = BAND + Math.ceil(n === 0 ? m : m / n) + Math.ceil(m === 0 ? n : n / m);
  const lo: number[] = [];
  const rows: Float64Array[] = [];
  for (let i = 0; i <= n; i++) {
    const centre = n === 0 ? 0 : Math.round((i * m) / n);
    const from = i === 0 ? 0 : Math.max(0, centre - width);
    const to = i === n ? m : Math.min(m, centre + width);
    lo.push(from);
    rows.push(new Float64Array(to - from + 1).fill(Infinity));
  }
  const at = (i: number, j: number): number => {
    const k = j - (lo[i] as number);
    const row = rows[i] as Float64Array;
    return k >= 0 && k < row.length ? (row[k] as number) : Infinity;
  };
  const dist = new Map<number, number>();
  const distance = (i: number, j: number): number => {
    const key = i * (m + 1) + j;
    let d = dist.get(key);
    if (d === undefined) {
      d = barDistance(xs[i] as Bar, ys[j] as Bar, meter);
      dist.set(key, d);
    }
    return d;
  };
  for (let i = 0; i <= n; i++) {
    const row = rows[i] as Float64Array;
    const from = lo[i] as number;
    for (let k = 0; k < row.length; k++) {
      const j = from + k;
      if (i === 0 || j === 0) {
        row[k] = (i + j) * GAP_COST;
        continue;
      }
      row[k] = Math.min(
        at(i - 1, j - 1) + distance(i - 1, j - 1),
        at(i - 1, j) + GAP_COST,
        (k > 0 ? (row[k - 1] as number) : Infinity) + GAP_COST,
      );
    }
  }
  const out: [number | null, number | null][] = [];
  let i = n;
  let j = m;
  while (i > 0 || j > 0) {
    const here = at(i, j);
    if (i > 0 && j > 0 && Math.abs(here - (at(i - 1, j - 1) + distance(i - 1, j - 1))) < 1e-9) {
      out.push([--i, --j]);
    } else if (i > 0 && Math.abs(here - (at(i - 1, j) + GAP_COST)) < 1e-9) out.push([--i, null]);
    else out.push([null, --j]);
  }
  return out.reverse();
}

/** Bars either side of the diagonal that the alignment looks at. */
const BAND = 8;

export function compareBars(a: Shape, b: Shape): Comparison {
  const pa = findParts(a.bars, fullBarLength(a.bars, a.meter));
  const pb = findParts(b.bars, fullBarLength(b.bars, b.meter));
  const notes: string[] = [];
  const sameLabels = pa.map((p) => p.label).join() === pb.map((p) => p.label).join();
  if (!sameLabels)
    notes.push(
      `parts differ (${pa.map((p) => p.label).join("")} and ${pb.map((p) => p.label).join("")}): parts are paired in order`,
    );
  if (a.meter.num !== b.meter.num || a.meter.den !== b.meter.den) {
    notes.push(
      `meters differ (${a.meter.num}/${a.meter.den} and ${b.meter.num}/${b.meter.den}): beats are counted in the first`,
    );
  }
  const bars: BarComparison[] = [];
  const pair = (part: string, place: string, bx: Bar | undefined, by: Bar | undefined): void => {
    if (bx === undefined || by === undefined) {
      const status = bx !== undefined ? "onlyInFirst" : "onlyInSecond";
      bars.push({
        part,
        place,
        firstBar: bx?.number ?? null,
        secondBar: by?.number ?? null,
        status,
        lengthDiffers: true,
        differences: [],
      });
      return;
    }
    const differences = diffNotes(bx.notes, by.notes, a.meter);
    const lengthDiffers = toNumber(bx.length) !== toNumber(by.length);
    const status = differences.length === 0 && !lengthDiffers ? "equal" : "different";
    bars.push({ part, place, firstBar: bx.number, secondBar: by.number, status, lengthDiffers, differences });
  };
  for (let p = 0; p < Math.max(pa.length, pb.length); p++) {
    const label = pa[p]?.label ?? pb[p]?.label ?? "?";
    const x = groups(pa[p]);
    const y = groups(pb[p]);
    for (let k = 0; k < Math.max(x.pickups.length, y.pickups.length); k++) {
      pair(label, k === 0 ? "pickup" : `pickup ${k + 1}`, x.pickups[k], y.pickups[k]);
    }
    if (pa[p] !== undefined && pb[p] !== undefined && x.main.length !== y.main.length) {
      notes.push(
        `part ${label} has ${x.main.length} bars in the first setting and ${y.main.length} in the second: bars are aligned so the added ones stand alone`,
      );
    }
    for (const [i, j] of align(x.main, y.main, a.meter)) {
      pair(label, `bar ${(i ?? j ?? 0) + 1}`, i === null ? undefined : x.main[i], j === null ? undefined : y.main[j]);
    }
    for (const place of new Set([...x.endings.keys(), ...y.endings.keys()]))
      pair(label, place, x.endings.get(place), y.endings.get(place));
  }
  const count = (s: BarComparison["status"]): number => bars.filter((x) => x.status === s).length;
  return {
    bars,
    summary: {
      equal: count("equal"),
      different: count("different"),
      onlyInFirst: count("onlyInFirst"),
      onlyInSecond: count("onlyInSecond"),
      notes,
    },
  };
}

const side = (n: MelodyNote | undefined): NoteSide | null =>
  n === undefined
    ? null
    : { pitch: n.pitch, note: pitchName(n.pitch), duration: `${n.duration.num}/${n.duration.den}` };

/**
 * The note attacked at each onset (a tied continuation is no new attack) and the note sounding
 * there. A bar's notes come in time order, so the note sounding at each onset is found by walking
 * each bar once.
 */
function diffNotes(x: MelodyNote[], y: MelodyNote[], meter: Fraction): NoteDifference[] {
  const key = (n: MelodyNote): number => Math.round(toNumber(n.onset) * 1e9);
  const end = (n: MelodyNote): number => Math.round((toNumber(n.onset) + toNumber(n.duration)) * 1e9);
  const attacks = (ns: MelodyNote[]): Map<number, MelodyNote> => {
    const out = new Map<number, MelodyNote>();
    for (const n of ns) if (!n.tiedFromPrevious) out.set(key(n), n);
    return out;
  };
  const walker = (ns: MelodyNote[]): ((t: number) => MelodyNote | undefined) => {
    let k = 0;
    return (t) => {
      while (k < ns.length && end(ns[k] as MelodyNote) <= t) k++;
      const n = ns[k];
      return n !== undefined && key(n) <= t ? n : undefined;
    };
  };
  const ax = attacks(x);
  const ay = attacks(y);
  const soundingX = walker(x);
  const soundingY = walker(y);
  const onsets = [...new Set([...ax.keys(), ...ay.keys()])].sort((p, q) => p - q);
  const out: NoteDifference[] = [];
  for (const t of onsets) {
    const nx = ax.get(t);
    const ny = ay.get(t);
    const heldX = soundingX(t);
    const heldY = soundingY(t);
    const beat = beatNumber(t / 1e9, meter);
    if (nx !== undefined && ny !== undefined) {
      if (nx.pitch !== ny.pitch) out.push({ beat, kind: "pitch", first: side(nx), second: side(ny) });
      else if (toNumber(nx.duration) !== toNumber(ny.duration))
        out.push({ beat, kind: "duration", first: side(nx), second: side(ny) });
    } else if (nx !== undefined) {
      if (heldY?.pitch !== nx.pitch) out.push({ beat, kind: "onlyInFirst", first: side(nx), second: side(heldY) });
    } else if (ny !== undefined) {
      if (heldX?.pitch !== ny.pitch) out.push({ beat, kind: "onlyInSecond", first: side(heldX), second: side(ny) });
    }
  }
  return out;
}
