// Where a check-in sits: its stage, and the stage's holder — the student's place on an assignment and
// the assignment, or the tune they climb on an enrolled course and the enrolment. The teacher's
// review queue and its count (teaching-review.ts) and the student's feedback (learning.ts) reach
// the teacher and the tune from a check-in this way.
import { eq, sql } from "drizzle-orm";
import type { PgSelect } from "drizzle-orm/pg-core";
import { assignments, assignmentStudents, checkIns, courses, enrolments, enrolmentTunes, stageStates } from "../schema";

/** Joins a dynamic select from check_ins (`.from(checkIns).$dynamic()`) to its stage, place and assignment. */
export function toAssignment<T extends PgSelect>(query: T) {
  return query
    .innerJoin(stageStates, eq(stageStates.id, checkIns.stageStateId))
    .innerJoin(assignmentStudents, eq(assignmentStudents.id, stageStates.assignmentStudentId))
    .innerJoin(assignments, eq(assignments.id, assignmentStudents.assignmentId));
}

/** Joins a dynamic select from check_ins to its stage and either holder (use placeOf's columns to read them). */
export function toPlace<T extends PgSelect>(query: T) {
  return query
    .innerJoin(stageStates, eq(stageStates.id, checkIns.stageStateId))
    .leftJoin(assignmentStudents, eq(assignmentStudents.id, stageStates.assignmentStudentId))
    .leftJoin(assignments, eq(assignments.id, assignmentStudents.assignmentId))
    .leftJoin(enrolmentTunes, eq(enrolmentTunes.id, stageStates.enrolmentTuneId))
    .leftJoin(enrolments, eq(enrolments.id, enrolmentTunes.enrolmentId))
    .leftJoin(courses, eq(courses.id, enrolments.courseId));
}

/** The holder's facts after toPlace: who follows the student, which tune, and whether the holder is active. */
export const placeOf = {
  teacherId: sql<string>`coalesce(${assignments.teacherId}, ${enrolments.teacherId})`,
  tuneId: sql<string>`coalesce(${assignments.tuneId}, ${enrolmentTunes.tuneId})`,
  active: sql<boolean>`coalesce(${assignments.status} = 'active', ${enrolments.status} = 'active')`,
};
