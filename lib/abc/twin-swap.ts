// Twin swap (issue 3 §6): the learning version of a tune in which each chosen near twin is played
// exactly like its model, made by copying the model's bar text over the twin's, bar by bar.
import type { Bar } from "./types";
import type { PhraseMap, Swap, Twin } from "./phrase-types";
import { toNumber } from "./phrase-time";
import { barContent, fieldsIndex } from "./twin-text";

const FIELD = /\[[A-Za-z]:[^\]]*\]|(?:^|\n)[A-Za-z]:/;

export interface SwapPlan {
  /** Swaps made, and the ones left out with the reason. */
  made: Swap[];
  skipped: { swap: Swap; reason: string }[];
  edits: { start: number; end: number; text: string }[];
}

/** Bars of every phrase id ("A3", or "A4/2" for A4 played with ending 2), in order. */
function phraseBarsIndex(map: PhraseMap): Map<string, number[]> {
  const out = new Map<string, number[]>();
  for (const part of map.parts) {
    for (const p of part.phrases) {
      out.set(p.id, p.barNumbers);
      for (const alt of p.alternatives) out.set(alt.id, alt.barNumbers);
    }
  }
  return out;
}

/**
 * Which phrase is the model: the first occurrence of the letter (a for a′, a″ …), as the phrase
 * map lists it in `swaps`; the later near twin is the one changed. Each bar of the twin whose
 * notes differ from the model's bar in the same place is replaced by the text of that bar, keeping
 * the twin's own bar lines, repeats and ending numbers (bars that already agree are left alone). A bar whose length differs from its model's (a last bar cut short
 * for a pickup) is kept when no difference lies in it; otherwise the swap is left out, as it is
 * where a different key, unit length or meter is in force (copied text would sound differently).
 */
export function planSwaps(abc: string, bars: Bar[], map: PhraseMap, which?: string[]): SwapPlan {
  const byNumber = new Map<number, Bar>();
  for (const b of bars) if (b.number > 0 && !byNumber.has(b.number)) byNumber.set(b.number, b);
  const wanted = which === undefined ? null : new Set(which);
  const chosen = wanted === null ? map.swaps : map.swaps.filter((s) => wanted.has(s.phrase));
  const plan: SwapPlan = { made: [], skipped: [], edits: [] };
  const changed = new Set<number>();
  const barsOf = phraseBarsIndex(map);
  const differences = differencesIndex(map);
  const fieldsAt = fieldsIndex(abc);
  for (const swap of chosen) {
    const mine = barsOf.get(swap.phrase) ?? null;
    const model = barsOf.get(swap.model) ?? null;
    if (mine === null || model === null || mine.length !== model.length) {
      plan.skipped.push({ swap, reason: "the phrases have different numbers of bars" });
      continue;
    }
    const differing = barsWithDifferences(differences, swap);
    const edits: SwapPlan["edits"] = [];
    let reason: string | null = null;
    for (let k = 0; k < mine.length && reason === null; k++) {
      const target = byNumber.get(mine[k] as number);
      const source = byNumber.get(model[k] as number);
      if (target === undefined || source === undefined) reason = "a bar of the phrase is missing from the tune";
      else if (target === source || (!differing.has(target.number) && sameNotes(target, source))) continue;
      else if (changed.has(target.number)) reason = `bar ${target.number} is already changed by another swap`;
      else if (toNumber(target.length) !== toNumber(source.length)) {
        if (differing.has(target.number)) reason = `bar ${target.number} differs from its model in length`;
      } else if (fieldsAt(target.startChar) !== fieldsAt(source.startChar)) {
        reason = `bar ${target.number} is in a different key, unit length or meter from its model`;
      } else {
        const [ts, te] = barContent(abc, target);
        const [ss, se] = barContent(abc, source);
        const text = abc.slice(ss, se);
        // a field inside a bar ([K:G], or a K: line in a bar broken over lines) would move or vanish
        if (FIELD.test(text) || FIELD.test(abc.slice(ts, te)))
          reason = `bar ${target.number} or its model holds a field (K:, L:, M: …)`;
        else edits.push({ start: ts, end: te, text });
      }
    }
    if (reason !== null) plan.skipped.push({ swap, reason });
    else {
      plan.made.push(swap);
      plan.edits.push(...edits);
      for (const n of mine) changed.add(n);
    }
  }
  return plan;
}

/** Same notes at the same times: the bar needs no copying (and keeps its own chord symbols). */
function sameNotes(a: Bar, b: Bar): boolean {
  if (a.notes.length !== b.notes.length) return false;
  return a.notes.every((n, i) => {
    const m = b.notes[i];
    return (
      m !== undefined &&
      n.pitch === m.pitch &&
      n.tiedFromPrevious === m.tiedFromPrevious &&
      toNumber(n.onset) === toNumber(m.onset) &&
      toNumber(n.duration) === toNumber(m.duration)
    );
  });
}

/** The map's twins by their pair of phrase ids, read once. */
function differencesIndex(map: PhraseMap): Map<string, Twin> {
  const out = new Map<string, Twin>();
  for (const t of map.twins) {
    out.set(`${t.first} ${t.second}`, t);
    out.set(`${t.second} ${t.first}`, t);
  }
  return out;
}

/** Bars (of the twin) in which the map found a difference from the model. */
function barsWithDifferences(twins: Map<string, Twin>, swap: Swap): Set<number> {
  const out = new Set<number>();
  const t = twins.get(`${swap.model} ${swap.phrase}`);
  if (t === undefined) return out;
  for (const d of t.differences) {
    const [from, to] = t.second === swap.phrase ? [d.secondBar, d.lastSecondBar] : [d.firstBar, d.lastFirstBar];
    for (let n = from; n <= to; n++) out.add(n);
  }
  return out;
}

/** Applies edits (non-overlapping offsets into `abc`) in one pass over the text. */
export function applyEdits(abc: string, edits: SwapPlan["edits"]): string {
  const sorted = [...edits].sort((a, b) => a.start - b.start);
  const parts: string[] = [];
  let at = 0;
  for (const e of sorted) {
    parts.push(abc.slice(at, e.start), e.text);
    at = e.end;
  }
  parts.push(abc.slice(at));
  return parts.join("");
}

/**
 * The learning version of the tune as ABC: every chosen near twin (phrase ids; default every near
 * twin the map lists in `swaps`) played exactly like its model. `abc` and `bars` must belong
 * together (the source with its model's bars, or a stage with its own); the map may come from the
 * skeleton, since the skeleton keeps the source's bar numbers.
 */
export function twinSwap(abc: string, bars: Bar[], map: PhraseMap, which?: string[]): string {
  return applyEdits(abc, planSwaps(abc, bars, map, which).edits);
}
