// The command line (issue 3 §8), run as a teacher would run it.
import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";

const dir = mkdtempSync(join(tmpdir(), "abc-cli-"));
const file = (name: string, text: string): string => {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
};
const run = (...args: string[]) => spawnSync("npx", ["tsx", "scripts/abc-cli.ts", ...args], { encoding: "utf8" });

// An invented reel: phrase 3 repeats phrase 1 (common practice: a tune built that way).
const reel = file(
  "reel.abc",
  "X:1\nT:Hollow Gate\nM:4/4\nL:1/8\nK:G\n|:~G2 BG dGBG|A2 (AB) cBAG|G2 BG dGBG|A2 AB c2 BA:|\n",
);

describe("abc CLI", () => {
  it("skeleton prints ABC; stages and phrases print the JSON shapes of issue 3 §8", () => {
    const sk = run("skeleton", reel);
    expect(sk.status).toBe(0);
    expect(sk.stdout).toContain("|:G2 BG dGBG|A2 AB cBAG|");
    const stages = JSON.parse(run("stages", reel).stdout) as {
      stages: { index: number; name: string; kinds: string[]; abc: string }[];
    };
    expect(stages.stages.map((s) => s.index)).toEqual([1, 2, 3, 4]);
    expect(stages.stages[3].abc).toContain("~G2");
    const phrases = JSON.parse(run("phrases", reel).stdout) as {
      parts: { label: string; phrases: { id: string }[] }[];
      learningLoad: { distinct: number };
    };
    expect(phrases.parts[0].label).toBe("A");
    expect(phrases.parts[0].phrases[0].id).toBe("A1");
    expect(typeof phrases.learningLoad.distinct).toBe("number");
  }, 180_000);

  it("exits with code 2 and the problems on stderr for bad input", () => {
    const bad = file("bad.abc", "X:1\nT:Nothing\nK:G\n");
    const r = run("skeleton", bad);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/bad\.abc:\d+:\d+: The tune has no notes/);
  }, 180_000);
});
