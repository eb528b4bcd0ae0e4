// Where a check-in sits: its stage, the student's place on the assignment, and the assignment. The
// teacher's review queue and its count (teaching-review.ts) and the student's feedback
// (learning.ts) reach the assignment from a check-in this way.
import { eq } from "drizzle-orm";
import type { PgSelect } from "drizzle-orm/pg-core";
import { assignments, assignmentStudents, checkIns, stageStates } from "../schema";

/** Joins a dynamic select from check_ins (`.from(checkIns).$dynamic()`) to its stage, place and assignment. */
export function toAssignment<T extends PgSelect>(query: T) {
  return query
    .innerJoin(stageStates, eq(stageStates.id, checkIns.stageStateId))
    .innerJoin(assignmentStudents, eq(assignmentStudents.id, stageStates.assignmentStudentId))
    .innerJoin(assignments, eq(assignments.id, assignmentStudents.assignmentId));
}
