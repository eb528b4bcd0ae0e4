"use client";
// The tune page (issue 5 item 6): stage selector with locked stages visible but closed, the music
// with its phrase map, the player, memory mode, margin notes, comparison with another setting and
// a print view. Used for students (/learn/tunes) and for the public taster (/catalogue/tunes).
import Link from "next/link";
import { useEffect, useState } from "react";
import { MemoryMode, Notation, StageSelector, TunePlayer } from "@/components/notation";
import { tuneWords } from "@/components/catalogue/tune-words";
import { Alert } from "@/components/ui/alert";
import { errorWords } from "@/lib/catalogue/fetch-json";
import type { TuneJson } from "@/lib/catalogue/api-types";
import { CompareSettings } from "./compare-settings";
import { MarginNotes } from "./margin-notes";
import { useStage, useTune } from "./use-tune";

export interface TunePageProps {
  tuneId: string;
  area: "learn" | "public";
  /** Margin notes need a signed-in writer. */
  notes: boolean;
}

/** The stage to show first: the furthest open one, where the student is working. */
const firstStage = (t: TuneJson): number => Math.max(1, ...t.stages.filter((s) => s.allowed).map((s) => s.index));

export function TunePage({ tuneId, area, notes }: TunePageProps) {
  const tune = useTune(tuneId);
  const [stage, setStage] = useState<number | null>(null);
  const [loop, setLoop] = useState<string | null>(null);
  const [hidden, setHidden] = useState<string[]>([]);
  const [bar, setBar] = useState<number | null>(null);
  useEffect(() => {
    if (tune.data && stage === null) setStage(firstStage(tune.data));
  }, [tune.data, stage]);
  const music = useStage(tuneId, stage);

  if (tune.isPending) return <p role="status" className="text-bark">Loading the tune…</p>;
  if (tune.isError) {
    return (
      <Alert tone="warning" title="This tune is not open to you yet">
        <p>{errorWords(tune.error)}</p>
        <p className="mt-2"><Link href={area === "learn" ? "/learn/courses" : "/catalogue"}>{area === "learn" ? "Back to my courses" : "Back to the catalogue"}</Link></p>
      </Alert>
    );
  }
  const t = tune.data;
  const current = t.stages.find((s) => s.index === stage);
  const printBase = area === "learn" ? `/learn/tunes/${tuneId}/print` : `/catalogue/tunes/${tuneId}/print`;
  return (
    <div className="flex flex-col gap-6">
      <header className="flex flex-col gap-1">
        {t.rung ? (
          <p className="text-small text-bark">
            {area === "learn" ? <Link href={`/learn/courses/${t.rung.courseId}`}>{t.rung.courseTitle}</Link> : t.rung.courseTitle}
            {` · ${t.rung.gradeTitle}, rung ${t.rung.position}${t.rung.isTaster ? " · free taster" : ""}`}
          </p>
        ) : null}
        <h1 className="text-h2 font-semibold">{t.tune.title}</h1>
        <p className="text-bark">{`${tuneWords({ tuneType: t.tune.tuneType, tuneKey: t.tune.key })}${t.tune.meter ? `, ${t.tune.meter} time` : ""}`}</p>
      </header>
      <StageSelector
        stages={t.stages.map((s) => ({ index: s.index, name: s.name, locked: !s.allowed, reason: s.reason }))}
        value={stage ?? 1}
        onChange={setStage}
      />
      {music.isPending ? <p role="status" className="text-bark">Loading the music of this stage…</p> : null}
      {music.isError ? <Alert tone="error" live>{errorWords(music.error)}</Alert> : null}
      {music.data ? (
        <>
          <TunePlayer abc={music.data.abc} phraseMap={t.phraseMap} onLoopChange={setLoop} />
          {t.phraseMap ? <MemoryMode phraseMap={t.phraseMap} hidden={hidden} onChange={setHidden} /> : null}
          <Notation
            abc={music.data.abc} phraseMap={t.phraseMap} highlightPhrase={loop} hiddenPhrases={hidden}
            onBarClick={notes ? setBar : undefined} label={`${t.tune.title}, stage ${music.data.index}: ${music.data.name}`}
          />
          <p>
            <Link href={`${printBase}?stage=${music.data.index}`}>{`Print view of stage ${music.data.index} (${music.data.name})`}</Link>
          </p>
        </>
      ) : null}
      <div className="grid gap-6 lg:grid-cols-2">
        {notes ? (
          <MarginNotes tuneId={tuneId} bar={bar} onBarChange={setBar} />
        ) : (
          <Alert title="Margin notes">
            <Link href={`/sign-in?next=${encodeURIComponent(`/catalogue/tunes/${tuneId}`)}`}>Sign in</Link> to pin your own notes to bars of this tune.
          </Alert>
        )}
        {music.data && current ? <CompareSettings abc={music.data.abc} stageName={`stage ${current.index}`} /> : null}
      </div>
    </div>
  );
}
