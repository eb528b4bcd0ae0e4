// Checks of the engine's invariants (PRODUCT.md §4) on one tune, shared by the corpus and the
// property tests. Each returns the list of violations (empty when the tune passes).
import abcjs from "abcjs";
import { eq, sub, add, cmp, frac, toString } from "@/lib/abc/fraction";
import { beatOf, readHeader } from "@/lib/abc/header";
import { warningKeys } from "@/lib/abc/parse";
import { analyze } from "@/lib/abc/analyze";
import { buildStages } from "@/lib/abc/stages";
import { prepareTune, type Prepared } from "@/lib/abc/tune";
import type { VBar } from "@/lib/abc/bars";
import type { Fraction, Problem } from "@/lib/abc/types";

export function melodyBars(p: Prepared): VBar[] {
  return p.model.bars.get(p.model.melody) ?? [];
}

/** Pitches sounding at time `t` on the beat grid of a bar (all notes of a chord). */
function soundingAt(bar: VBar, t: Fraction): readonly (number | null)[] | undefined {
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
  const srcWarnings = warningKeys(src.value.notes);
  const srcBars = melodyBars(src.value);
  let skeleton: Prepared | null = null;
  for (const stage of stages.slice(0, -1)) {
    const r = prepareTune(stage.abc);
    if (!r.ok) {
      errs.push(`stage ${stage.index} rejected`);
      continue;
    }
    if (stage.index === 1) skeleton = r.value;
    for (const [k, c] of warningKeys(r.value.notes))
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

/**
 * What every tune the engine accepts must give: each version it writes (the stages, the skeleton,
 * the two learning versions) reads again with no problem and no note the source lacks, with the
 * same bars of the same lengths. A refused tune must be refused with located, plain problems.
 */
export function checkOutputs(abc: string): { refused: boolean; errors: string[] } {
  const r = analyze(abc);
  if (!r.ok) return { refused: true, errors: checkRefusal(abc, r.problems) };
  return { refused: false, errors: checkVersions(abc, r) };
}

function checkRefusal(abc: string, problems: Problem[]): string[] {
  const errs: string[] = [];
  const lines = abc.split("\n").length;
  for (const p of problems) {
    if (/Internal error/.test(p.message)) errs.push(`internal error: ${p.message}`);
    if (p.line < 1 || p.line > lines + 1 || p.column < 1)
      errs.push(`problem outside the text at ${p.line}:${p.column}`);
    if (/<\/?(span|br|b|i|div)\b/i.test(p.message) || p.message.trim() === "")
      errs.push(`unplain problem: ${p.message}`);
  }
  return errs;
}

function checkVersions(abc: string, r: Extract<ReturnType<typeof analyze>, { ok: true }>): string[] {
  const a = r.value;
  // the skeleton's bars are the source's bars, with the source's lengths
  const srcLengths = a.skeleton.bars.map((b) => b.length);
  const srcNotes = noteKinds(r.notes);
  const outputs = new Map<string, string>();
  const put = (name: string, text: string): void => {
    if (text !== abc && !outputs.has(text)) outputs.set(text, name);
  };
  put("skeleton", a.skeleton.abc);
  for (const s of a.stages) put(`stage ${s.index}`, s.abc);
  put("learning version", a.learning);
  put("learning skeleton", a.learningSkeleton);
  const errs: string[] = [];
  for (const [text, name] of outputs) {
    const out = prepareTune(text);
    if (!out.ok) {
      errs.push(`${name} refused: ${out.problems.map((p) => p.message).join("; ")}`);
      continue;
    }
    // a learning version copies whole bars of the source, with what the source's notes are about
    const learning = name.startsWith("learning");
    for (const [k, c] of noteKinds(out.value.notes))
      if (learning ? !srcNotes.has(k) : c > (srcNotes.get(k) ?? 0)) errs.push(`${name}: new note "${k}"`);
    const bars = melodyBars(out.value);
    if (bars.length !== srcLengths.length) errs.push(`${name}: ${bars.length} bars, source ${srcLengths.length}`);
    else
      bars.forEach((b, i) => {
        if (!eq(b.length, srcLengths[i]))
          errs.push(`${name} bar ${i}: length ${toString(b.length)}, source ${toString(srcLengths[i])}`);
      });
  }
  return errs;
}

/** Notes by what they say, without the text they quote (a version may write a note differently). */
function noteKinds(notes: { message: string }[]): Map<string, number> {
  return warningKeys(notes.map((n) => ({ line: 0, column: 0, message: n.message.split('"')[0] ?? n.message })));
}
