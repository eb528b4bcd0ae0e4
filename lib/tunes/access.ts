// Which tunes a person may edit: a teacher their own, an admin every one (issue 5). Someone
// else's tune answers 404 exactly like a missing one, so ids of other teachers' work leak nothing
// (the same choice as /api/people/[id]).
import type { Db } from "@/db/client";
import { findTune, type TuneRow } from "@/db/queries/tunes";
import type { CurrentUser } from "@/lib/auth/current-user";
import { notFound, unauthorized } from "@/lib/auth/errors";

export type Editor = Pick<CurrentUser, "id" | "role">;

export function mayEdit(user: Editor, ownerId: string): boolean {
  return user.role === "admin" || user.id === ownerId;
}

/** The signed-in person; the guard has already checked the action, this only narrows the type. */
export function editorOf(user: CurrentUser | null): Editor {
  if (!user) throw unauthorized();
  return user;
}

export async function editableTune(db: Db, user: Editor, tuneId: string): Promise<TuneRow> {
  const tune = await findTune(db, tuneId);
  if (!tune || !mayEdit(user, tune.teacherId)) throw notFound("We couldn't find that tune among yours.");
  return tune;
}
