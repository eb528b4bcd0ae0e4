// Phrases by content: a long tune repeats its phrases many times, so phrases with the same notes
// on the grid are compared once, as one content, and each content only with the others. A
// comparison depends on nothing but the pitch at each grid point, where notes start, and how many
// bars the phrase has (phrase-grid.ts), so that is the content.
import { compareCells, type Cells, type Comparison } from "./phrase-grid";

export interface Near {
  c: number; // the other content
  cmp: Comparison; // as compareCells(earlier content's first phrase, later content's first phrase)
}

export interface ContentIndex {
  /** Content of each unit (index into the units given), numbered in order of first appearance. */
  cid: Int32Array;
  /** First unit with each content. */
  first: number[];
  /** Per content: the other contents within `maxNotes`, in content order. */
  near: Near[][];
}

const FNV = 0x811c9dc5;
const PRIME = 0x01000193;

function hashOf(c: Cells, barCount: number): number {
  let h = Math.imul(FNV ^ barCount, PRIME);
  const { pitch, note } = c;
  for (let k = 0; k < pitch.length; k++) {
    const starts = k === 0 || note[k] !== note[k - 1] ? 1 : 0;
    h = Math.imul(h ^ (pitch[k] + 3), PRIME);
    h = Math.imul(h ^ starts, PRIME);
  }
  return h >>> 0;
}

function sameContent(x: Cells, y: Cells): boolean {
  if (x.pitch.length !== y.pitch.length || x.bars.length !== y.bars.length) return false;
  for (let k = 0; k < x.pitch.length; k++) {
    if (x.pitch[k] !== y.pitch[k]) return false;
    const sx = k === 0 || x.note[k] !== x.note[k - 1];
    const sy = k === 0 || y.note[k] !== y.note[k - 1];
    if (sx !== sy) return false;
  }
  return true;
}

/**
 * Content ids for the units' cells, and every pair of contents with the same number of bars
 * compared once (stopping past `maxNotes`); `keep` may turn a comparison down (the near-twin
 * rule that a twin keeps most of its notes).
 */
export function indexContents(
  cells: Cells[],
  barCounts: number[],
  maxNotes: number,
  keep: (c: Comparison) => boolean,
): ContentIndex {
  const cid = new Int32Array(cells.length);
  const first: number[] = [];
  const buckets = new Map<number, number[]>();
  cells.forEach((c, u) => {
    const h = hashOf(c, barCounts[u]);
    const bucket = buckets.get(h);
    const same = bucket?.find((id) => sameContent(cells[first[id]], c));
    if (same !== undefined) {
      cid[u] = same;
      return;
    }
    const id = first.length;
    first.push(u);
    if (bucket) bucket.push(id);
    else buckets.set(h, [id]);
    cid[u] = id;
  });
  const near: Near[][] = first.map(() => []);
  // only phrases with the same number of bars can be twins
  const byBars = new Map<number, number[]>();
  first.forEach((u, id) => {
    const list = byBars.get(barCounts[u]);
    if (list) list.push(id);
    else byBars.set(barCounts[u], [id]);
  });
  for (const ids of byBars.values()) {
    for (let i = 0; i < ids.length; i++) {
      const a = ids[i];
      const ca = cells[first[a]];
      for (let j = i + 1; j < ids.length; j++) {
        const b = ids[j];
        const cmp = compareCells(ca, cells[first[b]], maxNotes);
        if (cmp.differingNotes > maxNotes || !keep(cmp)) continue;
        near[a].push({ c: b, cmp });
        near[b].push({ c: a, cmp });
      }
    }
  }
  return { cid, first, near };
}
