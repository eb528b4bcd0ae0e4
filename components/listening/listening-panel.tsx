"use client";
// The recording beside the listening aid's hearing of it: the player, the one-line summary, the bar
// strip and the stage's music. A bar pressed in the strip plays the recording from that bar and
// outlines the bar in the music. Teachers and students see the same strip; the words around it say
// that it only suggests.
import { useRef, useState } from "react";
import { Notation } from "@/components/notation";
import { RecordingPlayer } from "@/components/recording/recording-player";
import { Alert } from "@/components/ui/alert";
import { clock } from "@/lib/listen/summary";
import type { BarReport, ListenResult } from "@/lib/listen/types";
import type { ListeningView } from "@/lib/listen/view";
import { BarStrip, barWords } from "./bar-strip";

export type Audience = "teacher" | "student";

const CAUTION: Record<Audience, string> = {
  teacher:
    "A first hearing by the app, to point your ear: it can miss or mishear. What you hear and your sign-off decide.",
  student:
    "A first hearing by the app, to help you check yourself: it can miss or mishear, and it is not a mark. Your teacher's word counts.",
};

function tempoWords(r: ListenResult): string | null {
  const t = r.tempo;
  if (t.start === null || t.end === null) return null;
  const asked = t.expected === null ? "" : ` (asked ${Math.round(t.expected)})`;
  const steady = t.steadiness ? `, ${t.steadiness}` : "";
  return `Tempo ${Math.round(t.start)}→${Math.round(t.end)} beats a minute, a beat being a ${t.beat}${asked}${steady}.`;
}

function Heard({
  result,
  abc,
  musicLabel,
  audience,
  play,
}: {
  result: ListenResult;
  abc: string;
  musicLabel: string;
  audience: Audience;
  play: (seconds: number) => void;
}) {
  const [bar, setBar] = useState<BarReport | null>(null);
  const select = (b: BarReport) => {
    setBar(b);
    if (b.at !== null) play(b.at);
  };
  const tempo = tempoWords(result);
  return (
    <div className="flex flex-col gap-3">
      <p className="font-semibold" data-testid="listening-summary">
        {result.summary}
      </p>
      {tempo ? <p className="text-small text-bark">{tempo}</p> : null}
      <BarStrip
        bars={result.bars}
        selected={bar?.bar ?? null}
        onSelect={select}
        label={audience === "teacher" ? "Bars as the listening aid heard them" : "Your bars as the app heard them"}
      />
      <p role="status" className="text-small text-bark" data-testid="listening-selected">
        {bar
          ? `${barWords(bar)}.${bar.at !== null ? ` Playing from ${clock(bar.at)}; the bar is outlined in the music.` : ""}`
          : "Press a bar to hear the recording from there."}
      </p>
      <Notation abc={abc} label={musicLabel} highlightBars={bar ? [bar.bar] : []} />
      <p className="text-small text-bark">{CAUTION[audience]}</p>
    </div>
  );
}

export function ListeningPanel({
  listening,
  uploadId,
  abc,
  recordingLabel,
  musicLabel,
  audience,
}: {
  listening: ListeningView | null;
  uploadId: string;
  abc: string;
  recordingLabel: string;
  musicLabel: string;
  audience: Audience;
}) {
  const audio = useRef<HTMLAudioElement | null>(null);
  const play = (seconds: number) => {
    const el = audio.current;
    if (!el) return;
    el.currentTime = seconds;
    void el.play().catch(() => {}); // a browser may refuse to start sound; the position is still set
  };
  return (
    <section
      className="flex flex-col gap-3"
      aria-label="Recording and listening aid"
      data-listening={listening?.state ?? "none"}
    >
      <RecordingPlayer uploadId={uploadId} label={recordingLabel} audioRef={audio} />
      {listening?.state === "done" ? (
        <Heard result={listening.result} abc={abc} musicLabel={musicLabel} audience={audience} play={play} />
      ) : (
        <>
          {listening?.state === "listening" ? (
            <p role="status" className="text-small text-bark">
              The listening aid is still hearing this recording; its bar-by-bar notes will appear here.
            </p>
          ) : null}
          {listening?.state === "failed" ? (
            <Alert tone="info" title="The listening aid could not hear this recording">
              {listening.reason}{" "}
              {audience === "teacher" ? "Listen to it as usual." : "Your teacher will listen to it as usual."}
            </Alert>
          ) : null}
          {abc ? <Notation abc={abc} label={musicLabel} /> : null}
        </>
      )}
    </section>
  );
}
