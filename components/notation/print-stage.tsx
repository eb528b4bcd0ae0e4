"use client";
// A stage laid out for paper: title, stage name and the music, with a Print button. On paper the
// site's header, navigation and footer (and this page's controls) are left out.
import type { PhraseMap } from "@/lib/abc/phrase-types";
import { Button } from "@/components/ui/button";
import { Notation } from "./notation";

export interface PrintStageProps {
  abc: string;
  title: string;
  stageName: string;
  /** Print the phrase labels with the music (off by default: a clean page). */
  phraseMap?: PhraseMap | null;
}

// Global on purpose: it must reach the layout's header and footer, which this component does not own.
const PRINT_CSS = `
@media print {
  body > a[href="#main"], body > header, body > footer, nav, [data-print-hide] { display: none !important; }
  body { background: #fff; }
  [data-print-sheet] figure { border: 0; padding: 0; background: #fff; }
  [data-print-sheet] svg { break-inside: avoid; }
}
@page { margin: 15mm; }
`;

export function PrintStage({ abc, title, stageName, phraseMap }: PrintStageProps) {
  return (
    <article data-print-sheet className="flex flex-col gap-4">
      <style>{PRINT_CSS}</style>
      <div data-print-hide className="flex flex-wrap items-center gap-3">
        <Button onClick={() => window.print()}>Print this stage</Button>
        <p className="text-small text-bark">Prints the music only, without the site&apos;s menus.</p>
      </div>
      <div className="border-b border-line pb-2">
        <h2 className="text-h3">{title}</h2>
        <p className="text-bark">{`Stage: ${stageName}`}</p>
      </div>
      <Notation abc={abc} phraseMap={phraseMap} label={`${title}, ${stageName}`} />
    </article>
  );
}
