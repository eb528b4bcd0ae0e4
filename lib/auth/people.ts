import { db } from "@/db/client";
import { findUserById, updateUser } from "@/db/queries/auth";
import { isOnRoster, searchPeople, type Role } from "@/db/queries/people";
import type { ActionState } from "./action-state";
import type { RequestContext } from "./context";
import type { CurrentUser } from "./current-user";
import { conflict, notFound, unauthorized } from "./errors";

export const PEOPLE_PAGE_SIZE = 20;

/**
 * Which people's data a signed-in person may reach (PRODUCT.md §2): their own, their roster's if
 * they teach, everyone's if they are an admin. Callers answer 404 otherwise, so that a record
 * nobody showed you is indistinguishable from one that does not exist.
 */
export async function canReachPerson(user: CurrentUser, personId: string): Promise<boolean> {
  if (user.role === "admin" || user.id === personId) return true;
  if (user.role === "teacher") return isOnRoster(db(), user.id, personId);
  return false;
}

export async function personProfile(user: CurrentUser, personId: string) {
  if (!(await canReachPerson(user, personId))) throw notFound("We couldn't find that person.");
  const person = await findUserById(db(), personId);
  if (!person) throw notFound("We couldn't find that person.");
  return { id: person.id, name: person.name, email: person.email, role: person.role };
}

export function listPeople(input: { q?: string; role?: Role; page: number }) {
  return searchPeople(db(), { query: input.q, role: input.role, page: input.page, pageSize: PEOPLE_PAGE_SIZE });
}

const ROLE_WORD: Record<Role, string> = { student: "a student", teacher: "a teacher", admin: "an admin" };

export async function changeRole(ctx: RequestContext, input: { userId: string; role: Role }): Promise<ActionState> {
  if (!ctx.user) throw unauthorized();
  // An admin demoting themselves could leave the school with nobody able to undo it.
  if (input.userId === ctx.user.id) throw conflict("You can't change your own role. Ask another admin.");
  const person = await findUserById(db(), input.userId);
  if (!person) throw notFound("We couldn't find that person.");
  if (person.role === input.role)
    return { status: 200, message: `${person.name} is already ${ROLE_WORD[input.role]}.` };
  await updateUser(db(), person.id, { role: input.role });
  return { status: 200, message: `${person.name} is now ${ROLE_WORD[input.role]}.` };
}
