"use client";
// Play, pause, speed, loop one phrase and a count-in, through abcjs's synth with fiddle samples
// rendered from the FluidR3 GM soundfont (scripts/make-soundfont.sh; its licence ships beside them). Nothing loads until the first press of Play (no audio before a gesture).
import { useEffect, useId, useRef, useState } from "react";
import type { PhraseMap } from "@/lib/abc/phrase-types";
import { Button } from "@/components/ui/button";
import { cx } from "@/components/ui/cx";
import { FiddlePlayer, SOUND_FONT_URL, type PlayerStatus } from "./fiddle-player";
import { loadBarSpans } from "./loaders";
import { phraseAbc } from "./playback-abc";
import { barsText, phraseLabel, phraseList } from "./phrase-words";

export interface TunePlayerProps {
  abc: string;
  phraseMap?: PhraseMap | null;
  /** Told which phrase is looping (null for the whole tune), e.g. to outline it in the notation. */
  onLoopChange?: (phraseId: string | null) => void;
  className?: string;
}

const STATUS_WORDS: Record<PlayerStatus, string> = {
  idle: "Ready to play.",
  loading: "Getting the fiddle sound ready…",
  playing: "Playing.",
  paused: "Paused.",
  error: "The sound could not be played in this browser.",
};

export function TunePlayer({ abc, phraseMap, onLoopChange, className }: TunePlayerProps) {
  const id = useId();
  const player = useRef<FiddlePlayer | null>(null);
  const [status, setStatus] = useState<PlayerStatus>("idle");
  const [started, setStarted] = useState(false); // audio is built from the first Play on
  const [duration, setDuration] = useState(0);
  const [peak, setPeak] = useState(0);
  const [audio, setAudio] = useState<string>("none");
  const [tempo, setTempo] = useState(100);
  const [countIn, setCountIn] = useState(true);
  const [loopId, setLoopId] = useState("");
  const loaded = useRef(""); // the music and settings the current audio was built from
  const loadedLoop = useRef("");
  const phrases = phraseMap ? phraseList(phraseMap) : [];

  useEffect(() => {
    const p = new FiddlePlayer((me) => {
      setStatus(me.status);
      setDuration(me.duration);
      setPeak(me.peak);
      void me.audioState().then(setAudio, () => setAudio("none"));
    });
    player.current = p;
    return () => p.dispose();
  }, []);

  const source = async (): Promise<string> => {
    const phrase = phrases.find((p) => p.id === loopId);
    if (!phrase) return abc;
    return phraseAbc(abc, await loadBarSpans(abc), phrase.barNumbers);
  };

  const load = async (): Promise<void> => {
    const p = player.current;
    const key = JSON.stringify([abc, tempo, countIn, loopId]);
    if (!p || key === loaded.current) return;
    loaded.current = key;
    const fromStart = loopId !== loadedLoop.current;
    loadedLoop.current = loopId;
    await p.load(await source(), { tempo, countIn, loop: loopId !== "", fromStart });
  };

  // Once sound has been asked for, every change of music or setting rebuilds it (the slider waits
  // for a pause in dragging, so the audio is not rebuilt at every step).
  useEffect(() => {
    if (!started) return;
    const t = setTimeout(() => void load(), 250);
    return () => clearTimeout(t);
  }, [abc, tempo, countIn, loopId, started]); // load() reads exactly these

  const onPlay = async (): Promise<void> => {
    const p = player.current;
    if (!p) return;
    if (p.status === "playing") return p.pause();
    if (!started || p.status === "error") {
      setStarted(true);
      loaded.current = ""; // after a failure, try again
      await load();
    }
    if (p.status !== "error") await p.play().catch(() => setStatus("error"));
  };

  const chooseLoop = (value: string): void => {
    setLoopId(value);
    onLoopChange?.(value || null);
  };

  const looping = phrases.find((p) => p.id === loopId);
  return (
    <section
      aria-label="Play the tune"
      className={cx("flex flex-col gap-4 rounded-knot border border-line bg-sawdust p-4", className)}
      data-player-status={status}
      data-duration={duration.toFixed(3)}
      data-peak={peak.toFixed(3)}
      data-tempo={tempo}
      data-audio={audio}
    >
      <div className="flex flex-wrap items-center gap-3">
        <Button
          // Never disabled: a press while the sound loads plays it when ready (FiddlePlayer.play).
          onClick={() => void onPlay()}
          aria-label={status === "playing" ? "Pause" : "Play"}
        >
          <span aria-hidden="true">{status === "playing" ? "❚❚" : "▶"}</span>
          {status === "playing" ? "Pause" : "Play"}
        </Button>
        <Button variant="secondary" onClick={() => player.current?.stop()} disabled={status === "loading" || !started}>
          Back to the start
        </Button>
        <p role="status" className="text-small text-bark">
          {STATUS_WORDS[status]}
          {status === "playing" || status === "paused"
            ? ` ${looping ? `Looping ${looping.id}.` : "Whole tune."} Speed ${tempo}%.`
            : ""}
        </p>
      </div>
      <div className="grid gap-4 sm:grid-cols-3">
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-tempo`} className="font-semibold">
            Speed{" "}
            <output htmlFor={`${id}-tempo`} className="font-normal">
              {tempo}%
            </output>
          </label>
          <input
            id={`${id}-tempo`}
            type="range"
            min={40}
            max={120}
            step={5}
            value={tempo}
            aria-valuetext={`${tempo} percent of the tune's speed`}
            onChange={(e) => setTempo(Number(e.target.value))}
            className="h-11 accent-cedar"
          />
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-loop`} className="font-semibold">
            Loop
          </label>
          <select
            id={`${id}-loop`}
            value={loopId}
            onChange={(e) => chooseLoop(e.target.value)}
            className="min-h-11 rounded-knot border border-grain bg-paper px-3"
          >
            <option value="">Whole tune, no loop</option>
            {phrases.map((p) => (
              <option key={p.id} value={p.id}>{`${phraseLabel(p)} (${barsText(p)})`}</option>
            ))}
          </select>
        </div>
        <label className="flex min-h-11 items-center gap-2 self-end font-semibold">
          <input
            type="checkbox"
            checked={countIn}
            onChange={(e) => setCountIn(e.target.checked)}
            className="size-5 accent-cedar"
          />
          Count in one bar
        </label>
      </div>
      <p className="text-caption text-bark">
        Fiddle sound rendered from the FluidR3 GM soundfont by Frank Wen (
        <a href={`${SOUND_FONT_URL}LICENSE-FluidR3_GM.txt`}>MIT licence</a>).
      </p>
    </section>
  );
}
