"use client";
// The tune page's music pieces wired together the way a page would: one stage chosen, the
// looped phrase outlined in the music, memory mode covering phrases.
import { useState } from "react";
import type { PhraseMap } from "@/lib/abc/phrase-types";
import { MemoryMode, Notation, StageSelector, TunePlayer, type StageChoice } from "@/components/notation";

export function NotationDemo({
  stages,
  phraseMap,
}: {
  stages: (StageChoice & { abc: string })[];
  phraseMap: PhraseMap;
}) {
  const [stage, setStage] = useState(1);
  const [loop, setLoop] = useState<string | null>(null);
  const [hidden, setHidden] = useState<string[]>([]);
  const [bar, setBar] = useState<number | null>(null);
  const current = stages.find((s) => s.index === stage) ?? stages[0];
  return (
    <div className="flex flex-col gap-5">
      <StageSelector stages={stages} value={stage} onChange={setStage} />
      <TunePlayer abc={current.abc} phraseMap={phraseMap} onLoopChange={setLoop} />
      <MemoryMode phraseMap={phraseMap} hidden={hidden} onChange={setHidden} />
      <Notation
        abc={current.abc}
        phraseMap={phraseMap}
        highlightPhrase={loop}
        hiddenPhrases={hidden}
        onBarClick={setBar}
        label={`The Cedar Stair, stage ${current.index}: ${current.name}`}
      />
      <p role="status" className="text-small text-bark" data-clicked-bar={bar ?? ""}>
        {bar === null ? "Click a note to choose its bar." : `Bar ${bar} chosen.`}
      </p>
      <p>
        <a href={`/dev/notation/print?stage=${current.index}`}>Print view of this stage</a>
      </p>
    </div>
  );
}
