import { jsonb, pgEnum, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { checkIns } from "./teaching";

export const listeningStatusEnum = pgEnum("listening_status", ["done", "failed"]);

/**
 * The listening aid's hearing of a check-in's recording (lib/listen), kept with the check-in. No row
 * yet: the analysis is queued or running. A failure keeps its reason; the check-in never waits on it.
 */
export const checkInListenings = pgTable("check_in_listenings", {
  checkInId: uuid("check_in_id")
    .primaryKey()
    .references(() => checkIns.id, { onDelete: "cascade" }),
  status: listeningStatusEnum("status").notNull(),
  // lib/listen's ListenResult as JSON (db/ does not import lib/: its shape is checked where it is read)
  result: jsonb("result").$type<Record<string, unknown>>(),
  error: text("error"),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
});
