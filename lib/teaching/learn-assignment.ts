// One assignment as its student sees it (issue 6 item 3): the stages with their state and latest
// check-in, whether the music is open (membership gate; taster-rung tunes always), and the music
// of the stage being worked on. Anyone but the assignment's student is answered 404.
import type { Tx as Db } from "@/db/queries/auth";
import {
  assignmentOfStudent,
  checkInsOfStages,
  stageStatesOf,
  tuneIsTaster,
  userZone,
  type AssignmentRow,
} from "@/db/queries/learning";
import { notFound } from "@/lib/auth/errors";
import { memberStanding } from "@/lib/billing/gate";
import { phraseMapOf } from "@/lib/catalogue/phrase-map";
import type { PhraseMap } from "@/lib/abc/phrase-types";
import { dueWords } from "./learn-dates";
import type { CheckInStatus, StageState } from "./state-machine";
import { assignmentStages } from "./teach-stages";
import { selfCheckOf, type SelfCheck } from "./learn-self-check";

export type Person = { id: string; role: "student" | "teacher" | "admin" };

export type LearnCheckIn = {
  id: string;
  status: CheckInStatus;
  selfRating: number;
  fromMemory: boolean;
  feedback: string | null;
  createdAt: string;
  reviewedAt: string | null;
};

export type LearnStage = {
  index: number;
  name: string;
  state: StageState;
  openedAt: string | null;
  checkIn: LearnCheckIn | null;
};

export type LearnAssignment = {
  assignmentStudentId: string;
  status: "active" | "withdrawn";
  tune: { id: string; title: string };
  teacherName: string;
  dueAt: string;
  dueLocal: string;
  timeZone: string;
  overdue: boolean;
  note: string;
  unlockRule: "teacher_sign_off" | "self_check_in";
  unlockMinutes: number | null;
  /** Whether the stages' music may be opened; when not, `closedWhy` says what would open it. */
  musicOpen: boolean;
  closedWhy?: string;
  stages: LearnStage[];
  /** The stage being worked on: open or checked in, the lowest such. */
  current: number | null;
  /** The current stage's music, only when the music is open. */
  music: { index: number; name: string; abc: string; phraseMap: PhraseMap | null } | null;
  /** The listening aid's hearing of the latest recording checked in, only when the music is open. */
  selfCheck: SelfCheck | null;
};

const NOT_FOUND = "We couldn't find that assignment.";

/** The row when it belongs to this person, else 404 (someone else's assignment is not found). */
export async function ownAssignment(db: Db, person: Person, assignmentStudentId: string): Promise<AssignmentRow> {
  const row = await assignmentOfStudent(db, assignmentStudentId);
  if (!row || row.studentId !== person.id) throw notFound(NOT_FOUND);
  return row;
}

/** Whether the assignment's music is open to its student: taster-rung tunes always, else by membership. */
export async function musicGate(
  db: Db,
  person: Person,
  tuneId: string,
  now = new Date(),
): Promise<{ open: true } | { open: false; why: string }> {
  if (await tuneIsTaster(db, tuneId)) return { open: true };
  const standing = await memberStanding(db, person, now);
  return standing.good ? { open: true } : { open: false, why: standing.why };
}

function checkInJson(c: Awaited<ReturnType<typeof checkInsOfStages>>[number]): LearnCheckIn {
  return {
    id: c.id,
    status: c.status,
    selfRating: c.selfRating,
    fromMemory: c.fromMemory,
    feedback: c.feedback,
    createdAt: c.createdAt.toISOString(),
    reviewedAt: c.reviewedAt?.toISOString() ?? null,
  };
}

export async function learnAssignment(
  db: Db,
  person: Person,
  assignmentStudentId: string,
  now = new Date(),
): Promise<LearnAssignment> {
  const row = await ownAssignment(db, person, assignmentStudentId);
  const [zone, states, planned, gate] = await Promise.all([
    userZone(db, person.id),
    stageStatesOf(db, [row.assignmentStudentId]),
    assignmentStages(db, row.tuneId, row.stagePlan),
    musicGate(db, person, row.tuneId, now),
  ]);
  const checks = await checkInsOfStages(
    db,
    states.map((s) => s.id),
  );
  const stages: LearnStage[] = states.map((s) => {
    const latest = checks.find((c) => c.stageStateId === s.id); // newest first
    return {
      index: s.index,
      name: planned.find((p) => p.index === s.index)?.name ?? `Stage ${s.index}`,
      state: s.state,
      openedAt: s.openedAt?.toISOString() ?? null,
      checkIn: latest ? checkInJson(latest) : null,
    };
  });
  const current = stages.find((s) => s.state === "open" || s.state === "checked_in")?.index ?? null;
  const currentStage = planned.find((p) => p.index === current);
  const allDone = stages.length > 0 && stages.every((s) => s.state === "signed_off");
  const indexOf = new Map(states.map((s) => [s.id, s.index]));
  const selfCheck = gate.open ? await selfCheckOf(db, checks, (id) => indexOf.get(id), planned) : null;
  return {
    assignmentStudentId: row.assignmentStudentId,
    status: row.status,
    tune: { id: row.tuneId, title: row.tuneTitle },
    teacherName: row.teacherName,
    dueAt: row.dueAt.toISOString(),
    dueLocal: dueWords(row.dueAt, zone),
    timeZone: zone,
    overdue: !allDone && row.dueAt < now,
    note: row.note,
    unlockRule: row.unlockRule,
    unlockMinutes: row.unlockMinutes,
    musicOpen: gate.open,
    ...(gate.open ? {} : { closedWhy: gate.why }),
    stages,
    current,
    music:
      gate.open && currentStage
        ? {
            index: currentStage.index,
            name: currentStage.name,
            abc: currentStage.abc,
            phraseMap: phraseMapOf(planned[0]?.abc ?? currentStage.abc),
          }
        : null,
    selfCheck,
  };
}
