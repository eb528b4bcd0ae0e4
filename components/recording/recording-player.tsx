"use client";
// Plays a check-in recording through a short-lived presigned address from the playback route. When
// the address has expired (the browser's request fails) or is about to, a fresh one is fetched.
import { useCallback, useEffect, useRef, useState, type RefObject } from "react";
import { Alert } from "@/components/ui/alert";
import { ApiError, fetchJson } from "@/lib/catalogue/fetch-json";

type Playback = { url: string; expiresInSeconds: number };
// Ask again a little before the address runs out, so pressing play never meets an expired one.
const MARGIN_MS = 30_000;

export function RecordingPlayer({
  uploadId,
  label = "Check-in recording",
  audioRef,
}: {
  uploadId: string;
  label?: string;
  /** Also given the audio element, for a caller that moves the playback (the listening aid's bar strip). */
  audioRef?: RefObject<HTMLAudioElement | null>;
}) {
  const [src, setSrc] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const expiresAt = useRef(0);
  const audio = useRef<HTMLAudioElement>(null);

  const refresh = useCallback(async () => {
    try {
      const p = await fetchJson<Playback>(`/api/recordings/${uploadId}/playback`);
      expiresAt.current = Date.now() + p.expiresInSeconds * 1000;
      setSrc(p.url);
      setProblem(null);
    } catch (e) {
      setProblem(
        e instanceof ApiError && e.status === 404
          ? "This recording is not available."
          : e instanceof Error
            ? e.message
            : "The recording could not be loaded.",
      );
    }
  }, [uploadId]);

  useEffect(() => {
    void refresh();
  }, [refresh]);

  // A media error after the address expired: fetch a new one, but not in a loop for a broken file.
  const onError = useCallback(() => {
    if (Date.now() > expiresAt.current - MARGIN_MS) void refresh();
    else setProblem("The recording could not be played in this browser.");
  }, [refresh]);

  const onPlay = useCallback(() => {
    if (Date.now() < expiresAt.current - MARGIN_MS) return;
    const at = audio.current?.currentTime ?? 0;
    void refresh().then(() => {
      const el = audio.current;
      if (!el) return;
      el.currentTime = at;
      void el.play().catch(() => {});
    });
  }, [refresh]);

  if (problem) return <Alert tone="warning">{problem}</Alert>;
  if (!src) return <p className="text-bark">Loading the recording…</p>;
  return (
    <audio
      ref={(el) => {
        audio.current = el;
        if (audioRef) audioRef.current = el;
      }}
      controls
      preload="metadata"
      src={src}
      aria-label={label}
      onError={onError}
      onPlay={onPlay}
      className="w-full"
    />
  );
}
