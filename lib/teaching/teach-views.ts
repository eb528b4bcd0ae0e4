// Assignment rows shaped for the teacher's pages and routes.
import type { AssignmentListRow } from "@/db/queries/teaching-assign";
import { formZone } from "./assignments";
import type { AssignmentView } from "./teach-api-types";
import { instantToZonedLocal } from "./teach-time";

export function assignmentView(row: AssignmentListRow, now: Date): AssignmentView {
  const a = row.a;
  const zone = formZone(row.students, row.teacherZone);
  return {
    id: a.id,
    tune: { id: a.tuneId, title: row.tuneTitle },
    teacherName: row.teacherName,
    dueAt: a.dueAt.toISOString(),
    dueLocal: instantToZonedLocal(a.dueAt, zone),
    dueZone: zone,
    stagePlan: a.stagePlan,
    tunePlan: row.tunePlan,
    unlockRule: a.unlockRule,
    unlockMinutes: a.unlockMinutes,
    note: a.note,
    status: a.status,
    overdue:
      a.status === "active" && a.dueAt.getTime() < now.getTime() && row.students.some((s) => s.signedOff < s.stages),
    students: row.students.map(({ assignmentId: _a, ...s }) => s),
  };
}
