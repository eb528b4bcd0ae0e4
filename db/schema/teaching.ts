import {
  boolean,
  check,
  date,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
  unique,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";
import { sql } from "drizzle-orm";
import { users } from "./people";
import { enrolments, tunes, type StagePlanJson } from "./catalogue";
import { uploads } from "./system";

export const unlockRuleEnum = pgEnum("unlock_rule", ["teacher_sign_off", "self_check_in"]);
export const assignmentStatusEnum = pgEnum("assignment_status", ["active", "withdrawn"]);

export const assignments = pgTable(
  "assignments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teacherId: uuid("teacher_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    tuneId: uuid("tune_id")
      .notNull()
      .references(() => tunes.id, { onDelete: "restrict" }),
    dueAt: timestamp("due_at", { withTimezone: true }).notNull(),
    stagePlan: jsonb("stage_plan").$type<StagePlanJson>(),
    unlockRule: unlockRuleEnum("unlock_rule").notNull().default("teacher_sign_off"),
    // For self_check_in: practice minutes on this tune needed before a student's own check-in opens the next stage.
    unlockMinutes: integer("unlock_minutes"),
    note: text("note").notNull().default(""),
    status: assignmentStatusEnum("status").notNull().default("active"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("assignments_teacher_idx").on(t.teacherId), index("assignments_due_idx").on(t.dueAt)],
);

/** One student's copy of an assignment. */
export const assignmentStudents = pgTable(
  "assignment_students",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    assignmentId: uuid("assignment_id")
      .notNull()
      .references(() => assignments.id, { onDelete: "cascade" }),
    studentId: uuid("student_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
  },
  (t) => [
    unique("assignment_students_uq").on(t.assignmentId, t.studentId),
    index("assignment_students_student_idx").on(t.studentId),
  ],
);

/**
 * One tune a member climbs on an enrolled course: the holder of that tune's stage rows there, as an
 * assignment_students row is for an assignment. Made at the member's first step on the tune.
 */
export const enrolmentTunes = pgTable(
  "enrolment_tunes",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    enrolmentId: uuid("enrolment_id")
      .notNull()
      .references(() => enrolments.id, { onDelete: "cascade" }),
    tuneId: uuid("tune_id")
      .notNull()
      .references(() => tunes.id, { onDelete: "cascade" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique("enrolment_tunes_uq").on(t.enrolmentId, t.tuneId), index("enrolment_tunes_tune_idx").on(t.tuneId)],
);

export const stageStateEnum = pgEnum("stage_state", ["locked", "open", "checked_in", "signed_off"]);

/** A stage of a tune for one student: on an assignment, or on a course they climb (exactly one of the two). */
export const stageStates = pgTable(
  "stage_states",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    assignmentStudentId: uuid("assignment_student_id").references(() => assignmentStudents.id, {
      onDelete: "cascade",
    }),
    enrolmentTuneId: uuid("enrolment_tune_id").references(() => enrolmentTunes.id, { onDelete: "cascade" }),
    stageIndex: integer("stage_index").notNull(),
    state: stageStateEnum("state").notNull().default("locked"),
    openedAt: timestamp("opened_at", { withTimezone: true }),
    signedOffAt: timestamp("signed_off_at", { withTimezone: true }),
  },
  (t) => [
    unique("stage_states_uq").on(t.assignmentStudentId, t.stageIndex),
    unique("stage_states_enrolment_tune_uq").on(t.enrolmentTuneId, t.stageIndex),
    check("stage_states_one_holder", sql`num_nonnulls(${t.assignmentStudentId}, ${t.enrolmentTuneId}) = 1`),
  ],
);

export const checkInStatusEnum = pgEnum("check_in_status", ["waiting", "signed_off", "needs_more_time", "withdrawn"]);

export const checkIns = pgTable(
  "check_ins",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    stageStateId: uuid("stage_state_id")
      .notNull()
      .references(() => stageStates.id, { onDelete: "cascade" }),
    studentId: uuid("student_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    uploadId: uuid("upload_id").references(() => uploads.id, { onDelete: "set null" }),
    selfRating: integer("self_rating").notNull(),
    fromMemory: boolean("from_memory").notNull().default(false),
    status: checkInStatusEnum("status").notNull().default("waiting"),
    // Signed off by the check-in itself (a self-paced course, an assignment's self check-in rule): no
    // review stands behind it, and its teacher may still leave a word (feedback, reviewed_by).
    selfSignedOff: boolean("self_signed_off").notNull().default(false),
    feedback: text("feedback"),
    reviewedBy: uuid("reviewed_by").references(() => users.id, { onDelete: "set null" }),
    reviewedAt: timestamp("reviewed_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    // At most one check-in waiting for review per stage: a double check-in cannot create two.
    uniqueIndex("check_ins_one_waiting_uq")
      .on(t.stageStateId)
      .where(sql`${t.status} = 'waiting'`),
    index("check_ins_status_created_idx").on(t.status, t.createdAt),
    check("check_ins_rating_range", sql`${t.selfRating} between 1 and 5`),
  ],
);

export const practiceLogs = pgTable(
  "practice_logs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    tuneId: uuid("tune_id").references(() => tunes.id, { onDelete: "set null" }),
    practisedOn: date("practised_on", { mode: "string" }).notNull(),
    minutes: integer("minutes").notNull(),
    note: text("note").notNull().default(""),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("practice_logs_user_day_idx").on(t.userId, t.practisedOn),
    check("practice_logs_minutes_range", sql`${t.minutes} between 1 and 600`),
  ],
);
