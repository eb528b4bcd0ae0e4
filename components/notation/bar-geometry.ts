// Where each bar of the phrase map was drawn by abcjs, in the SVG's own units (so the overlay
// scales with `responsive: "resize"`). Bars are found by the source offsets abcjs keeps on every
// element, matched against the engine's bar spans: the same numbering as the phrase map.
import type { AbsoluteElement, TuneObject } from "abcjs";
import { barAt, type BarSpan } from "./loaders";

/** One bar's slice of one line of music. */
export interface BarBox {
  bar: number;
  line: number; // abcjs's line class index (abcjs-lN)
  x0: number;
  x1: number;
  y0: number; // highest and lowest ink of the bar's own notes, chord symbols and decorations
  y1: number;
}

/** One line of music: the staff and everything drawn with it (chord symbols, slurs, labels). */
export interface LineBox {
  line: number;
  top: number; // highest drawn element of the line
  bottom: number;
  staffTop: number;
  staffBottom: number;
}

interface Extent {
  x0: number;
  x1: number;
  y0: number;
  y1: number;
}

function extentOf(elems: SVGElement[]): Extent | null {
  const e: Extent = { x0: Infinity, x1: -Infinity, y0: Infinity, y1: -Infinity };
  for (const el of elems) {
    if (!(el instanceof SVGGraphicsElement)) continue;
    const b = el.getBBox();
    if (b.width === 0 && b.height === 0) continue;
    e.x0 = Math.min(e.x0, b.x);
    e.x1 = Math.max(e.x1, b.x + b.width);
    e.y0 = Math.min(e.y0, b.y);
    e.y1 = Math.max(e.y1, b.y + b.height);
  }
  return e.x0 <= e.x1 ? e : null;
}

const lineClass = (elems: SVGElement[]): number | null => {
  for (const el of elems) {
    const m = /\babcjs-l(\d+)\b/.exec(el.getAttribute("class") ?? "");
    if (m) return Number(m[1]);
  }
  return null;
};

type Item = { el_type: string; startChar?: number; abselem?: AbsoluteElement };

/** Each bar's horizontal extent, line by line; a bar broken over two lines gives two boxes. */
export function measureBars(tune: TuneObject, spans: BarSpan[]): BarBox[] {
  const boxes: BarBox[] = [];
  for (const line of tune.lines) {
    const voice = (line.staff?.[0]?.voices?.[0] ?? []) as Item[];
    let lastBarLineRight: number | null = null;
    let current: BarBox | null = null;
    for (const item of voice) {
      const elems = item.abselem?.elemset ?? [];
      const extent = extentOf(elems);
      const lineNo = lineClass(elems);
      if (!extent || lineNo === null || item.startChar === undefined) continue;
      const bar = barAt(spans, item.startChar);
      if (bar === null) {
        if (item.el_type === "bar") lastBarLineRight = extent.x1;
        continue;
      }
      if (!current || current.bar !== bar || current.line !== lineNo) {
        const x0 = lastBarLineRight ?? extent.x0 - 6;
        current = { bar, line: lineNo, x0, x1: extent.x1, y0: extent.y0, y1: extent.y1 };
        boxes.push(current);
      }
      current.x1 = Math.max(current.x1, extent.x1);
      current.y0 = Math.min(current.y0, extent.y0);
      current.y1 = Math.max(current.y1, extent.y1);
      if (item.el_type === "bar") {
        // The closing bar line ends the bar: the next one starts where this line is drawn.
        current.x1 = extent.x1;
        lastBarLineRight = extent.x1;
      }
    }
  }
  return boxes;
}

/** The vertical extent of each line of music named in `lines`, from what abcjs drew for it. */
export function measureLines(svg: SVGSVGElement, lines: Iterable<number>): Map<number, LineBox> {
  const out = new Map<number, LineBox>();
  for (const line of lines) {
    const staff = svg.querySelector(`.abcjs-staff.abcjs-l${line}`);
    if (!(staff instanceof SVGGraphicsElement)) continue;
    const s = staff.getBBox();
    let top = s.y;
    let bottom = s.y + s.height;
    for (const el of svg.querySelectorAll(`.abcjs-l${line}`)) {
      if (!(el instanceof SVGGraphicsElement) || el.closest("[data-rw-overlay]")) continue;
      const b = el.getBBox();
      if (b.width === 0 && b.height === 0) continue;
      top = Math.min(top, b.y);
      bottom = Math.max(bottom, b.y + b.height);
    }
    out.set(line, { line, top, bottom, staffTop: s.y, staffBottom: s.y + s.height });
  }
  return out;
}
