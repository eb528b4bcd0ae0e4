// The practice log (issue 6 item 5): one's own entries of minutes, day, tune and a note. The day is
// a calendar day in the student's own time zone and may not lie in their future; the tune is one
// they can open or have been assigned. Someone else's entry answers 404.
import { z } from "zod";
import type { Tx as Db } from "@/db/queries/auth";
import { coursesByIds, enrolmentsOf } from "@/db/queries/catalogue";
import {
  assignedTunes,
  deletePractice,
  insertPractice,
  practiceEntry,
  practiceList,
  tasterTunes,
  updatePractice,
  userZone,
  type PracticeValues,
} from "@/db/queries/learning";
import { notFound, unprocessable } from "@/lib/auth/errors";
import { buildLadder } from "@/lib/catalogue/access";
import { isSaneDay, MAX_YEAR, MIN_YEAR } from "@/lib/validation/text";
import { dayIn } from "./learn-dates";

export const MAX_MINUTES = 600;
export const MAX_NOTE = 1000;

type Person = { id: string; role: "student" | "teacher" | "admin" };

const fields = {
  minutes: z
    .number({ error: "Minutes must be a whole number from 1 to 600." })
    .int("Minutes must be a whole number from 1 to 600.")
    .min(1, "Minutes must be at least 1.")
    .max(MAX_MINUTES, `Minutes can be at most ${MAX_MINUTES} (10 hours) for one entry.`),
  practisedOn: z
    .string({ error: "Give the day you practised." })
    .refine(isSaneDay, `The date must be a real day written as YYYY-MM-DD, in the years ${MIN_YEAR}–${MAX_YEAR}.`),
  tuneId: z.uuid("Choose a tune from the list, or none.").nullable(),
  note: z.string().max(MAX_NOTE, `The note can be at most ${MAX_NOTE} characters.`),
};

const createSchema = z.object({
  minutes: fields.minutes,
  practisedOn: fields.practisedOn,
  tuneId: fields.tuneId.default(null),
  note: fields.note.default(""),
});
const editSchema = createSchema.partial();

/** A form sends numbers as text; an empty tune choice means none. */
function normalise(raw: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const key of ["minutes", "practisedOn", "tuneId", "note"] as const) {
    if (!(key in raw)) continue;
    let v = raw[key];
    if (key === "minutes" && typeof v === "string" && v.trim() !== "") v = Number(v);
    if (key === "tuneId" && (v === "" || v === undefined)) v = null;
    if (key === "note" && typeof v === "string") v = v.trim();
    out[key] = v;
  }
  return out;
}

function parse<S extends z.ZodType>(schema: S, raw: Record<string, unknown>): z.output<S> {
  const parsed = schema.safeParse(normalise(raw));
  if (parsed.success) return parsed.data;
  const fieldErrors: Record<string, string> = {};
  for (const issue of parsed.error.issues) fieldErrors[String(issue.path[0] ?? "form")] ??= issue.message;
  throw unprocessable("Please check the highlighted fields.", fieldErrors);
}

/** Tunes the person may log practice on: assigned to them, on an open rung of their courses, or a taster. */
export async function practiceTunes(db: Db, person: Person): Promise<{ id: string; title: string }[]> {
  const enrolled = (await enrolmentsOf(db, person.id)).map((e) => e.courseId);
  const ladders = await Promise.all((await coursesByIds(db, enrolled)).map((c) => buildLadder(db, person, c)));
  const open = ladders.flatMap((l) =>
    l.grades.flatMap((g) => g.rungs.filter((r) => r.open).map((r) => ({ id: r.tuneId, title: r.tuneTitle }))),
  );
  const all = [...(await assignedTunes(db, person.id)), ...open, ...(await tasterTunes(db))];
  const byId = new Map(all.map((t) => [t.id, t]));
  return [...byId.values()].sort((a, b) => a.title.localeCompare(b.title));
}

async function checkFacts(db: Db, person: Person, v: Partial<PracticeValues>): Promise<void> {
  if (v.practisedOn !== undefined) {
    const today = dayIn(await userZone(db, person.id));
    // "Today" is the student's own day: in Hobart it is already tomorrow for someone in Halifax.
    if (v.practisedOn > today)
      throw unprocessable("Please check the highlighted fields.", {
        practisedOn: `The date can't be in the future: today is ${today} where you are.`,
      });
  }
  if (v.tuneId) {
    const allowed = await practiceTunes(db, person);
    if (!allowed.some((t) => t.id === v.tuneId))
      throw unprocessable("Please check the highlighted fields.", {
        tuneId: "Choose a tune you can open or have been given.",
      });
  }
}

export async function listPractice(db: Db, person: Person) {
  return practiceList(db, person.id);
}

export async function addPractice(db: Db, person: Person, raw: Record<string, unknown>): Promise<string> {
  const v = parse(createSchema, raw);
  await checkFacts(db, person, v);
  return insertPractice(db, person.id, v);
}

const NOT_FOUND = "We couldn't find that practice entry.";

export async function editPractice(db: Db, person: Person, id: string, raw: Record<string, unknown>): Promise<void> {
  const entry = await practiceEntry(db, id);
  if (!entry || entry.userId !== person.id) throw notFound(NOT_FOUND);
  const v = parse(editSchema, raw);
  // An unchanged tune that has since left the list (an assignment withdrawn) stays allowed.
  await checkFacts(db, person, { ...v, tuneId: v.tuneId === entry.tuneId ? undefined : v.tuneId });
  if (!(await updatePractice(db, id, person.id, v))) throw notFound(NOT_FOUND);
}

export async function removePractice(db: Db, person: Person, id: string): Promise<void> {
  if (!(await deletePractice(db, id, person.id))) throw notFound(NOT_FOUND);
}
