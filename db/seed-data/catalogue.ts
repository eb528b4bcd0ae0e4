// The demo catalogue of the invented Larchmoor Fiddle School (issue 5, item 8). Every tune in
// ./tunes is an original written for this demo; titles, courses and summaries are invented too.
// Plain data only: db/seed-catalogue.ts turns it into rows.

export type EnrolmentStatus = "active" | "paused" | "ended";

/** One demo tune: its file in ./tunes and the teacher (index into TEACHERS) who owns it. */
export interface DemoTune {
  file: string;
  teacher: number;
}

/** One rung: the tune (by file) and the stage a student must reach before the next rung opens. */
export interface DemoRung {
  tune: string;
  requiredStage: 1 | 2 | 3 | 4;
  isTaster?: boolean;
}

export interface DemoGrade {
  title: string;
  rungs: DemoRung[];
}

export interface DemoCourse {
  slug: string;
  title: string;
  summary: string;
  teacher: number; // index into TEACHERS; also the lead teacher who follows new members
  /** How its stages open: the student's own check-in, or the teacher's sign-off. */
  pace: "self_paced" | "teacher_sign_off";
  grades: DemoGrade[];
  enrolments: { student: number; status: EnrolmentStatus }[]; // student: index into STUDENTS
}

// Each teacher owns the tunes of their own course, so a teacher's tune list in the app is theirs alone.
export const DEMO_TUNES: readonly DemoTune[] = [
  // Isla Penhallow: first steps
  { file: "little-biscuit.abc", teacher: 0 },
  { file: "hop-the-puddle.abc", teacher: 0 },
  { file: "thornsby-weir.abc", teacher: 0 },
  { file: "lamp-in-the-attic.abc", teacher: 0 },
  { file: "pennywort-hill.abc", teacher: 0 },
  { file: "gatepost-wren.abc", teacher: 0 },
  // Tomas Greavey: dance tunes
  { file: "rattling-gate.abc", teacher: 1 },
  { file: "kettle-nobody-watched.abc", teacher: 1 },
  { file: "greaveys-goat.abc", teacher: 1 },
  { file: "upturned-barrow.abc", teacher: 1 },
  { file: "frost-cold-frame.abc", teacher: 1 },
  { file: "brass-bedknob.abc", teacher: 1 },
  // Ruth Callander: session-ready
  { file: "slow-boats-marle.abc", teacher: 2 },
  { file: "lamplighters-shortcut.abc", teacher: 2 },
  { file: "quenbys-crossing.abc", teacher: 2 },
  { file: "tarred-ropewalk.abc", teacher: 2 },
  { file: "herons-second-thought.abc", teacher: 2 },
  { file: "slate-roof.abc", teacher: 2 },
  { file: "clockmakers-stairs.abc", teacher: 2 },
];

// Rungs run from the fewest notes, narrowest range and slowest tempo to the busiest settings; the
// required stage rises with the grade (skeleton or bowing early on, the full setting at the top).
export const DEMO_COURSES: readonly DemoCourse[] = [
  {
    slug: "first-steps",
    title: "First Steps on the Fiddle",
    summary:
      "Your first tunes, taken slowly. Two short polkas and a waltz settle the bow arm; then a second waltz, " +
      "a jig and a reel. Each tune starts as a bare melody and gains its slurs and ornaments one stage at a time.",
    teacher: 0,
    pace: "self_paced",
    grades: [
      {
        title: "Grade 1",
        rungs: [
          { tune: "little-biscuit.abc", requiredStage: 1, isTaster: true },
          { tune: "hop-the-puddle.abc", requiredStage: 2 },
          { tune: "thornsby-weir.abc", requiredStage: 2 },
        ],
      },
      {
        title: "Grade 2",
        rungs: [
          { tune: "lamp-in-the-attic.abc", requiredStage: 3 },
          { tune: "pennywort-hill.abc", requiredStage: 3 },
          { tune: "gatepost-wren.abc", requiredStage: 3 },
        ],
      },
    ],
    enrolments: [
      { student: 0, status: "active" },
      { student: 3, status: "active" },
      { student: 6, status: "active" },
      { student: 9, status: "active" },
      { student: 12, status: "paused" },
      { student: 15, status: "active" },
      { student: 24, status: "active" },
      { student: 27, status: "active" },
      { student: 30, status: "active" },
      { student: 4, status: "active" },
      { student: 5, status: "active" },
    ],
  },
  {
    slug: "dance-floor",
    title: "Tunes for the Dance Floor",
    summary:
      "Polkas, jigs, reels and hornpipes with the steady beat that dancers need. Learn to keep the pulse " +
      "first, then to lift it with rolls, triplets and double stops.",
    teacher: 1,
    pace: "teacher_sign_off",
    grades: [
      {
        title: "Grade 1",
        rungs: [
          { tune: "rattling-gate.abc", requiredStage: 2, isTaster: true },
          { tune: "kettle-nobody-watched.abc", requiredStage: 2 },
        ],
      },
      {
        title: "Grade 2",
        rungs: [
          { tune: "greaveys-goat.abc", requiredStage: 3 },
          { tune: "upturned-barrow.abc", requiredStage: 3 },
        ],
      },
      {
        title: "Grade 3",
        rungs: [
          { tune: "frost-cold-frame.abc", requiredStage: 4 },
          { tune: "brass-bedknob.abc", requiredStage: 4 },
        ],
      },
    ],
    enrolments: [
      { student: 0, status: "active" },
      { student: 1, status: "active" },
      { student: 4, status: "active" },
      { student: 7, status: "active" },
      { student: 10, status: "ended" },
      { student: 13, status: "active" },
      { student: 16, status: "active" },
      { student: 28, status: "active" },
      { student: 31, status: "active" },
      { student: 2, status: "active" },
    ],
  },
  {
    slug: "session-ready",
    title: "Ready for the Session",
    summary:
      "For players who can manage a reel and want to hold their own in a session: tunes in F and in minor " +
      "keys, hornpipes and a slip jig, and the ornaments you will hear around the table.",
    teacher: 2,
    pace: "teacher_sign_off",
    grades: [
      {
        title: "Grade 1",
        rungs: [
          { tune: "slow-boats-marle.abc", requiredStage: 2, isTaster: true },
          { tune: "lamplighters-shortcut.abc", requiredStage: 3 },
        ],
      },
      {
        title: "Grade 2",
        rungs: [
          { tune: "quenbys-crossing.abc", requiredStage: 3 },
          { tune: "tarred-ropewalk.abc", requiredStage: 3 },
          { tune: "herons-second-thought.abc", requiredStage: 3 },
        ],
      },
      {
        title: "Grade 3",
        rungs: [
          { tune: "slate-roof.abc", requiredStage: 4 },
          { tune: "clockmakers-stairs.abc", requiredStage: 4 },
        ],
      },
    ],
    enrolments: [
      { student: 2, status: "active" },
      { student: 5, status: "active" },
      { student: 8, status: "active" },
      { student: 11, status: "active" },
      { student: 14, status: "paused" },
      { student: 3, status: "active" },
      { student: 17, status: "active" },
      { student: 20, status: "active" },
      { student: 23, status: "active" },
      { student: 1, status: "active" },
    ],
  },
];
