// The JSON the teacher's assignment, review and roster routes answer with; shared by the routes and
// the pages' client components (no server imports here).
import type { StagePlanJson } from "@/db/schema/catalogue";
import type { ListeningView } from "@/lib/listen/view";

export type AssignmentStudentView = {
  assignmentStudentId: string;
  studentId: string;
  name: string;
  timeZone: string;
  stages: number;
  signedOff: number;
  waiting: number;
};

export type AssignmentView = {
  id: string;
  tune: { id: string; title: string };
  teacherName: string;
  dueAt: string;
  /** The due date on the wall clock of `dueZone`: the zone the edit form shows it in. */
  dueLocal: string;
  dueZone: string;
  /** null: the tune's own stages. */
  stagePlan: StagePlanJson | null;
  /** The tune's own plan (null: the engine's default), for the edit form's plan grid. */
  tunePlan: StagePlanJson | null;
  unlockRule: "teacher_sign_off" | "self_check_in";
  unlockMinutes: number | null;
  note: string;
  status: "active" | "withdrawn";
  overdue: boolean;
  students: AssignmentStudentView[];
};

export type ReviewItem = {
  checkInId: string;
  createdAt: string;
  student: { id: string; name: string };
  tune: { id: string; title: string };
  /** The assignment the check-in belongs to; null for a course's stage (then `courseTitle` names the course). */
  assignmentId: string | null;
  courseTitle?: string | null;
  stage: { index: number; name: string; abc: string; count: number };
  selfRating: number;
  fromMemory: boolean;
  uploadId: string | null;
  /** The listening aid's hearing of the recording (lib/listen): a suggestion beside it, never the decision. */
  listening: ListeningView | null;
};

export type RosterRow = {
  studentId: string;
  name: string;
  email: string;
  lastPractice: string | null;
  openAssignments: number;
  overdueAssignments: number;
};
