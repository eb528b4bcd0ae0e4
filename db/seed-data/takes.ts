// The demo school's check-in recordings: each take is one invented student's playing of one stage,
// rendered from the demo tune with the app's own fiddle samples (lib/listen/recording.ts) by
// scripts/render-demo-takes.ts and shipped as a small mp3 in ./recordings (rendering them at every
// seed would take longer than the whole seed may). Each part played once through, as a quick
// check-in often is; the faults give the listening aid something to find in some and nothing in others.
export interface DemoTake {
  tune: string; // file in ./tunes
  stage: number;
  bpm: number; // beats of the meter per minute: learners play below the tune's Q:
  seed: number;
  noiseDb: number; // room noise, signal-to-noise in dB
  drift?: number;
  faults?: { wrong?: number; missed?: number; extra?: number; detune?: number };
}

export const DEMO_TAKES = {
  // Isla Penhallow's students: First Steps on the Fiddle
  "biscuit-1": { tune: "little-biscuit.abc", stage: 1, bpm: 80, seed: 11, noiseDb: 32, faults: { missed: 0.03 } },
  "biscuit-1-gideon": { tune: "little-biscuit.abc", stage: 1, bpm: 84, seed: 12, noiseDb: 30, faults: { wrong: 0.06 } },
  "biscuit-1-yorick": {
    tune: "little-biscuit.abc",
    stage: 1,
    bpm: 76,
    seed: 13,
    noiseDb: 28,
    drift: 0.08,
    faults: { missed: 0.06 },
  },
  "biscuit-2": {
    tune: "little-biscuit.abc",
    stage: 2,
    bpm: 82,
    seed: 14,
    noiseDb: 30,
    faults: { wrong: 0.05, missed: 0.04 },
  },
  "biscuit-3": { tune: "little-biscuit.abc", stage: 3, bpm: 86, seed: 15, noiseDb: 34, faults: { extra: 0.03 } },
  "biscuit-4": { tune: "little-biscuit.abc", stage: 4, bpm: 90, seed: 16, noiseDb: 34 },
  "puddle-1": { tune: "hop-the-puddle.abc", stage: 1, bpm: 84, seed: 21, noiseDb: 32, faults: { missed: 0.02 } },
  "puddle-1-briar": { tune: "hop-the-puddle.abc", stage: 1, bpm: 88, seed: 22, noiseDb: 30, faults: { detune: 0.1 } },
  "puddle-2-alder": {
    tune: "hop-the-puddle.abc",
    stage: 2,
    bpm: 86,
    seed: 23,
    noiseDb: 30,
    drift: -0.08,
    faults: { missed: 0.04 },
  },
  "weir-1": { tune: "thornsby-weir.abc", stage: 1, bpm: 96, seed: 31, noiseDb: 34 },
  "weir-2": { tune: "thornsby-weir.abc", stage: 2, bpm: 100, seed: 32, noiseDb: 34, faults: { wrong: 0.02 } },
  "lamp-1-delphine": { tune: "lamp-in-the-attic.abc", stage: 1, bpm: 104, seed: 41, noiseDb: 34 },
  // Tomas Greavey's students: Tunes for the Dance Floor
  "gate-1": { tune: "rattling-gate.abc", stage: 1, bpm: 88, seed: 51, noiseDb: 32 },
  "gate-1-niall": {
    tune: "rattling-gate.abc",
    stage: 1,
    bpm: 92,
    seed: 52,
    noiseDb: 30,
    faults: { wrong: 0.04, missed: 0.03 },
  },
  "gate-2": { tune: "rattling-gate.abc", stage: 2, bpm: 90, seed: 53, noiseDb: 30, faults: { missed: 0.05 } },
  "kettle-1": { tune: "kettle-nobody-watched.abc", stage: 1, bpm: 88, seed: 61, noiseDb: 32 },
  "kettle-2": { tune: "kettle-nobody-watched.abc", stage: 2, bpm: 92, seed: 62, noiseDb: 32, faults: { wrong: 0.02 } },
  "goat-1-bryony": { tune: "greaveys-goat.abc", stage: 1, bpm: 90, seed: 71, noiseDb: 32, drift: 0.06 },
  // Ruth Callander's students: Ready for the Session
  "boats-1": { tune: "slow-boats-marle.abc", stage: 1, bpm: 92, seed: 81, noiseDb: 32, faults: { missed: 0.03 } },
  "boats-1-linnea": {
    tune: "slow-boats-marle.abc",
    stage: 1,
    bpm: 96,
    seed: 82,
    noiseDb: 30,
    faults: { missed: 0.05, extra: 0.02 },
  },
  "boats-2": { tune: "slow-boats-marle.abc", stage: 2, bpm: 96, seed: 83, noiseDb: 34 },
  "lamplighter-1-cathal": {
    tune: "lamplighters-shortcut.abc",
    stage: 1,
    bpm: 90,
    seed: 91,
    noiseDb: 30,
    faults: { extra: 0.04 },
  },
} satisfies Record<string, DemoTake>;

export type TakeName = keyof typeof DEMO_TAKES;

/** Where a take's mp3 is shipped. */
export function takeFile(name: TakeName): URL {
  return new URL(`./recordings/${name}.mp3`, import.meta.url);
}
