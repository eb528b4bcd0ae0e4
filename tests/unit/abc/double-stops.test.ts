// The melody note of a double stop, read from the fiddler's cues (lib/abc/double-stops.ts): the
// rules on tunes written for the test, then double stops of the open corpus labelled by hand.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { analyze } from "@/lib/abc/analyze";
import type { DoubleStop, StopChoice } from "@/lib/abc/double-stops";
import { splitTunes } from "@/lib/abc/split";
import { headerField } from "@/lib/tunes/header";

const tune = (key: string, body: string, meter = "4/4"): string =>
  `X:1\nT:Double stops\nM:${meter}\nL:1/8\nK:${key}\n${body}\n`;

function stops(abc: string, doubleStop?: DoubleStop, turnedBars?: Record<number, "upper" | "lower">): StopChoice[] {
  const r = analyze(abc, { doubleStop, turnedBars });
  if (!r.ok) throw new Error(r.problems.map((p) => p.message).join("; "));
  return r.value.doubleStops;
}
const kept = (list: StopChoice[]) => list.map((c) => [c.bar, c.keptName, c.reason]);

describe("the melody note of a double stop (common practice)", () => {
  it("an open string beside a stopped melody note is the drone: [FA] in D keeps F", () => {
    expect(kept(stops(tune("D", "d2 [FA]2 E2 D2|")))).toEqual([[1, "F♯4", "open"]]);
  });

  it("except at a cadence on the tonic: [EA]3-[EA]2B A3 in A keeps the A", () => {
    expect(kept(stops(tune("A", "[EA]3-[EA]2B A3|]", "9/8")))).toEqual([
      [1, "A4", "cadence"],
      [1, "A4", "cadence"],
    ]);
  });

  it("unless the tune goes on from the open string, and an octave keeps its upper note", () => {
    // e g e: the tune stays by the open E, B is the note added below it
    expect(kept(stops(tune("Em", "[Be]2 ge Bege|d2 B2 E4|]")))).toEqual([[1, "E5", "continues"]]);
    expect(kept(stops(tune("G", "d2 B2 [G,G]4|]")))).toEqual([[1, "G4", "upper"]]);
  });

  it("otherwise the upper note: [GB]2G after c2A keeps the B", () => {
    expect(kept(stops(tune("G", "c2A [GB]2G d2|")))).toEqual([[1, "B4", "upper"]]);
  });

  it("a note held or repeated while the other voice moves is the drone, the moving voice the tune", () => {
    // the open A held over D, F♯, G: the lower line is the tune, though A is the upper note
    expect(kept(stops(tune("D", "[DA]2 [FA]2 [GA]2 [FA]2|")))).toEqual([
      [1, "D4", "held"],
      [1, "F♯4", "held"],
      [1, "G4", "held"],
      [1, "F♯4", "held"],
    ]);
    // B struck again between the stops: the drone under a moving top line
    expect(kept(stops(tune("G", "BB[gB]B BB[aB]B|")))).toEqual([
      [1, "G5", "held"],
      [1, "A5", "held"],
    ]);
    // both voices move together (thirds): the top line, even over an open string
    expect(stops(tune("C", "[ce]2 [df]2 [eg]2 [ce]2|")).map((c) => c.keptName)).toEqual(["E5", "F5", "G5", "E5"]);
  });

  it("keeps --highest and --lowest as overrides, and a teacher's turn of one bar", () => {
    const abc = tune("D", "d2 [FA]2 E2 D2|d2 [FA]2 E2 D2|");
    expect(stops(abc, "highest").map((c) => [c.keptName, c.reason])).toEqual([
      ["A4", "setting"],
      ["A4", "setting"],
    ]);
    expect(stops(abc, "lowest").map((c) => c.keptName)).toEqual(["F♯4", "F♯4"]);
    const turned = stops(abc, undefined, { 1: "upper" });
    expect(turned.map((c) => [c.barIndex, c.keptName, c.reason])).toEqual([
      [0, "F♯4", "open"],
      [1, "A4", "teacher"],
    ]);
    const r = analyze(abc, { turnedBars: { 1: "upper" } });
    expect(r.ok && r.value.skeleton.abc.split("\n")[5]).toBe("d2 F2 E2 D2|d2 A2 E2 D2|");
  });
});

// Double stops of the open corpus (Nottingham collection, ABC_cleaned), labelled by hand: the note
// a fiddler would read as the tune, and why. `nth` counts the double stops of the bar from 1.
interface Label {
  file: string;
  title: string;
  bar: number;
  nth: number;
  stop: string;
  melody: string;
  why: string;
}
const L = (
  file: string,
  title: string,
  bar: number,
  nth: number,
  stop: string,
  melody: string,
  why: string,
): Label => ({
  file,
  title,
  bar,
  nth,
  stop,
  melody,
  why,
});
const BMR = "Black Mountain Reel";
const CTW = "Clear The Way";
const ETB = "East Tennessee Blues";
const FA = "Fiddling Around";
const LABELS: Label[] = [
  L("reelsa-c", BMR, 9, 1, "[ce]", "C♯5", "the open E rings above c c c B c; the bar ends on c alone"),
  L("reelsa-c", BMR, 9, 4, "[B/2e/2]", "B4", "the same: the lower line steps down to B and back"),
  L("reelsa-c", BMR, 13, 1, "[C2E2]", "C♯4", "E held over the low line C C B, A,"),
  L("reelsa-c", BMR, 14, 1, "[A,2E2]", "A3", "the low line reaches A, under the held E"),
  L("reelsa-c", BMR, 14, 3, "[EA]", "E4", "the line climbs A, C E to the F♯ of the next bar; the open A rings above"),
  L("reelsa-c", BMR, 15, 1, "[F2A2]", "F♯4", "the open A above F♯, which goes on alone F E D E"),
  L("reelsa-c", BMR, 24, 1, "[F2A2]", "F♯4", "F♯ goes on alone to G F; the open A rings above"),
  L("reelsa-c", CTW, 4, 1, "[c2e2]", "C♯5", "the open E held while the line falls c B to the A of the next bar"),
  L("reelsa-c", CTW, 4, 2, "[B2e2]", "B4", "the same line, one step down"),
  L("reelsa-c", CTW, 9, 1, "[c/2-a/2-]", "C♯5", "a tied and held over the line c♯ c♮ c♯ below"),
  L("reelsa-c", CTW, 10, 1, "[=c/2-a/2-]", "C5", "the line =c B c under the held a"),
  L("reelsa-c", CTW, 10, 3, "[c2a2]", "C5", "the line arrives on c under the held a"),
  L("reelsd-g", ETB, 10, 1, "[ce]", "C5", "the part's cadence: B→c lands on the tonic; the open E rings above"),
  L("reelsd-g", ETB, 11, 1, "[c2-g2-]", "G5", "c held below while the top line goes g g a g"),
  L("reelsd-g", ETB, 11, 3, "[c/2a/2]", "A5", "the top line's step up over the held c"),
  L("reelsd-g", ETB, 12, 1, "[c2 e2]", "E5", "c still held; the top line falls from g to e"),
  L("reelsd-g", ETB, 13, 1, "[F2-c2-]", "C5", "F held below; the top line c c d c"),
  L("reelsd-g", ETB, 13, 3, "[F/2d/2]", "D5", "the top line's step up over the held F"),
  L("reelsd-g", ETB, 14, 1, "[F2A2]", "A4", "F still held; the top line comes down to A and goes on G A G F"),
  L("reelsd-g", ETB, 26, 1, "[ce]", "C5", "the tune's last cadence lands on the tonic c, the open E above"),
  L("reelsd-g", "Dixie Hoedown", 9, 1, "[B3g3]", "G5", "sixths moving together: the tune is the top line g f♯ e"),
  L("reelsd-g", "Dixie Hoedown", 10, 1, "[d3f3]", "F♯5", "the same top line"),
  L("reelsd-g", "Dixie Hoedown", 17, 1, "[d3g3]", "G5", "d held below while the top moves g → f♯"),
  L("reelsd-g", FA, 13, 1, "[g/2B/2]", "G5", "B struck again and again: the drone under the top line g a b a g"),
  L("reelsd-g", FA, 14, 1, "[b/2B/2]", "B5", "the top of that line"),
  L("reelsd-g", FA, 15, 1, "[c2E2]", "C5", "the line goes on from c alone: c B c d"),
  L("reelsd-g", FA, 18, 3, "[f/2^c/2]", "F5", "c♯ repeated as the pulse; f is the tune"),
  L("reelsd-g", FA, 19, 1, "[f/2d/2]", "F5", "now d repeated as the pulse under f"),
  L("ashover", "Flapjack", 1, 1, "[g3/2B3/2]", "G5", "B♭ held below a falling top line g f e d"),
  L("ashover", "Flapjack", 2, 3, "[gA]", "G5", "A held below; the top leaps to g and back to c"),
  L("ashover", "Flapjack", 4, 3, "[fA]", "F5", "A held below the top line c c f a"),
  L("ashover", "Flapjack", 17, 2, "[g B ]", "G5", "the voices move together: the top line a g f"),
  L("ashover", "Duncan's Waltz", 19, 2, "[ec]", "E5", "thirds moving together d e f e: the open E moves with the line"),
  L("ashover", "Duncan's Waltz", 20, 1, "[e3c3]", "E5", "the top line's arrival"),
  L("ashover", "Verdi's Waltz", 1, 1, "[C2E2]", "E4", "thirds climbing together: the top line E F G"),
  L(
    "ashover",
    "Verdi's Waltz",
    17,
    1,
    "[^G2e2]",
    "E5",
    "sixths moving together e f e d: the open E moves with the line",
  ),
  L("ashover", "The Chaco Waltz", 1, 1, "[G2B2]", "B♭4", "thirds: the top line B♭ c d"),
  L("ashover", "The Chaco Waltz", 5, 1, "[^F2A2]", "A4", "thirds moving together; the open A moves with the top line"),
  L("reelsh-l", "Kitchen Girl", 1, 1, "[c2 a2 ]", "A5", "sixths moving together; the tune is the top a g"),
  L("reelsh-l", "Kitchen Girl", 1, 2, "[B2g2]", "G5", "the same top line"),
  L("jigs", "Charlbytown Two-Step", 32, 1, "[E3c3]", "C5", "the last note: the tonic c on top"),
  L("jigs", "Melange", 24, 1, "[A3c3]", "A4", "the first ending closes on the tonic A (an open string); c♯ is harmony"),
  L("reelsu-z", "Walking In My Sleep", 3, 1, "[e2g2]", "G5", "the top line g f♯ d B; the open E below moves away"),
  L(
    "reelsu-z",
    "West Fork Gals",
    11,
    1,
    "[EA]",
    "E4",
    "the phrase answers with E alone (F E2): E is the tune, the open A above",
  ),
  L(
    "reelsu-z",
    "Ways Of The World",
    16,
    1,
    "[D A ]",
    "D4",
    "the part ends D [DA] D: the tonic repeated, the A added above it",
  ),
  L("reelsr-t", "Rhos-y-gwaliau Romp", 17, 1, "[G3/2B3/2]", "B4", "the run A A♯ climbs to B: the top note"),
];

const ROOT = "../shared/datasets/nottingham/ABC_cleaned";
const files = new Map<string, ReturnType<typeof splitTunes>>();
function choicesOf(label: Label, doubleStop?: DoubleStop): StopChoice[] {
  let tunes = files.get(label.file);
  if (!tunes) {
    tunes = splitTunes(readFileSync(`${ROOT}/${label.file}.abc`, "utf8"));
    files.set(label.file, tunes);
  }
  // the collection holds two tunes of some titles: the one with this double stop
  const t = tunes.find((x) => headerField(x.abc, "T") === label.title && x.abc.includes(label.stop));
  if (!t) throw new Error(`${label.file}: no tune "${label.title}"`);
  const r = analyze(t.abc, { doubleStop });
  if (!r.ok) throw new Error(`${label.title}: ${r.problems[0]?.message}`);
  const inBar = r.value.doubleStops.filter((c) => c.bar === label.bar);
  const c = inBar[label.nth - 1];
  if (!c || t.abc.slice(c.start, c.end) !== label.stop)
    throw new Error(`${label.title} bar ${label.bar}: double stop ${label.nth} is not ${label.stop}`);
  return [c];
}

describe("double stops of the open corpus, labelled by hand", () => {
  it(`agree with the labels on at least 90 % of ${LABELS.length} double stops, and more often than the highest note`, () => {
    expect(LABELS.length).toBeGreaterThanOrEqual(30);
    const agree = (doubleStop?: DoubleStop) => LABELS.filter((l) => choicesOf(l, doubleStop)[0]?.keptName === l.melody);
    const cues = agree();
    const highest = agree("highest");
    const missed = LABELS.filter((l) => !cues.includes(l)).map(
      (l) => `${l.title} bar ${l.bar} ${l.stop}: labelled ${l.melody} (${l.why}), read ${choicesOf(l)[0]?.keptName}`,
    );
    console.log(
      `double stops: the cues agree with ${cues.length} of ${LABELS.length} hand labels (${Math.round((100 * cues.length) / LABELS.length)} %); the highest note with ${highest.length}${missed.length ? `; differ: ${missed.join("; ")}` : ""}`,
    );
    expect(cues.length / LABELS.length).toBeGreaterThanOrEqual(0.9);
    expect(cues.length).toBeGreaterThan(highest.length);
  });
});
