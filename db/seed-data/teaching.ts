// The demo school in mid-term: each teacher's assignments in every state (open, due soon, overdue,
// checked in and waiting with a recording, needs more time, signed off with the next stage open, and
// one finished), with check-ins, the teachers' feedback and the recordings of ./takes.ts. All invented;
// every time is counted back from the moment of seeding, so a fresh demo is always in mid-term.
// Plain data only: db/seed-teaching.ts turns it into rows (./teaching-replay.ts works out the stages).
import type { TakeName } from "./takes";

export interface DemoReview {
  daysAgo: number;
  outcome: "signed_off" | "needs_more_time";
  feedback: string;
}

/** One check-in on one stage; without a review it is still waiting for the teacher. */
export interface DemoCheckIn {
  stage: number;
  daysAgo: number;
  take: TakeName;
  rating: 1 | 2 | 3 | 4 | 5;
  fromMemory?: boolean;
  review?: DemoReview;
}

export interface DemoAssignment {
  key: string; // stable: the rows' ids are made from it, so seeding twice writes them once
  teacher: number; // index into TEACHERS
  student: number; // index into STUDENTS (always on that teacher's roster)
  tune: string; // file in ./tunes, the teacher's own
  assignedDaysAgo: number;
  dueInDays: number; // negative: overdue
  note: string;
  checkIns: DemoCheckIn[]; // in the order they happened
}

const signed = (daysAgo: number, feedback: string): DemoReview => ({ daysAgo, outcome: "signed_off", feedback });
const notYet = (daysAgo: number, feedback: string): DemoReview => ({ daysAgo, outcome: "needs_more_time", feedback });

// STUDENTS 9, 12 and 15 are left without demo work: the browser tests give them assignments of their own.
export const DEMO_ASSIGNMENTS: readonly DemoAssignment[] = [
  // ---- Isla Penhallow (First Steps on the Fiddle) ----
  {
    key: "isla/alder/biscuit",
    teacher: 0,
    student: 0,
    tune: "little-biscuit.abc",
    assignedDaysAgo: 52,
    dueInDays: -2,
    note: "Long bows on the quarter notes, and count the rests out loud the first few times.",
    checkIns: [
      {
        stage: 1,
        daysAgo: 45.2,
        take: "biscuit-1",
        rating: 3,
        review: signed(
          44.1,
          "A steady pulse all the way through. Bar 14 lost a note — play it slowly twice before you go on.",
        ),
      },
      {
        stage: 2,
        daysAgo: 9.3,
        take: "biscuit-2",
        rating: 2,
        review: notYet(
          8.2,
          "The slurs are coming. Bars 2 to 5 run ahead of the beat: set the metronome at 70 and let each slur take its full time.",
        ),
      },
    ],
  },
  {
    key: "isla/alder/puddle",
    teacher: 0,
    student: 0,
    tune: "hop-the-puddle.abc",
    assignedDaysAgo: 24,
    dueInDays: 1.2,
    note: "A bouncy polka: think of the off-beat as a little lift of the bow.",
    checkIns: [
      {
        stage: 1,
        daysAgo: 16.4,
        take: "puddle-1",
        rating: 4,
        review: signed(15.2, "Lovely and even. On to the bowing: keep that lift on the off-beats."),
      },
      { stage: 2, daysAgo: 2.1, take: "puddle-2-alder", rating: 4, fromMemory: true },
    ],
  },
  {
    key: "isla/delphine/weir",
    teacher: 0,
    student: 3,
    tune: "thornsby-weir.abc",
    assignedDaysAgo: 38,
    dueInDays: 5.3,
    note: "A slow waltz: give the long notes their whole value and let the bow travel.",
    checkIns: [
      { stage: 1, daysAgo: 30.2, take: "weir-1", rating: 4, review: signed(29.3, "Beautifully shaped phrases.") },
      {
        stage: 2,
        daysAgo: 12.1,
        take: "weir-2",
        rating: 4,
        fromMemory: true,
        review: signed(
          11.4,
          "Clean slurs and from memory, too. Stage 3 adds the ornaments: slow them right down first.",
        ),
      },
    ],
  },
  {
    key: "isla/delphine/lamp",
    teacher: 0,
    student: 3,
    tune: "lamp-in-the-attic.abc",
    assignedDaysAgo: 9,
    dueInDays: 9.2,
    note: "Your first tune of grade 2. Open the phrase map first: it shows how few phrases there really are to learn.",
    checkIns: [{ stage: 1, daysAgo: 1.2, take: "lamp-1-delphine", rating: 5 }],
  },
  {
    key: "isla/gideon/biscuit",
    teacher: 0,
    student: 6,
    tune: "little-biscuit.abc",
    assignedDaysAgo: 12,
    dueInDays: 3.1,
    note: "Start with open strings in bars 1–2 until the bow runs straight.",
    checkIns: [{ stage: 1, daysAgo: 3.3, take: "biscuit-1-gideon", rating: 3 }],
  },
  {
    key: "isla/yorick/biscuit",
    teacher: 0,
    student: 24,
    tune: "little-biscuit.abc",
    assignedDaysAgo: 20,
    dueInDays: 6.2,
    note: "Slow and even first; speed comes on its own.",
    checkIns: [{ stage: 1, daysAgo: 5.1, take: "biscuit-1-yorick", rating: 2 }],
  },
  {
    key: "isla/briar/biscuit",
    teacher: 0,
    student: 27,
    tune: "little-biscuit.abc",
    assignedDaysAgo: 70,
    dueInDays: -12,
    note: "Our first tune together: all four stages by the end of the month.",
    checkIns: [
      { stage: 1, daysAgo: 60.2, take: "biscuit-1", rating: 3, review: signed(59.1, "A good start. Well counted.") },
      { stage: 2, daysAgo: 45.3, take: "biscuit-2", rating: 3, review: signed(44.2, "The slurs sit nicely now.") },
      {
        stage: 3,
        daysAgo: 33.1,
        take: "biscuit-3",
        rating: 2,
        review: notYet(
          32.4,
          "The grace notes are squeezing the beat. Play bar 6 without them, then put them back lightly.",
        ),
      },
      {
        stage: 3,
        daysAgo: 25.2,
        take: "biscuit-3",
        rating: 4,
        review: signed(24.1, "Much lighter. That's the idea exactly."),
      },
      {
        stage: 4,
        daysAgo: 15.4,
        take: "biscuit-4",
        rating: 4,
        fromMemory: true,
        review: signed(14.2, "The whole tune, with its dynamics, from memory. Well done — it's yours now."),
      },
    ],
  },
  {
    key: "isla/briar/puddle",
    teacher: 0,
    student: 27,
    tune: "hop-the-puddle.abc",
    assignedDaysAgo: 13,
    dueInDays: 2.1,
    note: "Check the third finger on the A string against the open E.",
    checkIns: [{ stage: 1, daysAgo: 4.2, take: "puddle-1-briar", rating: 3 }],
  },
  {
    key: "isla/elspeth/biscuit",
    teacher: 0,
    student: 30,
    tune: "little-biscuit.abc",
    assignedDaysAgo: 10,
    dueInDays: 12.3,
    note: "Bowing next: tap the rhythm on your knee before you play it.",
    checkIns: [
      { stage: 1, daysAgo: 6.2, take: "biscuit-1", rating: 4, review: signed(5.1, "Very tidy. Stage 2 is open.") },
    ],
  },
  {
    key: "isla/sabine/biscuit",
    teacher: 0,
    student: 18,
    tune: "little-biscuit.abc",
    assignedDaysAgo: 4,
    dueInDays: 1.4,
    note: "The taster tune: play along with the slow playback first.",
    checkIns: [],
  },
  {
    key: "isla/verity/biscuit",
    teacher: 0,
    student: 21,
    tune: "little-biscuit.abc",
    assignedDaysAgo: 17,
    dueInDays: -3.2,
    note: "Whenever you are ready: a short recording is plenty.",
    checkIns: [],
  },
  // ---- Tomas Greavey (Tunes for the Dance Floor) ----
  {
    key: "tomas/bryony/kettle",
    teacher: 1,
    student: 1,
    tune: "kettle-nobody-watched.abc",
    assignedDaysAgo: 34,
    dueInDays: 4.2,
    note: "Jig time: a strong first beat of each three.",
    checkIns: [
      { stage: 1, daysAgo: 27.2, take: "kettle-1", rating: 4, review: signed(26.1, "Good swing already.") },
      {
        stage: 2,
        daysAgo: 13.3,
        take: "kettle-2",
        rating: 4,
        review: signed(12.2, "Bar 12 slipped a note, but the bowing is right. On you go to the ornaments."),
      },
    ],
  },
  {
    key: "tomas/bryony/goat",
    teacher: 1,
    student: 1,
    tune: "greaveys-goat.abc",
    assignedDaysAgo: 7,
    dueInDays: 10.1,
    note: "Grade 2 begins. Keep it danceable rather than fast.",
    checkIns: [{ stage: 1, daysAgo: 2.3, take: "goat-1-bryony", rating: 4 }],
  },
  {
    key: "tomas/emrys/gate",
    teacher: 1,
    student: 4,
    tune: "rattling-gate.abc",
    assignedDaysAgo: 26,
    dueInDays: -1.3,
    note: "Polka: short, bright notes, and the bow stays near the frog.",
    checkIns: [
      { stage: 1, daysAgo: 20.1, take: "gate-1", rating: 4, review: signed(19.3, "Bright and clear. Well done.") },
      {
        stage: 2,
        daysAgo: 4.4,
        take: "gate-2",
        rating: 3,
        review: notYet(3.2, "The slurred pairs are rushing. Try the B part at half speed for a few days, then again."),
      },
    ],
  },
  {
    key: "tomas/hester/gate",
    teacher: 1,
    student: 7,
    tune: "rattling-gate.abc",
    assignedDaysAgo: 6,
    dueInDays: 1.1,
    note: "Loop the first phrase until it feels easy.",
    checkIns: [],
  },
  {
    key: "tomas/niall/gate",
    teacher: 1,
    student: 13,
    tune: "rattling-gate.abc",
    assignedDaysAgo: 9,
    dueInDays: 5.2,
    note: "Watch the string crossing in bar 5.",
    checkIns: [{ stage: 1, daysAgo: 1.3, take: "gate-1-niall", rating: 3 }],
  },
  {
    key: "tomas/corin/gate",
    teacher: 1,
    student: 28,
    tune: "rattling-gate.abc",
    assignedDaysAgo: 15,
    dueInDays: 8.3,
    note: "Keep the pulse steady enough to dance to.",
    checkIns: [
      { stage: 1, daysAgo: 8.2, take: "gate-1", rating: 4, review: signed(7.1, "Very danceable! Stage 2 is open.") },
    ],
  },
  {
    key: "tomas/quilla/gate",
    teacher: 1,
    student: 16,
    tune: "rattling-gate.abc",
    assignedDaysAgo: 3,
    dueInDays: 11.2,
    note: "A first polka: clap it before you play it.",
    checkIns: [],
  },
  {
    key: "tomas/kester/gate",
    teacher: 1,
    student: 10,
    tune: "rattling-gate.abc",
    assignedDaysAgo: 21,
    dueInDays: -5.1,
    note: "The taster tune, for when you are back.",
    checkIns: [],
  },
  {
    key: "tomas/tamsin/gate",
    teacher: 1,
    student: 19,
    tune: "rattling-gate.abc",
    assignedDaysAgo: 5,
    dueInDays: 7.2,
    note: "Try it with the count-in at 60 %.",
    checkIns: [],
  },
  {
    key: "tomas/wren/gate",
    teacher: 1,
    student: 22,
    tune: "rattling-gate.abc",
    assignedDaysAgo: 4,
    dueInDays: 9.2,
    note: "The taster tune: try it at 60 % with the count-in.",
    checkIns: [],
  },
  {
    key: "tomas/zinnia/gate",
    teacher: 1,
    student: 25,
    tune: "rattling-gate.abc",
    assignedDaysAgo: 1,
    dueInDays: 13.3,
    note: "No hurry: a bar a day is fine.",
    checkIns: [],
  },
  {
    key: "tomas/florin/gate",
    teacher: 1,
    student: 31,
    tune: "rattling-gate.abc",
    assignedDaysAgo: 2,
    dueInDays: 6.1,
    note: "Your first rung on the dance floor.",
    checkIns: [],
  },
  // ---- Ruth Callander (Ready for the Session) ----
  {
    key: "ruth/cathal/boats",
    teacher: 2,
    student: 2,
    tune: "slow-boats-marle.abc",
    assignedDaysAgo: 40,
    dueInDays: 3.3,
    note: "Let this one breathe: a waltz for the end of the night.",
    checkIns: [
      { stage: 1, daysAgo: 33.2, take: "boats-1", rating: 4, review: signed(32.1, "Good shape to the phrases.") },
      {
        stage: 2,
        daysAgo: 18.1,
        take: "boats-2",
        rating: 5,
        fromMemory: true,
        review: signed(17.3, "Lovely. Stage 3 brings the rolls: listen to the playback at 60 % first."),
      },
    ],
  },
  {
    key: "ruth/cathal/lamplighter",
    teacher: 2,
    student: 2,
    tune: "lamplighters-shortcut.abc",
    assignedDaysAgo: 10,
    dueInDays: 9.1,
    note: "Your next rung. Where the phrase map shows twins, learn one and you have both.",
    checkIns: [{ stage: 1, daysAgo: 3.2, take: "lamplighter-1-cathal", rating: 4 }],
  },
  {
    key: "ruth/fenella/boats",
    teacher: 2,
    student: 5,
    tune: "slow-boats-marle.abc",
    assignedDaysAgo: 27,
    dueInDays: -2.2,
    note: "Count three to each bar and let the first beat lean.",
    checkIns: [
      {
        stage: 1,
        daysAgo: 20.2,
        take: "boats-1",
        rating: 3,
        review: signed(19.1, "Bar 2 dropped a note, but the shape of the tune is there. On to the bowing."),
      },
      {
        stage: 2,
        daysAgo: 5.3,
        take: "boats-2",
        rating: 2,
        review: notYet(
          4.1,
          "The slurs are right, but the long notes fade before the bar ends: keep the bow moving to the very end of each.",
        ),
      },
    ],
  },
  {
    key: "ruth/ivo/boats",
    teacher: 2,
    student: 8,
    tune: "slow-boats-marle.abc",
    assignedDaysAgo: 8,
    dueInDays: 1.7,
    note: "Slow and singing.",
    checkIns: [],
  },
  {
    key: "ruth/linnea/boats",
    teacher: 2,
    student: 11,
    tune: "slow-boats-marle.abc",
    assignedDaysAgo: 11,
    dueInDays: 4.3,
    note: "Record it once through; no need for the repeats.",
    checkIns: [{ stage: 1, daysAgo: 2.2, take: "boats-1-linnea", rating: 3 }],
  },
  {
    key: "ruth/ulric/boats",
    teacher: 2,
    student: 20,
    tune: "slow-boats-marle.abc",
    assignedDaysAgo: 16,
    dueInDays: 7.2,
    note: "Keep the bow speed even over the long notes.",
    checkIns: [
      { stage: 1, daysAgo: 9.1, take: "boats-1", rating: 4, review: signed(8.3, "Smooth as anything. On to stage 2.") },
    ],
  },
  {
    key: "ruth/rhodri/boats",
    teacher: 2,
    student: 17,
    tune: "slow-boats-marle.abc",
    assignedDaysAgo: 5,
    dueInDays: 10.2,
    note: "A gentle start to the course.",
    checkIns: [],
  },
  {
    key: "ruth/orla/boats",
    teacher: 2,
    student: 14,
    tune: "slow-boats-marle.abc",
    assignedDaysAgo: 15,
    dueInDays: -1.2,
    note: "The taster tune, while your enrolment is paused.",
    checkIns: [],
  },
  {
    key: "ruth/dagny/boats",
    teacher: 2,
    student: 29,
    tune: "slow-boats-marle.abc",
    assignedDaysAgo: 2,
    dueInDays: 13.1,
    note: "Try the memory mode once you know the A part.",
    checkIns: [],
  },
  {
    key: "ruth/xanthe/boats",
    teacher: 2,
    student: 23,
    tune: "slow-boats-marle.abc",
    assignedDaysAgo: 3,
    dueInDays: 12.2,
    note: "Listen to it twice through before you pick up the fiddle.",
    checkIns: [],
  },
  {
    key: "ruth/anselm/boats",
    teacher: 2,
    student: 26,
    tune: "slow-boats-marle.abc",
    assignedDaysAgo: 6,
    dueInDays: 6.3,
    note: "The taster tune, to keep your hand in.",
    checkIns: [],
  },
];
