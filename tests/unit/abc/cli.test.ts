// The command line, run as a teacher would run it.
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
      stages: { index: number; name: string; kinds: string[]; merged: string[]; abc: string }[];
    };
    // no double stops, dynamics or other marks: the default plan's stage 3 is the full setting
    expect(stages.stages.map((s) => [s.index, s.name])).toEqual([
      [1, "Skeleton"],
      [2, "Bowing"],
      [3, "Full setting"],
    ]);
    expect(stages.stages[2].abc).toContain("~G2");
    expect(stages.stages[2].merged).toEqual(["Ornaments, slides and fills"]);
    const phrases = JSON.parse(run("phrases", reel).stdout) as {
      parts: { label: string; phrases: { id: string }[] }[];
      learningLoad: { distinct: number };
    };
    expect(phrases.parts[0].label).toBe("A");
    expect(phrases.parts[0].phrases[0].id).toBe("A1");
    expect(typeof phrases.learningLoad.distinct).toBe("number");
  }, 180_000);

  it("doublestops lists the note each double stop keeps and why; --highest overrides", () => {
    const drone = file("drone.abc", "X:1\nT:Drone\nM:4/4\nL:1/8\nK:D\nd2 [FA]2 E2 D2|\n");
    const read = JSON.parse(run("doublestops", drone).stdout) as { doubleStops: unknown[] };
    expect(read.doubleStops).toEqual([{ bar: 1, part: "A", keeps: "F♯4", leaves: "A4", reason: "open" }]);
    const top = JSON.parse(run("doublestops", drone, "--highest").stdout) as { doubleStops: { keeps: string }[] };
    expect(top.doubleStops.map((d) => d.keeps)).toEqual(["A4"]);
    expect(run("skeleton", drone).stdout).toContain("d2 F2 E2 D2|");
  }, 180_000);

  it("exits with code 2 and the problems on stderr for bad input", () => {
    const bad = file("bad.abc", "X:1\nT:Nothing\nK:G\n");
    const r = run("skeleton", bad);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/bad\.abc:\d+:\d+: The tune has no notes/);
  }, 180_000);

  it("refuses broken ABC with every problem at file:line:column, and prints no skeleton", () => {
    // an unclosed chord symbol, an unclosed grace group and a stray bracket (ABC 2.1 §4.18, §4.12, §4.17)
    const broken = file(
      "broken.abc",
      'X:1\nT:Broken Gate\nM:4/4\nL:1/8\nK:G\n|:"G GABc dBGB|\n{g A2 AB cBAG|\nGABc d]BGB|A2 AB c2 BA:|\n',
    );
    const r = run("skeleton", broken);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe("");
    expect(r.stderr.trim().split("\n")).toEqual([
      `${broken}:6:3: The chord symbol "G GABc dBGB… has no closing quote (")`,
      `${broken}:7:1: The grace notes {g A2 AB cBA… have no closing brace (})`,
      `${broken}:8:7: This "]" closes nothing: no chord [ or inline field [K:… was opened before it`,
    ]);
  }, 180_000);

  it("prints notes on stderr and still the skeleton, with exit code 0", () => {
    const long = file("long.abc", "X:1\nT:Long Bar\nY:AB\nM:4/4\nL:1/8\nK:G\nGABc dBGB|A2 AB cBAGAB|GABc dBGB|\n");
    const r = run("skeleton", long);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain("GABc dBGB|A2 AB cBAGAB|");
    expect(r.stderr.trim().split("\n")).toEqual([
      `${long}:3:1: note: Y: is not a field of ABC 2.1, so the line is left out`,
      `${long}:7:11: note: Bar 2 lasts 10 eighths, but M:4/4 makes a bar of 8 eighths`,
    ]);
  }, 180_000);
});
