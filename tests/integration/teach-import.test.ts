// Bulk import through its route: one streamed result per tune, bad tunes never stop the good ones,
// problems at the FILE's line, and the limits refused with clear words before anything is stored.
import { readFileSync } from "node:fs";
import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { tunes } from "@/db/schema";
import type { ImportEvent } from "@/lib/tunes/import";
import { IMPORT_MAX_BYTES, IMPORT_MAX_TUNES } from "@/lib/tunes/import-limits";
import { ndjsonLines, teachWorld } from "./helpers/teach-world";

const WICKER = readFileSync("tests/fixtures/teach/wicker-gate.abc", "utf8"); // an invented reel (this project's own)
// A second invented tune, a jig.
const HOLLOW = "X:2\nT:Hollow Lane\nR:jig\nM:6/8\nL:1/8\nK:G\n|:GAB dBG|ABA AGE|GAB dBG|AGF G3:|\n";
const BAD = "X:3\nT:Crooked Stile\nR:polka\nM:2/4\nL:1/8\nK:A\n|:AB cA|B2 #A2:|\n";
const FILE = `Some notes before the first tune are free text (ABC 2.1 §2.2).\n\n${WICKER}\n${BAD}\n${HOLLOW}`;

type World = Awaited<ReturnType<typeof teachWorld>>;
let w: World;
let teacher: { id: string };
let cookie: string;
beforeAll(async () => {
  w = await teachWorld();
  teacher = await w.person("teacher");
  cookie = await w.cookieFor(teacher.id);
});
afterAll(async () => w?.close());

const upload = (raw: BodyInit, name = "tunes.abc", who: string | null = cookie) =>
  w.call("teach/import", "POST", { cookie: who ?? undefined, raw, query: `?name=${encodeURIComponent(name)}` });
const myTunes = async () =>
  (
    await w.db
      .select({ n: sql<number>`count(*)::int` })
      .from(tunes)
      .where(sql`${tunes.teacherId} = ${teacher.id}`)
  )[0].n;
const lineOf = (text: string, needle: string) => text.slice(0, text.indexOf(needle)).split("\n").length;
const columnOf = (text: string, needle: string) => text.indexOf(needle) - text.lastIndexOf("\n", text.indexOf(needle));

describe("bulk import", () => {
  it("saves the good tunes around a bad one and reports the bad one at its line in the file", async () => {
    const res = await upload(FILE);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/ndjson/);
    const lines = await ndjsonLines<ImportEvent>(res);
    expect(lines[0]).toEqual({ type: "start", total: 3 });
    const results = lines.filter((l) => l.type === "tune");
    expect(results.map((r) => [r.n, r.title, r.status, r.line])).toEqual([
      [1, "Wicker Gate", "saved", lineOf(FILE, "X:1")],
      [2, "Crooked Stile", "problems", lineOf(FILE, "X:3")],
      [3, "Hollow Lane", "saved", lineOf(FILE, "X:2")],
    ]);
    const bad = results[1];
    expect(bad.status === "problems" && bad.problems[0]).toMatchObject({
      line: lineOf(FILE, "#A2"),
      column: columnOf(FILE, "#A2"),
      message: 'Unknown character ignored: "#"',
    });
    expect(lines[lines.length - 1]).toEqual({ type: "done", saved: 2, unchanged: 0, failed: 1 });
    expect(await myTunes()).toBe(2);
  });

  it("does not store the same tunes twice when the file comes again", async () => {
    const lines = await ndjsonLines<ImportEvent>(await upload(FILE));
    expect(lines[lines.length - 1]).toEqual({ type: "done", saved: 0, unchanged: 2, failed: 1 });
    expect(await myTunes()).toBe(2);
  });

  it("reads a real file of many tunes; a field ABC 2.1 does not define is a note at its line, not a refusal", async () => {
    // The Nottingham corpus (../shared/datasets/nottingham, PROVENANCE.txt): some tunes carry a
    // non-standard Y: line in the header, which abcjs does not read (its README).
    const text = readFileSync("../shared/datasets/nottingham/ABC_cleaned/ashover.abc", "utf8");
    const fileLines = text.split("\n");
    const cookie2 = await w.cookieFor((await w.person("teacher")).id);
    const events = await ndjsonLines<ImportEvent>(await upload(text, "ashover.abc", cookie2));
    const done = events[events.length - 1];
    const tuneCount = (text.match(/^X:/gm) ?? []).length;
    expect(done).toEqual({ type: "done", saved: tuneCount, unchanged: 0, failed: 0 });
    let yLines = 0;
    for (const e of events) {
      if (e.type !== "tune") continue;
      expect(fileLines[e.line - 1]).toMatch(/^X:/);
      for (const n of e.notes) {
        if (!n.message.startsWith("Y: is not a field of ABC 2.1")) continue;
        expect(fileLines[n.line - 1]?.slice(n.column - 1)).toMatch(/^Y:/);
        yLines += 1;
      }
    }
    expect(yLines).toBeGreaterThan(0);
  });

  it("holds each tune to the engine's limits, refusing the one over them at its line in the file", async () => {
    const cookie3 = await w.cookieFor((await w.person("teacher")).id);
    // 64 bars of 4/4 is the longest note (lib/abc/limits.ts); the second tune's note is longer
    const huge = "X:9\nT:Endless Drone\nM:4/4\nL:1/8\nK:D\nABcd efga|A99999999|\n";
    const text = `${HOLLOW}\n${huge}`;
    const events = await ndjsonLines<ImportEvent>(await upload(text, "limits.abc", cookie3));
    const results = events.filter((e) => e.type === "tune");
    expect(results.map((r) => r.status)).toEqual(["saved", "problems"]);
    const bad = results[1];
    expect(bad.status === "problems" && bad.problems).toEqual([
      {
        line: lineOf(text, "A99999999"),
        column: columnOf(text, "A99999999"),
        message: '"A99999999" lasts 12,500,000 bars of 4/4; a note, rest or bar may last at most 64 bars.',
      },
    ]);
  });
});

describe("import limits and bad files", () => {
  const errorOf = async (res: Response) => ((await res.json()) as { error: string }).error;

  it("refuses a file over the size limit with the limit in words", async () => {
    const res = await upload(new Uint8Array(IMPORT_MAX_BYTES + 10).fill(65));
    expect(res.status).toBe(413);
    expect(await errorOf(res)).toMatch(/the most one import takes is 2 MB/);
  });

  it("refuses more tunes than the limit before storing any", async () => {
    const before = await myTunes();
    const many = Array.from({ length: IMPORT_MAX_TUNES + 5 }, (_, i) => `X:${i}\nT:Many ${i}\nK:D\nDEFG ABcd|\n`).join(
      "\n",
    );
    const res = await upload(many);
    expect(res.status).toBe(422);
    expect(await errorOf(res)).toBe(
      `This file holds ${IMPORT_MAX_TUNES + 5} tunes; the most one import takes is ${IMPORT_MAX_TUNES}. Split it into smaller files.`,
    );
    expect(await myTunes()).toBe(before);
  });

  it("refuses files that are not ABC text", async () => {
    expect(await errorOf(await upload(WICKER, "tunes.pdf"))).toMatch(/not an ABC file/);
    expect(await errorOf(await upload(new Uint8Array([0x25, 0x50, 0x44, 0x46, 0x00, 0x01])))).toMatch(
      /not a text file/,
    );
    expect(await errorOf(await upload("A letter about fiddles, no tunes in it.\n"))).toMatch(/No tunes found/);
    expect((await upload("")).status).toBe(422);
  });

  it("is for teachers only", async () => {
    expect((await upload(FILE, "tunes.abc", await w.cookieFor((await w.person("student")).id))).status).toBe(403);
    expect((await upload(FILE, "tunes.abc", null)).status).toBe(401);
  });
});
