// The demo students' practice log and margin notes (invented). Six students have eight weeks of
// practice ending in a streak that is still alive; the others with demo work a little since they were
// assigned it. Deterministic: a seeded PRNG per student, days counted back from the seeding day.
import { prng } from "./billing-history";
import { DEMO_ASSIGNMENTS } from "./teaching";

export interface DemoPracticeEntry {
  daysAgo: number; // 0 = the student's today, in their own time zone
  minutes: number;
  tune: string | null; // file in ./tunes
  note: string;
}

/** The six with eight weeks of practice: their current streak, and whether today is already in it. */
export const KEEN: Record<number, { streak: number; today: boolean }> = {
  0: { streak: 11, today: false },
  3: { streak: 23, today: true },
  1: { streak: 6, today: true },
  4: { streak: 4, today: false },
  2: { streak: 15, today: true },
  5: { streak: 3, today: false },
};

const NOTES = [
  "Open strings first, slow and even.",
  "Long bows with the metronome at 60.",
  "Played along with the slow playback.",
  "Looped the first phrase until it stopped wobbling.",
  "Memory mode: got through the A part without looking.",
  "Scales in D and G before the tune.",
  "Shoulder a bit tight: shorter session, more breaks.",
  "Recorded myself and listened back.",
  "B part at half speed, then three-quarters.",
  "Fourth finger exercises, then the tune.",
  "Tried it with the count-in at 80 %.",
  "Slurs in bars 2–4 finally even.",
];

/** A student's demo practice, oldest first. */
export function demoPractice(student: number): DemoPracticeEntry[] {
  const mine = DEMO_ASSIGNMENTS.filter((a) => a.student === student);
  if (!mine.length) return [];
  const rand = prng(0x9e37 + student * 101);
  const keen = KEEN[student];
  const first = keen ? 55 : Math.min(14, Math.max(...mine.map((a) => a.assignedDaysAgo)));
  const out: DemoPracticeEntry[] = [];
  for (let d = first; d >= 0; d--) {
    let practised: boolean;
    if (keen) {
      const streakStart = keen.today ? keen.streak - 1 : keen.streak;
      const streakEnd = keen.today ? 0 : 1;
      if (d === 0 && !keen.today) practised = false;
      else if (d <= streakStart && d >= streakEnd) practised = true;
      else if (d === streakStart + 1)
        practised = false; // the day the streak began after
      else practised = rand() < 0.7;
    } else practised = d > 0 && rand() < 0.45;
    if (!practised) continue;
    const sessions = rand() < 0.15 ? 2 : 1;
    for (let s = 0; s < sessions; s++) {
      const open = mine.filter((a) => a.assignedDaysAgo >= d);
      const tune = open.length && rand() > 0.15 ? open[Math.floor(rand() * open.length)].tune : null;
      out.push({
        daysAgo: d,
        minutes: 10 + 5 * Math.floor(rand() * 8),
        tune,
        note: rand() < 0.4 ? NOTES[Math.floor(rand() * NOTES.length)] : "",
      });
    }
  }
  return out;
}

export interface DemoMarginNote {
  student: number;
  tune: string;
  bar: number;
  body: string;
}

// On tunes each student may open on their ladders (a margin note is only read on an open tune).
export const DEMO_MARGIN_NOTES: readonly DemoMarginNote[] = [
  {
    student: 0,
    tune: "little-biscuit.abc",
    bar: 3,
    body: "Lift the bow in the rest: the silence is part of the tune.",
  },
  { student: 0, tune: "little-biscuit.abc", bar: 6, body: "Open E here for now, fourth finger later (Isla)." },
  { student: 0, tune: "hop-the-puddle.abc", bar: 2, body: "Off-beat: a little lift, not a push." },
  { student: 0, tune: "rattling-gate.abc", bar: 5, body: "Elbow level for the string crossing." },
  { student: 3, tune: "thornsby-weir.abc", bar: 4, body: "Breathe here before the phrase turns." },
  { student: 3, tune: "thornsby-weir.abc", bar: 9, body: "B part starts on an up-bow." },
  { student: 3, tune: "lamp-in-the-attic.abc", bar: 1, body: "Count a whole bar in before the first note." },
  { student: 1, tune: "kettle-nobody-watched.abc", bar: 2, body: "Lean on the first of each three." },
  { student: 1, tune: "greaveys-goat.abc", bar: 1, body: "Danceable, not fast!" },
  { student: 4, tune: "rattling-gate.abc", bar: 3, body: "Slurred pairs: don't rush the second note." },
  { student: 4, tune: "little-biscuit.abc", bar: 7, body: "Second finger low on the A string." },
  { student: 2, tune: "slow-boats-marle.abc", bar: 5, body: "Let the long note ring to the end of the bar." },
  { student: 2, tune: "lamplighters-shortcut.abc", bar: 1, body: "Light bow on the pickup." },
  { student: 5, tune: "slow-boats-marle.abc", bar: 2, body: "Don't drop the D!" },
  { student: 5, tune: "hop-the-puddle.abc", bar: 4, body: "Shorter notes, springier bow." },
];
