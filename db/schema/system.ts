import { bigint, index, integer, jsonb, pgEnum, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { users } from "./people";
import { assignmentStudents, enrolmentTunes } from "./teaching";

export const uploadStatusEnum = pgEnum("upload_status", ["pending", "stored", "rejected"]);

/** Objects in S3-compatible storage (recordings); the bytes never live in the database. */
export const uploads = pgTable(
  "uploads",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    ownerId: uuid("owner_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    storageKey: text("storage_key").notNull().unique(),
    contentType: text("content_type").notNull(),
    sizeBytes: bigint("size_bytes", { mode: "number" }).notNull(),
    // The student's assignment the recording belongs to; a presigned upload is only issued for one's own.
    assignmentStudentId: uuid("assignment_student_id").references(() => assignmentStudents.id, { onDelete: "cascade" }),
    // Or the tune the student climbs on a course (lib/teaching/course-check-in.ts).
    enrolmentTuneId: uuid("enrolment_tune_id").references(() => enrolmentTunes.id, { onDelete: "cascade" }),
    stageIndex: integer("stage_index"),
    status: uploadStatusEnum("status").notNull().default("pending"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("uploads_owner_idx").on(t.ownerId)],
);

export const outboxStatusEnum = pgEnum("outbox_status", ["queued", "sent", "failed"]);

/** Every e-mail is written here first and sent by the job queue, so a provider failure loses nothing. */
export const emailOutbox = pgTable(
  "email_outbox",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    toAddress: text("to_address").notNull(),
    template: text("template").notNull(),
    subject: text("subject").notNull(),
    payload: jsonb("payload").$type<Record<string, unknown>>().notNull(),
    // Makes "at most once" rules (a reminder per assignment and student) a unique constraint.
    dedupeKey: text("dedupe_key").unique(),
    // Not sent before this (a review's note that its teacher can still undo); null: at once.
    sendAfter: timestamp("send_after", { withTimezone: true }),
    status: outboxStatusEnum("status").notNull().default("queued"),
    attempts: integer("attempts").notNull().default(0),
    providerId: text("provider_id"),
    lastError: text("last_error"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp("sent_at", { withTimezone: true }),
  },
  (t) => [index("email_outbox_status_idx").on(t.status, t.createdAt)],
);
