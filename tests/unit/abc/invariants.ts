// Checks of the engine's invariants (PRODUCT.md §4) on one tune, shared by the corpus and the
// property tests. Each returns the list of violations (empty when the tune passes).
import abcjs from "abcjs";
import { eq, sub, add, cmp, frac, toString } from "@/lib/abc/fraction";
import { beatOf, readHeader } from "@/lib/abc/header";
import { warningKeys } from "@/lib/abc/parse";
import { buildStages } from "@/lib/abc/stages";
import { prepareTune, type Prepared } from "@/lib/abc/tune";
import type { VBar } from "@/lib/abc/bars";
import type { Fraction } from "@/lib/abc/types";

export function melodyBars(p: Prepared): VBar[] {
  return p.model.bars.get(p.model.melody) ?? [];
}

/** Pitches sounding at time `t` on the beat grid of a bar (all notes of a chord). */
function soundingAt(bar: VBar, t: Fraction): (number | null)[] | undefined {
  for (const n of bar.notes) {
    if (cmp(n.grid, t) <= 0 && cmp(t, add(n.grid, n.duration)) < 0) return n.midi;
  }
  return undefined;
}

/** Decorations, slurs, grace notes and chords of notes as abcjs itself reports them. */
export function embellishedElements(abc: string): string[] {
  const found: string[] = [];
  const tune = abcjs.parseOnly(abc)[0];
  // Before K: is the header; abcjs reads an unknown field there (the corpus's Y:) as notes.
  const headerEnd = readHeader(abc).headerEnd;
  for (const line of tune?.lines ?? []) {
    for (const staff of line.staff ?? []) {
      for (const voice of staff.voices ?? []) {
        for (const el of voice) {
          if (el.el_type !== "note" || el.startChar < headerEnd) continue;
          const at = `${el.startChar}: ${abc.slice(el.startChar, el.endChar)}`;
          const deco: unknown = Reflect.get(el, "decoration");
          if (Array.isArray(deco) && deco.length) found.push(`decoration ${at}`);
          if (Reflect.get(el, "gracenotes")) found.push(`grace notes ${at}`);
          const pitches = el.pitches ?? [];
          if (pitches.some((p) => Reflect.get(p, "startSlur") || Reflect.get(p, "endSlur"))) found.push(`slur ${at}`);
          if (new Set(pitches.map((p) => p.pitch)).size > 1) found.push(`chord ${at}`);
        }
      }
    }
  }
  return found;
}

export function checkTune(abc: string): string[] {
  const errs: string[] = [];
  const src = prepareTune(abc);
  if (!src.ok) return [`rejected: ${src.problems.map((p) => p.message).join("; ")}`];
  const stages = buildStages(src.value);
  if (stages[stages.length - 1].abc !== abc) errs.push("the last stage is not the source");
  const srcWarnings = warningKeys(src.value.warnings);
  const srcBars = melodyBars(src.value);
  let skeleton: Prepared | null = null;
  for (const stage of stages.slice(0, -1)) {
    const r = prepareTune(stage.abc);
    if (!r.ok) {
      errs.push(`stage ${stage.index} rejected`);
      continue;
    }
    if (stage.index === 1) skeleton = r.value;
    for (const [k, c] of warningKeys(r.value.warnings))
      if (c > (srcWarnings.get(k) ?? 0)) errs.push(`stage ${stage.index}: new warning "${k}"`);
    const bars = melodyBars(r.value);
    if (bars.length !== srcBars.length)
      errs.push(`stage ${stage.index}: ${bars.length} bars, source ${srcBars.length}`);
    else
      bars.forEach((b, i) => {
        if (!eq(b.length, srcBars[i].length))
          errs.push(
            `stage ${stage.index} bar ${i}: length ${toString(b.length)}, source ${toString(srcBars[i].length)}`,
          );
      });
  }
  if (skeleton) {
    errs.push(...embellishedElements(stages[0].abc).map((e) => `skeleton keeps ${e}`));
    melodyBars(skeleton).forEach((bar, i) => {
      const source = srcBars[i];
      if (!source || !bar.meter) return;
      const beat = beatOf(bar.meter);
      for (let t = frac(0); cmp(t, add(bar.length, bar.shift)) < 0; t = add(t, beat)) {
        if (cmp(t, bar.shift) < 0) continue;
        const sk = soundingAt(bar, t)?.[0];
        const heard = soundingAt(source, t) ?? [];
        if (sk === undefined || !heard.includes(sk)) {
          errs.push(
            `bar ${i} beat at ${toString(sub(t, bar.shift))}: skeleton ${String(sk)}, source sounds ${heard.join(",")}`,
          );
        }
      }
    });
  }
  return errs;
}
