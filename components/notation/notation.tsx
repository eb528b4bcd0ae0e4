"use client";
// The music, drawn by abcjs, with the phrase map laid over it (issue 5 item 6). abcjs and the
// tune engine load inside the effect, so only pages that show music pay for them.
import { useEffect, useId, useRef, useState, type KeyboardEvent } from "react";
import type { TuneObject } from "abcjs";
import type { PhraseMap } from "@/lib/abc/phrase-types";
import { cx } from "@/components/ui/cx";
import { barAt, loadAbcjs, loadBarSpans, type BarSpan } from "./loaders";
import { phoneLineBreaks, phoneLineEnds } from "./phone-layout";
import { drawOverlay } from "./phrase-overlay";
import { drawBarHighlight } from "./bar-highlight";
import { barsText, phraseLabel, phraseList, twinWords } from "./phrase-words";

export interface NotationProps {
  abc: string;
  phraseMap?: PhraseMap | null;
  highlightPhrase?: string | null;
  /** Phrases covered for memory practice. */
  hiddenPhrases?: readonly string[];
  /** Called with the phrase map's bar number (pickup = 0) of a clicked note or bar line. */
  onBarClick?: (bar: number) => void;
  /** Bars (phrase-map numbers) outlined in the music, e.g. the bar a recording is playing from. */
  highlightBars?: readonly number[];
  /** Accessible name of the drawing, e.g. the tune's title and stage. */
  label?: string;
  className?: string;
}

type Drawn = { tune: TuneObject; spans: BarSpan[] };
type State = "loading" | "ready" | "error";

// Room above every staff for the phrase labels (points, abcjs's %%stafftopmargin).
const LABEL_ROOM = 16;
const NARROW = "(max-width: 639px)"; // below Tailwind's sm: a phone gets its own line breaks
const PHONE_STAFF_WIDTH = 340;

function useNarrow(): boolean {
  const [narrow, setNarrow] = useState(false);
  useEffect(() => {
    const query = window.matchMedia(NARROW);
    const update = (): void => setNarrow(query.matches);
    update();
    query.addEventListener("change", update);
    return () => query.removeEventListener("change", update);
  }, []);
  return narrow;
}

export function Notation({
  abc,
  phraseMap,
  highlightPhrase,
  hiddenPhrases,
  onBarClick,
  highlightBars,
  label,
  className,
}: NotationProps) {
  const paper = useRef<HTMLDivElement>(null);
  const clickRef = useRef(onBarClick);
  clickRef.current = onBarClick;
  const clickable = Boolean(onBarClick);
  const [drawn, setDrawn] = useState<Drawn | null>(null);
  const [state, setState] = useState<State>("loading");
  const descId = useId();
  const narrow = useNarrow();
  const mapRef = useRef(phraseMap);
  mapRef.current = phraseMap;
  const mapKey = phraseMap
    ? phraseList(phraseMap)
        .map((p) => p.bars.join("-"))
        .join(",")
    : "";

  useEffect(() => {
    let live = true;
    setState("loading");
    Promise.all([loadAbcjs(), loadBarSpans(abc)])
      .then(([abcjs, spans]) => {
        const target = paper.current;
        if (!live || !target) return;
        const [tune] = abcjs.renderAbc(target, abc, {
          responsive: "resize",
          add_classes: true,
          format: { stafftopmargin: LABEL_ROOM },
          selectTypes: clickable ? ["note", "bar"] : false,
          selectionColor: "#8A3B12",
          ...(narrow
            ? {
                staffwidth: PHONE_STAFF_WIDTH,
                // abcjs reads one list per section of music (src/parse/wrap_lines.js); its types say number[].
                lineBreaks: phoneLineBreaks(
                  abcjs,
                  abc,
                  spans,
                  phoneLineEnds(spans, mapRef.current),
                ) as unknown as number[],
              }
            : {}),
          clickListener: (elem) => {
            const start = (elem as { startChar?: number }).startChar;
            const bar = start === undefined ? null : barAt(spans, start);
            if (bar !== null) clickRef.current?.(bar);
          },
        });
        const svg = target.querySelector("svg");
        if (svg && label) svg.setAttribute("aria-label", label);
        setDrawn(tune && svg ? { tune, spans } : null);
        setState(tune && svg ? "ready" : "error");
      })
      .catch(() => live && setState("error"));
    return () => {
      live = false;
    };
  }, [abc, clickable, label, narrow, mapKey]);

  useEffect(() => {
    const svg = paper.current?.querySelector("svg");
    if (!drawn || !svg) return;
    if (!phraseMap) {
      svg.querySelectorAll("[data-rw-overlay]").forEach((n) => n.remove());
      return;
    }
    drawOverlay(svg, drawn.tune, drawn.spans, phraseMap, { highlight: highlightPhrase, hidden: hiddenPhrases });
  }, [drawn, phraseMap, highlightPhrase, hiddenPhrases]);

  const barsKey = highlightBars?.join(",") ?? "";
  useEffect(() => {
    const svg = paper.current?.querySelector("svg");
    if (drawn && svg) drawBarHighlight(svg, drawn.tune, drawn.spans, barsKey ? barsKey.split(",").map(Number) : []);
  }, [drawn, barsKey]);

  // abcjs makes clickable notes focusable but answers keys only in its note-dragging mode, so
  // Enter or Space on a focused note picks its bar here.
  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>): void => {
    if ((e.key !== "Enter" && e.key !== " ") || !drawn || !(e.target instanceof Element)) return;
    const index = e.target.getAttribute("data-index");
    const selectable = index === null ? undefined : drawn.tune.getSelectableArray()[Number(index)];
    const start = (selectable?.absEl.abcelem as { startChar?: number } | undefined)?.startChar;
    const bar = start === undefined ? null : barAt(drawn.spans, start);
    if (bar === null) return;
    e.preventDefault();
    clickRef.current?.(bar);
  };

  return (
    <figure
      className={cx("rounded-knot border border-line bg-paper p-3 sm:p-4", className)}
      data-notation-state={state}
      data-highlight-bars={barsKey || undefined}
    >
      {state === "loading" ? <p className="text-small text-bark">Drawing the music…</p> : null}
      {state === "error" ? <p className="text-small font-semibold text-berry">This music could not be drawn.</p> : null}
      <div
        ref={paper}
        onKeyDown={clickable ? onKeyDown : undefined}
        aria-describedby={phraseMap ? descId : undefined}
      />
      {phraseMap ? (
        <figcaption id={descId} className="sr-only">
          <span>Phrases:</span>
          <ul>
            {phraseList(phraseMap).map((p) => {
              const words = twinWords(phraseMap, p.id);
              const hidden = hiddenPhrases?.includes(p.id) ? ", hidden: play from memory" : "";
              const lit = highlightPhrase === p.id ? ", highlighted" : "";
              return (
                <li key={p.id}>{`${phraseLabel(p)}, ${barsText(p)}${words ? `, ${words}` : ""}${hidden}${lit}`}</li>
              );
            })}
          </ul>
        </figcaption>
      ) : null}
    </figure>
  );
}
