import { describe, expect, it } from "vitest";
import { beatOf, keyHasFlats, pitchName, readScore } from "@/lib/listen/expected";
import { midiOf, trackPitch } from "@/lib/listen/pitch-track";
import { barList, clock } from "@/lib/listen/summary";
import { playingOrder } from "@/lib/listen/perform";

const RATE = 16_000;
const sine = (hz: number, seconds: number) =>
  Float32Array.from({ length: Math.round(seconds * RATE) }, (_, i) => 0.5 * Math.sin((2 * Math.PI * hz * i) / RATE));
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[xs.length >> 1];

describe("pitch in equal temperament, A4 = 440 Hz (ISO 16)", () => {
  it("names MIDI 69 A4 and middle C (MIDI 60) C4", () => {
    expect(midiOf(440)).toBe(69);
    expect(pitchName(60)).toBe("C4");
    expect(pitchName(70, true)).toBe("Bb4");
    expect(pitchName(70)).toBe("A#4");
  });
  it("tracks a 440 Hz tone as A4 and one 30 cents sharp as +30 cents, within 2 cents", () => {
    const a4 = trackPitch(sine(440, 1), RATE);
    expect(Math.abs(median([...a4.midi].filter((m) => !Number.isNaN(m))) - 69)).toBeLessThan(0.02);
    const sharp = trackPitch(sine(440 * 2 ** (30 / 1200), 1), RATE);
    expect(Math.abs(median([...sharp.midi].filter((m) => !Number.isNaN(m))) - 69.3)).toBeLessThan(0.02);
    // the open G string (196 Hz), the fiddle's lowest note
    const g3 = trackPitch(sine(196, 1), RATE);
    expect(Math.abs(median([...g3.midi].filter((m) => !Number.isNaN(m))) - 55)).toBeLessThan(0.02);
  });
  it("hears no pitch in silence", () => {
    const t = trackPitch(new Float32Array(RATE), RATE);
    expect([...t.midi].every((m) => Number.isNaN(m))).toBe(true);
  });
});

describe("the stage's notes", () => {
  const abc = "X:1\nT:t\nM:6/8\nL:1/8\nK:F\nc|:AGF B2A|GFE F3|1 cde f2c:|2 cde f3||\n";
  it("reads bars as the phrase map numbers them (pickup 0), beats of the meter, flats in a flat key", () => {
    const read = readScore(abc);
    if (!read.ok) throw new Error("unreadable");
    const { notes, bars, beatName } = read.score;
    expect(beatName).toBe("dotted quarter note");
    expect(bars.map((b) => b.number)).toEqual([0, 1, 2, 3, 4]);
    expect(notes[0]).toMatchObject({ bar: 0, name: "C5", midi: 72 });
    expect(notes[4]).toMatchObject({ bar: 1, name: "Bb4", midi: 70 }); // B is flat in F (K:F)
    expect(notes[4].beats).toBeCloseTo(2 / 3, 6); // a quarter note is two thirds of a dotted quarter
    expect(notes[1].beat).toBeCloseTo(1 / 3, 6); // after the pickup eighth
  });
  it("plays through the repeat with the first ending, then the second", () => {
    const read = readScore(abc);
    if (!read.ok) throw new Error("unreadable");
    const bars = playingOrder(read.score, "play").map((k) => read.score.notes[k].bar);
    expect([...new Set(bars.map(String))].join(" ")).toBe("0 1 2 3 4");
    expect(bars.filter((b) => b === 1).length).toBe(10); // bar 1's five notes, twice
    expect(bars.filter((b) => b === 3).length).toBe(5); // the first ending once
    expect(bars.filter((b) => b === 4).length).toBe(4); // the second ending once
    expect(bars.indexOf(4)).toBeGreaterThan(bars.lastIndexOf(3));
    expect(
      playingOrder(read.score, "skip")
        .map((k) => read.score.notes[k].bar)
        .filter((b) => b === 1).length,
    ).toBe(5);
  });
  it("gives the beat of simple and compound meters and knows flat keys", () => {
    expect(beatOf({ num: 4, den: 4 }).name).toBe("quarter note");
    expect(beatOf({ num: 9, den: 8 }).whole).toBeCloseTo(3 / 8);
    expect(beatOf({ num: 3, den: 4 }).whole).toBe(1 / 4);
    expect(keyHasFlats("Gm")).toBe(true);
    expect(keyHasFlats("Gdor")).toBe(true);
    expect(keyHasFlats("Ador")).toBe(false);
    expect(keyHasFlats("D")).toBe(false);
  });
  it("refuses music it cannot read", () => {
    expect(readScore("X:1\nT:nothing\n").ok).toBe(false);
  });
});

describe("the summary's words", () => {
  it("lists bars with ranges for runs of three or more, and clock times", () => {
    expect(barList([14, 5, 6])).toBe("5, 6, 14");
    expect(barList([9, 10, 11, 12, 1])).toBe("1, 9–12");
    expect(clock(75.4)).toBe("1:15");
  });
});
