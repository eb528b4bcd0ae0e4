// Outlines chosen bars on abcjs's SVG (the listening aid's "this bar" beside the recording): a
// shaded box behind the bar and a thick outline with square corners in front, so the shape shows
// the bar even where colour does not.
import type { TuneObject } from "abcjs";
import { measureBars, measureLines } from "./bar-geometry";
import type { BarSpan } from "./loaders";

const NS = "http://www.w3.org/2000/svg";
const SLATE = "#2C4F6B"; // tailwind.config.ts: slate, 7.14:1 on its tint
const SLATE_TINT = "#E2EBF2";

function rect(attrs: Record<string, string | number>): SVGRectElement {
  const node = document.createElementNS(NS, "rect");
  for (const [k, v] of Object.entries(attrs)) node.setAttribute(k, String(v));
  return node;
}

export function drawBarHighlight(
  svg: SVGSVGElement,
  tune: TuneObject,
  spans: BarSpan[],
  bars: readonly number[],
): void {
  svg.querySelectorAll("[data-rw-bar-highlight]").forEach((n) => n.remove());
  if (!bars.length) return;
  const boxes = measureBars(tune, spans).filter((b) => bars.includes(b.bar));
  const lines = measureLines(svg, new Set(boxes.map((b) => b.line)));
  const back = document.createElementNS(NS, "g");
  back.setAttribute("data-rw-bar-highlight", "back");
  back.setAttribute("aria-hidden", "true");
  const front = document.createElementNS(NS, "g");
  front.setAttribute("data-rw-bar-highlight", "front");
  front.setAttribute("aria-hidden", "true");
  for (const b of boxes) {
    const line = lines.get(b.line);
    const y0 = Math.min(b.y0, line?.staffTop ?? b.y0) - 6;
    const y1 = Math.max(b.y1, line?.staffBottom ?? b.y1) + 6;
    const box = { x: b.x0 - 1, y: y0, width: b.x1 - b.x0 + 2, height: y1 - y0 };
    back.append(rect({ ...box, fill: SLATE_TINT }));
    front.append(rect({ ...box, fill: "none", stroke: SLATE, "stroke-width": 3, "data-bar": b.bar }));
  }
  svg.insertBefore(back, svg.firstChild);
  svg.append(front);
}
