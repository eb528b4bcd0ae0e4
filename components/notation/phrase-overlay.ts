// Draws the phrase map over abcjs's SVG: a bracket and a label ("A2 · a′ · like A1 but 1 note")
// above each phrase, an outline round the highlighted phrase, and a plain cover with words over
// phrases hidden for memory practice. Shapes and words carry the meaning; colour only helps.
import type { TuneObject } from "abcjs";
import type { PhraseMap } from "@/lib/abc/phrase-types";
import { measureBars, measureLines, type BarBox, type LineBox } from "./bar-geometry";
import type { BarSpan } from "./loaders";
import { phraseLabel, phraseList, twinMark, twinWords } from "./phrase-words";

const NS = "http://www.w3.org/2000/svg";
// Palette of tailwind.config.ts: ink text, cedar outline, sawdust cover, grain edges.
const INK = "#24190F";
const CEDAR = "#8A3B12";
const SAWDUST = "#F3EADB";
const ROSIN_TINT = "#FBEFD2";
const GRAIN = "#8C7560";
const FONT = 'system-ui, -apple-system, "Segoe UI", Roboto, Arial, sans-serif';

export interface OverlayOptions {
  highlight?: string | null;
  hidden?: readonly string[];
}

function el<K extends keyof SVGElementTagNameMap>(
  name: K,
  attrs: Record<string, string | number>,
): SVGElementTagNameMap[K] {
  const node = document.createElementNS(NS, name);
  for (const [k, v] of Object.entries(attrs)) node.setAttribute(k, String(v));
  return node;
}

interface Segment {
  line: LineBox;
  x0: number;
  x1: number;
  y0: number; // the phrase's own ink on this line, never less than the staff
  y1: number;
}

function segmentsOf(boxes: BarBox[], lines: Map<number, LineBox>): Segment[] {
  const byLine = new Map<number, Segment>();
  for (const b of boxes) {
    const line = lines.get(b.line);
    if (!line) continue;
    const seg = byLine.get(b.line);
    if (seg) {
      seg.x0 = Math.min(seg.x0, b.x0);
      seg.x1 = Math.max(seg.x1, b.x1);
      seg.y0 = Math.min(seg.y0, b.y0);
      seg.y1 = Math.max(seg.y1, b.y1);
    } else
      byLine.set(b.line, {
        line,
        x0: b.x0,
        x1: b.x1,
        y0: Math.min(b.y0, line.staffTop),
        y1: Math.max(b.y1, line.staffBottom),
      });
  }
  return [...byLine.values()].sort((a, b) => a.line.top - b.line.top);
}

/** Removes any earlier overlay and draws the phrase map for the current options. */
export function drawOverlay(
  svg: SVGSVGElement,
  tune: TuneObject,
  spans: BarSpan[],
  map: PhraseMap,
  opts: OverlayOptions,
): void {
  svg.querySelectorAll("[data-rw-overlay]").forEach((n) => n.remove());
  const boxes = measureBars(tune, spans);
  const lines = measureLines(svg, new Set(boxes.map((b) => b.line)));
  const back = el("g", { "data-rw-overlay": "back", "aria-hidden": "true" });
  const front = el("g", { "data-rw-overlay": "front", "aria-hidden": "true" });
  svg.insertBefore(back, svg.firstChild);
  svg.append(front); // in the document before any text is measured
  const hidden = new Set(opts.hidden ?? []);
  for (const phrase of phraseList(map)) {
    const segs = segmentsOf(
      boxes.filter((b) => b.bar >= phrase.bars[0] && b.bar <= phrase.bars[1]),
      lines,
    );
    if (segs.length === 0) continue;
    const group = el("g", { "data-phrase": phrase.id });
    segs.forEach((s, i) => {
      const y = s.line.top - 5;
      // A bracket over the phrase's bars; its ends turn down only where the phrase starts and stops.
      const left = i === 0 ? `M${s.x0 + 2},${y + 5}L${s.x0 + 2},${y}` : `M${s.x0 + 2},${y}`;
      const right = i === segs.length - 1 ? `L${s.x1 - 2},${y}L${s.x1 - 2},${y + 5}` : `L${s.x1 - 2},${y}`;
      group.append(el("path", { d: left + right, fill: "none", stroke: INK, "stroke-width": 1.2 }));
      if (opts.highlight === phrase.id) {
        back.append(
          el("rect", {
            x: s.x0 - 2,
            y: y - 16,
            width: s.x1 - s.x0 + 4,
            height: s.line.bottom - y + 22,
            fill: ROSIN_TINT,
          }),
        );
        front.append(
          el("rect", {
            x: s.x0 - 2,
            y: y - 16,
            width: s.x1 - s.x0 + 4,
            height: s.line.bottom - y + 22,
            rx: 5,
            fill: "none",
            stroke: CEDAR,
            "stroke-width": 2.5,
            "data-highlight": phrase.id,
          }),
        );
      }
      if (hidden.has(phrase.id)) group.append(cover(s, phrase.id));
    });
    const first = segs[0];
    const label = el("text", {
      x: first.x0 + 4,
      y: first.line.top - 9,
      "font-family": FONT,
      "font-size": 11,
      fill: INK,
      class: "rw-phrase-label",
    });
    const name = el("tspan", { "font-weight": 700 });
    name.textContent = phraseLabel(phrase);
    label.append(name);
    const words = twinWords(map, phrase.id);
    const rest = el("tspan", { "font-style": "italic" });
    label.append(rest);
    group.append(label);
    front.append(group);
    if (words) {
      rest.textContent = ` · ${words}`;
      // Too long for the bracket once laid out: the short mark still says which phrase it repeats.
      if (label.getComputedTextLength() > first.x1 - first.x0 - 6) rest.textContent = ` ${twinMark(map, phrase.id)}`;
    }
  }
}

function cover(s: Segment, id: string): SVGGElement {
  const g = el("g", { "data-hidden-phrase": id });
  // Only the phrase's own notes, chord symbols and marks: the line's part and tempo marks stay in view.
  const top = s.y0 - 3;
  const height = s.y1 - top + 3;
  g.append(
    el("rect", {
      x: s.x0,
      y: top,
      width: s.x1 - s.x0,
      height,
      rx: 4,
      fill: SAWDUST,
      stroke: GRAIN,
      "stroke-dasharray": "4 3",
    }),
  );
  const text = el("text", {
    x: (s.x0 + s.x1) / 2,
    y: (s.line.staffTop + s.line.staffBottom) / 2 + 4,
    "text-anchor": "middle",
    "font-family": FONT,
    "font-size": 12,
    fill: INK,
  });
  text.textContent = "play from memory";
  g.append(text);
  return g;
}
