// Streamed CSV for the admin tables' "Export CSV": rows come from keyset batches (never one big
// array) and go out through csv-stringify as they arrive. RFC 4180: CRLF line ends, a header
// line, fields with commas, quotes or line breaks quoted with inner quotes doubled (csv-stringify
// does the quoting; record_delimiter "windows" gives the CRLF).
import { pipeline, Readable } from "node:stream";
import { stringify } from "csv-stringify";
import type { Cursor } from "@/db/queries/admin-sql";

export type CsvColumn<R> = { header: string; value: (row: R) => string | number | null };

/** Rows in the table's order, fetched `batch` at a time after the last row's sort key and id. */
export async function* keysetRows<R extends { id: string; cursorKey: string }>(
  fetch: (after: Cursor | null, limit: number) => Promise<R[]>,
  batch = 500,
): AsyncGenerator<R> {
  let cursor: Cursor | null = null;
  for (;;) {
    const rows = await fetch(cursor, batch);
    yield* rows;
    const last = rows.at(-1);
    if (!last || rows.length < batch) return;
    cursor = { key: last.cursorKey, id: last.id };
  }
}

// A cell a spreadsheet would run as a formula is prefixed with ' (OWASP: CSV injection; common practice).
const FORMULA = /^[=+\-@\t\r]/;
export function safeText(s: string | null | undefined): string {
  if (!s) return "";
  return FORMULA.test(s) ? `'${s}` : s;
}

/** Minor units as a plain decimal in the currency's own exponent (1850 GBP → "18.50", 500 JPY → "500"). */
export function decimalOf(minor: number, currency: string): string {
  const digits =
    new Intl.NumberFormat("en", { style: "currency", currency }).resolvedOptions().maximumFractionDigits ?? 2;
  const sign = minor < 0 ? "-" : "";
  const abs = Math.abs(minor);
  if (digits === 0) return `${sign}${abs}`;
  const unit = 10 ** digits;
  return `${sign}${Math.floor(abs / unit)}.${String(abs % unit).padStart(digits, "0")}`;
}

/**
 * A streamed CSV answer: the header line, then one line per row as the batches arrive. The first row
 * is read before answering, so a failure there is an ordinary error answer; a failure after the first
 * bytes went out ends the body with an error (stream.pipeline destroys it), which the client sees as a
 * broken download instead of a request that never ends.
 */
export async function csvResponse<R>(
  filename: string,
  rows: AsyncIterable<R>,
  columns: CsvColumn<R>[],
): Promise<Response> {
  const it = rows[Symbol.asyncIterator]();
  const first = await it.next();
  async function* records() {
    for (let r = first; !r.done; r = await it.next()) yield columns.map((c) => c.value(r.value) ?? "");
  }
  const csv = stringify({ header: true, columns: columns.map((c) => c.header), record_delimiter: "windows" });
  pipeline(Readable.from(records()), csv, (error) => {
    if (error) console.error(`[export] ${filename} stopped part way:`, error);
  });
  return new Response(Readable.toWeb(csv) as ReadableStream<Uint8Array>, {
    headers: {
      // RFC 4180 §3 (text/csv, with its "header" parameter); RFC 6266 (Content-Disposition).
      "content-type": "text/csv; charset=utf-8; header=present",
      "content-disposition": `attachment; filename="${filename}"`,
      "cache-control": "no-store",
      "x-content-type-options": "nosniff",
    },
  });
}

/** today's date in UTC for the file's name. */
export const stamp = (now = new Date()) => now.toISOString().slice(0, 10);
