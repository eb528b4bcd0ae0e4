import {
  boolean,
  check,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  unique,
  uuid,
} from "drizzle-orm/pg-core";
import { sql } from "drizzle-orm";
import { users } from "./people";
import { TUNE_TYPES } from "../../lib/tunes/header";

/** A stage plan as the tune engine takes it (lib/abc/types.ts StagePlan): kinds added per stage. */
export type StagePlanJson = { stages: { name: string; adds: string[] }[] };

/** How a course's stages open: the student's own check-in, or the teacher's sign-off. */
export const coursePaceEnum = pgEnum("course_pace", ["self_paced", "teacher_sign_off"]);

export const courses = pgTable(
  "courses",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    // Who wrote the course and may edit it.
    teacherId: uuid("teacher_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    // Who follows its new members: each enrolment starts with this teacher.
    leadTeacherId: uuid("lead_teacher_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    pace: coursePaceEnum("pace").notNull().default("teacher_sign_off"),
    slug: text("slug").notNull().unique(),
    title: text("title").notNull(),
    summary: text("summary").notNull().default(""),
    publishedAt: timestamp("published_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("courses_teacher_idx").on(t.teacherId)],
);

export const grades = pgTable(
  "grades",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    courseId: uuid("course_id")
      .notNull()
      .references(() => courses.id, { onDelete: "cascade" }),
    position: integer("position").notNull(),
    title: text("title").notNull(),
  },
  // A reorder moves positions through negative numbers inside one transaction to keep this unique.
  (t) => [unique("grades_course_position_uq").on(t.courseId, t.position)],
);

export const tuneTypeEnum = pgEnum("tune_type", TUNE_TYPES);

export const tunes = pgTable(
  "tunes",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teacherId: uuid("teacher_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    title: text("title").notNull(),
    tuneType: tuneTypeEnum("tune_type").notNull().default("other"),
    key: text("key").notNull().default(""),
    meter: text("meter").notNull().default(""),
    // The full setting as the teacher wrote it.
    abc: text("abc").notNull(),
    stagePlan: jsonb("stage_plan").$type<StagePlanJson>(),
    // Phrase ids whose twin swap the teacher accepted for the learning version.
    acceptedSwaps: jsonb("accepted_swaps").$type<string[]>().notNull().default([]),
    // Bars (melody bar index → "upper" | "lower") whose double stops the teacher turned to the other voice.
    turnedBars: jsonb("turned_bars").$type<Record<string, "upper" | "lower">>().notNull().default({}),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("tunes_teacher_idx").on(t.teacherId), index("tunes_title_idx").on(sql`lower(${t.title})`)],
);

export const tuneStages = pgTable(
  "tune_stages",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    tuneId: uuid("tune_id")
      .notNull()
      .references(() => tunes.id, { onDelete: "cascade" }),
    index: integer("index").notNull(),
    name: text("name").notNull(),
    kinds: jsonb("kinds").$type<string[]>().notNull(),
    abc: text("abc").notNull(),
    // A hand-edited stage is kept as written; flagged when the tune's source changes afterwards.
    handEdited: boolean("hand_edited").notNull().default(false),
    sourceChanged: boolean("source_changed").notNull().default(false),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    unique("tune_stages_tune_index_uq").on(t.tuneId, t.index),
    check("tune_stages_index_pos", sql`${t.index} >= 1`),
  ],
);

export const rungs = pgTable(
  "rungs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    gradeId: uuid("grade_id")
      .notNull()
      .references(() => grades.id, { onDelete: "cascade" }),
    tuneId: uuid("tune_id")
      .notNull()
      .references(() => tunes.id, { onDelete: "restrict" }),
    position: integer("position").notNull(),
    // The stage a student must reach on this rung before the next rung opens.
    requiredStage: integer("required_stage").notNull().default(1),
    isTaster: boolean("is_taster").notNull().default(false),
  },
  (t) => [
    unique("rungs_grade_position_uq").on(t.gradeId, t.position),
    index("rungs_tune_idx").on(t.tuneId),
    check("rungs_required_stage_pos", sql`${t.requiredStage} >= 1`),
  ],
);

export const enrolmentStatusEnum = pgEnum("enrolment_status", ["active", "paused", "ended"]);

export const enrolments = pgTable(
  "enrolments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    courseId: uuid("course_id")
      .notNull()
      .references(() => courses.id, { onDelete: "cascade" }),
    status: enrolmentStatusEnum("status").notNull().default("active"),
    enrolledAt: timestamp("enrolled_at", { withTimezone: true }).notNull().defaultNow(),
    endedAt: timestamp("ended_at", { withTimezone: true }),
    // The teacher who follows this member on this course (the course's lead teacher at first).
    teacherId: uuid("teacher_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    // Since when that teacher follows them: "new this week" on the roster and the daily new-members e-mail.
    teacherSince: timestamp("teacher_since", { withTimezone: true }).notNull().defaultNow(),
    // When that teacher sent a welcome note (null: not yet).
    welcomedAt: timestamp("welcomed_at", { withTimezone: true }),
  },
  (t) => [
    unique("enrolments_user_course_uq").on(t.userId, t.courseId),
    index("enrolments_course_idx").on(t.courseId),
    index("enrolments_teacher_since_idx").on(t.teacherId, t.teacherSince),
  ],
);

/** Private pencil notes pinned to a bar of a tune; only their writer reads them. */
export const marginNotes = pgTable(
  "margin_notes",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    tuneId: uuid("tune_id")
      .notNull()
      .references(() => tunes.id, { onDelete: "cascade" }),
    bar: integer("bar").notNull(),
    body: text("body").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("margin_notes_user_tune_idx").on(t.userId, t.tuneId),
    check("margin_notes_bar_nonneg", sql`${t.bar} >= 0`),
  ],
);

/**
 * How far a student has come on a tune: the highest stage signed off (or self-checked-in where the
 * assignment allows it). The ladder opens the next rung when this reaches the rung's required stage.
 */
export const tuneProgress = pgTable(
  "tune_progress",
  {
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    tuneId: uuid("tune_id")
      .notNull()
      .references(() => tunes.id, { onDelete: "cascade" }),
    reachedStage: integer("reached_stage").notNull().default(0),
    startedAt: timestamp("started_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    primaryKey({ columns: [t.userId, t.tuneId] }),
    check("tune_progress_stage_nonneg", sql`${t.reachedStage} >= 0`),
  ],
);
