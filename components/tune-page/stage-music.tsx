"use client";
// The music of the chosen stage: player, memory mode, notation with the phrase map, print link.
// Loaded after the page's first paint (see tune-page.tsx), like abcjs itself.
import Link from "next/link";
import { useState } from "react";
import { MemoryMode, Notation, TunePlayer } from "@/components/notation";
import type { PhraseMap } from "@/lib/abc/phrase-types";
import type { StageAbcJson } from "@/lib/catalogue/api-types";

export interface StageMusicProps {
  stage: StageAbcJson;
  title: string;
  phraseMap: PhraseMap | null;
  printHref: string;
  /** Told the bar of a clicked note, for margin notes; absent when notes are off. */
  onBarClick?: (bar: number) => void;
}

export default function StageMusic({ stage, title, phraseMap, printHref, onBarClick }: StageMusicProps) {
  const [loop, setLoop] = useState<string | null>(null);
  const [hidden, setHidden] = useState<string[]>([]);
  return (
    <div className="flex flex-col gap-5">
      <TunePlayer abc={stage.abc} phraseMap={phraseMap} onLoopChange={setLoop} />
      {phraseMap ? <MemoryMode phraseMap={phraseMap} hidden={hidden} onChange={setHidden} /> : null}
      <Notation
        abc={stage.abc}
        phraseMap={phraseMap}
        highlightPhrase={loop}
        hiddenPhrases={hidden}
        onBarClick={onBarClick}
        label={`${title}, stage ${stage.index}: ${stage.name}`}
      />
      <p>
        <Link href={printHref}>{`Print view of stage ${stage.index} (${stage.name})`}</Link>
      </p>
    </div>
  );
}
