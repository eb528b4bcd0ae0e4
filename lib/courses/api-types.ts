// What the ladder bench's routes answer, as plain types the browser can import.
import type { RuleProblem } from "./rules";

export interface CourseSummary {
  id: string;
  title: string;
  slug: string;
  summary: string;
  published: boolean;
  teacherName: string;
  gradeCount: number;
  rungCount: number;
}

export interface RungView {
  id: string;
  tuneId: string;
  tuneTitle: string;
  requiredStage: number;
  stageCount: number;
  stageNames: string[];
  isTaster: boolean;
}

export interface GradeView {
  id: string;
  title: string;
  rungs: RungView[];
}

export interface CourseView {
  id: string;
  title: string;
  slug: string;
  summary: string;
  published: boolean;
  /** Who follows new members; every enrolment starts with them. */
  leadTeacherId: string;
  pace: "self_paced" | "teacher_sign_off";
  /** Who may lead it: the school's teachers (and admins). */
  staff: { id: string; name: string }[];
  grades: GradeView[];
  /** What would stop it being published now (empty when it could be). */
  problems: RuleProblem[];
  hints: string[];
}
