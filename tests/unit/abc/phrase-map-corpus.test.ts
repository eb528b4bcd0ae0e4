// The phrase map over the open corpus (../shared/datasets/nottingham/ABC_cleaned, Nottingham Music
// Database as cleaned by its redistributors; see its README): no tune throws and every map is sane.
import { existsSync, readdirSync, readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { phraseMap, type PhraseMap } from "../../../lib/abc/phrase-map";
import { skeletonOf } from "../../../lib/abc/skeleton";
import { splitTunes } from "../../../lib/abc/split";

const DIR = new URL("../../../../shared/datasets/nottingham/ABC_cleaned/", import.meta.url);

function saneProblems(m: PhraseMap, barNumbers: number[]): string[] {
  const problems: string[] = [];
  const ids = new Set<string>();
  const owner = new Map<number, string>();
  const pickups = new Set(m.parts.flatMap((p) => p.pickup));
  for (const part of m.parts) {
    if (part.grouping.phraseBars.reduce((a, b) => a + b, 0) !== part.countedBars)
      problems.push(`${part.label}: grouping does not add up`);
    for (const p of part.phrases) {
      for (const id of [p.id, ...p.alternatives.map((a) => a.id)]) {
        if (ids.has(id)) problems.push(`duplicate id ${id}`);
        ids.add(id);
      }
      if (!/^[a-z]\d*[′″‴⁗]*$/u.test(p.letter)) problems.push(`${p.id}: bad letter ${p.letter}`);
      for (let n = p.bars[0]; n <= p.bars[1]; n++) {
        const o = owner.get(n);
        if (o !== undefined) problems.push(`bar ${n} in ${o} and ${p.id}`);
        owner.set(n, p.id);
      }
      if (p.barNumbers.some((n) => n < p.bars[0] || n > p.bars[1])) problems.push(`${p.id}: bars outside its range`);
    }
  }
  // every bar of the tune except pickups lies in a phrase (numbers repeat only for pickups, bar 0)
  for (const n of barNumbers) if (n > 0 && !pickups.has(n) && !owner.has(n)) problems.push(`bar ${n} in no phrase`);
  for (const t of m.twins) {
    if (t.differingNotes > 2 || (t.kind === "exact") !== (t.differingNotes === 0))
      problems.push(`bad twin ${t.first}/${t.second}`);
    if (!ids.has(t.first) || !ids.has(t.second)) problems.push(`twin of unknown phrase ${t.first}/${t.second}`);
  }
  if (m.learningLoad.afterSwaps > m.learningLoad.distinct || m.learningLoad.afterSwaps < 1)
    problems.push("bad learning load");
  return problems;
}

describe.runIf(existsSync(DIR))("phrase map over every tune in ABC_cleaned", () => {
  it("never throws and gives a sane, deterministic map", () => {
    let tunes = 0;
    const problems: string[] = [];
    for (const file of readdirSync(DIR).filter((f) => f.endsWith(".abc"))) {
      for (const t of splitTunes(readFileSync(new URL(file, DIR), "utf8"))) {
        const sk = skeletonOf(t.abc);
        if (!sk.ok) continue; // the skeleton's own tests answer for tunes it cannot read
        tunes++;
        const { bars, meter, unit } = sk.value;
        const m = phraseMap(bars, meter, unit);
        const title = /^T:(.*)$/m.exec(t.abc)?.[1] ?? file;
        for (const p of saneProblems(
          m,
          bars.map((b) => b.number),
        ))
          problems.push(`${title}: ${p}`);
        if (JSON.stringify(phraseMap(bars, meter, unit)) !== JSON.stringify(m))
          problems.push(`${title}: not deterministic`);
      }
    }
    expect(problems).toEqual([]);
    expect(tunes).toBeGreaterThan(1000); // the README's "about 1,000 tunes"
  });
});
