// Bulk import: every tune of a file checked (checkTune, with the engine's limits per tune) and
// saved on its own, one result per tune, so a bad tune never stops the good ones. The route streams
// these results as NDJSON, one line per tune, and the page moves its progress bar as each arrives.
// Each result carries the tune's notes, which do not stop a save.
import type { Db } from "@/db/client";
import { findTuneByAbc } from "@/db/queries/tunes";
import type { TuneText } from "@/lib/abc/split";
import type { Problem } from "@/lib/abc/types";
import { checkTune } from "./check";
import { headerField } from "./header";
import { storeNewTune } from "./save";

export type ImportEvent =
  | { type: "start"; total: number }
  | {
      type: "tune";
      n: number;
      line: number;
      title: string;
      status: "saved" | "unchanged";
      tuneId: string;
      notes: Problem[];
    }
  | { type: "tune"; n: number; line: number; title: string; status: "problems"; problems: Problem[]; notes: Problem[] }
  | { type: "done"; saved: number; unchanged: number; failed: number };

async function importOne(db: Db, teacherId: string, t: TuneText, n: number): Promise<ImportEvent> {
  const line = t.lineOffset + 1;
  const title = headerField(t.abc, "T") || `Tune ${n} (no title)`;
  const check = checkTune(t.abc, { lineOffset: t.lineOffset });
  const notes = check.notes;
  if (!check.ok) return { type: "tune", n, line, title, status: "problems", problems: check.problems, notes };
  // The same text again (a file imported twice) is reported, not stored twice.
  const same = await findTuneByAbc(db, teacherId, check.value.abc);
  if (same) return { type: "tune", n, line, title: check.value.title, status: "unchanged", tuneId: same.id, notes };
  const tuneId = await storeNewTune(db, teacherId, check.value);
  return { type: "tune", n, line, title: check.value.title, status: "saved", tuneId, notes };
}

export async function* importTunes(db: Db, teacherId: string, tunes: readonly TuneText[]): AsyncGenerator<ImportEvent> {
  yield { type: "start", total: tunes.length };
  const count = { saved: 0, unchanged: 0, failed: 0 };
  for (const [i, t] of tunes.entries()) {
    let event: ImportEvent;
    try {
      event = await importOne(db, teacherId, t, i + 1);
    } catch (e) {
      console.error(e);
      const message =
        "This tune could not be saved because of a fault on our side; the others were not affected. Try it again on its own.";
      event = {
        type: "tune",
        n: i + 1,
        line: t.lineOffset + 1,
        title: headerField(t.abc, "T") || `Tune ${i + 1}`,
        status: "problems",
        problems: [{ line: t.lineOffset + 1, column: 1, message }],
        notes: [],
      };
    }
    if (event.type === "tune") count[event.status === "problems" ? "failed" : event.status] += 1;
    yield event;
  }
  yield { type: "done", ...count };
}

/** The events as a stream of NDJSON lines (one JSON object and "\n" per event). */
export function ndjson(events: AsyncIterable<ImportEvent>): ReadableStream<Uint8Array> {
  const encoder = new TextEncoder();
  const iterator = events[Symbol.asyncIterator]();
  return new ReadableStream({
    async pull(controller) {
      const next = await iterator.next();
      if (next.done) controller.close();
      else controller.enqueue(encoder.encode(`${JSON.stringify(next.value)}\n`));
    },
    async cancel() {
      await iterator.return?.(undefined);
    },
  });
}
