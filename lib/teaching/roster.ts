// The teacher's roster table (issue 6 item 4): their own students; an admin sees every student.
import type { Tx } from "@/db/queries/auth";
import { rosterFigures } from "@/db/queries/teaching-review";
import type { Manager } from "./assignments";
import type { RosterRow } from "./teach-api-types";

export async function rosterTable(db: Tx, me: Manager, now: Date): Promise<RosterRow[]> {
  return rosterFigures(db, me.role === "admin" ? null : me.id, now);
}
