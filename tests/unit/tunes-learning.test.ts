// Twin swaps the teacher accepts, and the file checks of the bulk import (lib/tunes).
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { HttpError } from "@/lib/auth/errors";
import { checkTune } from "@/lib/tunes/check";
import { decodeText, IMPORT_MAX_BYTES, IMPORT_MAX_TUNES, readUpload, tunesOfFile } from "@/lib/tunes/import-file";
import { learningVersion, offeredSwaps } from "@/lib/tunes/learning";
import { learningLoadWith } from "@/lib/tunes/learning-load";

const WICKER = readFileSync("tests/fixtures/teach/wicker-gate.abc", "utf8"); // an invented reel (this project's own)
const map = (() => {
  const r = checkTune(WICKER);
  if (!r.ok) throw new Error("fixture refused");
  return r.value.analysis.phraseMap;
})();

describe("learning version", () => {
  // The fixture's bar 6 (in A3) ends "dGBd" where bar 2 (in A1) ends "dGBG": one note, a near twin.
  it("plays an accepted near twin exactly like its model and changes nothing else", () => {
    expect(map.swaps.map((s) => [s.phrase, s.model])).toEqual([["A3", "A1"]]);
    const v = learningVersion(WICKER, map, ["A3"]);
    expect(v.made.map((s) => s.phrase)).toEqual(["A3"]);
    expect(v.abc).toBe(WICKER.replace("~G2BG dGBd|", "~G2BG dGBG|"));
  });

  it("is the source itself when no swap is accepted", () => {
    expect(learningVersion(WICKER, map, []).abc).toBe(WICKER);
  });

  it("counts the learning load for the accepted swaps as the phrase map does for all of them", () => {
    expect(learningLoadWith(map, [])).toBe(map.learningLoad.distinct);
    expect(learningLoadWith(map, ["A3"])).toBe(map.learningLoad.afterSwaps);
    expect(map.learningLoad.distinct - map.learningLoad.afterSwaps).toBe(1);
  });

  it("keeps only swaps the map still offers", () => {
    expect(offeredSwaps(map, ["B4", "A3"])).toEqual({ kept: ["A3"], dropped: ["B4"] });
  });
});

const status = (f: () => unknown): number | null => {
  try {
    f();
    return null;
  } catch (e) {
    return e instanceof HttpError ? e.status : -1;
  }
};

describe("import file checks", () => {
  it("refuses empty, binary and non-UTF-8 files with words that say what to do", () => {
    expect(status(() => decodeText(new Uint8Array()))).toBe(422);
    expect(() => decodeText(new Uint8Array([88, 58, 0, 49]))).toThrow(/not a text file/);
    // 0xC3 0x28 is an invalid two-byte sequence (RFC 3629 §3), typical of a Latin-1 file.
    expect(() => decodeText(new Uint8Array([0x58, 0x3a, 0xc3, 0x28]))).toThrow(/not UTF-8/);
    expect(decodeText(new TextEncoder().encode("\uFEFFX:1"))).toBe("X:1"); // a byte-order mark is dropped
  });

  it("refuses a file without tunes, and one with more than the limit", () => {
    expect(() => tunesOfFile("just some notes about fiddles\n")).toThrow(/No tunes found/);
    const many = Array.from({ length: IMPORT_MAX_TUNES + 1 }, (_, i) => `X:${i + 1}\nT:T${i}\nK:D\nDEFG|\n`).join("\n");
    expect(() => tunesOfFile(many)).toThrow(
      `This file holds ${IMPORT_MAX_TUNES + 1} tunes; the most one import takes is ${IMPORT_MAX_TUNES}.`,
    );
    expect(tunesOfFile(many.split("\n\n").slice(0, IMPORT_MAX_TUNES).join("\n\n"))).toHaveLength(IMPORT_MAX_TUNES);
  });

  it("stops reading an upload past the size limit, declared or not", async () => {
    const big = new Uint8Array(IMPORT_MAX_BYTES + 1).fill(65);
    const declared = new Request("http://x/", { method: "POST", body: big });
    await expect(readUpload(declared)).rejects.toMatchObject({ status: 413 });
    const stream = new ReadableStream<Uint8Array>({
      start(c) {
        for (let i = 0; i < 3; i++) c.enqueue(new Uint8Array(IMPORT_MAX_BYTES / 2).fill(65));
        c.close();
      },
    });
    const undeclared = new Request("http://x/", { method: "POST", body: stream, duplex: "half" } as RequestInit);
    await expect(readUpload(undeclared)).rejects.toThrow(/the most one import takes is 2 MB/);
    expect(await readUpload(new Request("http://x/", { method: "POST", body: "X:1\nK:D\n" }))).toBe("X:1\nK:D\n");
  });
});
