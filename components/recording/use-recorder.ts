"use client";
// Recording in the browser with MediaRecorder (W3C MediaStream Recording). The microphone is
// released as soon as recording stops, so the browser's "in use" indicator does not linger.
import { useCallback, useEffect, useRef, useState } from "react";

export type RecorderState = {
  phase: "idle" | "recording" | "done";
  seconds: number;
  blob: Blob | null;
  error: string | null;
};

// Error names from the Media Capture and Streams spec (getUserMedia's rejections).
function micProblem(error: unknown): string {
  const name = error instanceof DOMException ? error.name : "";
  if (name === "NotAllowedError" || name === "SecurityError") {
    return "Microphone permission was refused. Allow the microphone for this site in your browser's settings, or choose a file instead.";
  }
  if (name === "NotFoundError" || name === "OverconstrainedError")
    return "No microphone was found. Plug one in, or choose a recorded file instead.";
  if (name === "NotReadableError")
    return "The microphone is busy in another program. Close it there and try again, or choose a file.";
  return "Recording could not start in this browser. Choose a recorded file instead.";
}

export function useRecorder() {
  const [state, setState] = useState<RecorderState>({ phase: "idle", seconds: 0, blob: null, error: null });
  const recorder = useRef<MediaRecorder | null>(null);
  const timer = useRef<ReturnType<typeof setInterval> | null>(null);

  const release = useCallback(() => {
    if (timer.current) clearInterval(timer.current);
    timer.current = null;
    recorder.current?.stream.getTracks().forEach((t) => t.stop());
  }, []);
  useEffect(() => release, [release]);

  const start = useCallback(async () => {
    if (typeof MediaRecorder === "undefined" || !navigator.mediaDevices?.getUserMedia) {
      // getUserMedia exists only in secure contexts (https or localhost).
      setState({
        phase: "idle",
        seconds: 0,
        blob: null,
        error: "This browser cannot record here. Choose a recorded file instead.",
      });
      return;
    }
    let stream: MediaStream;
    try {
      stream = await navigator.mediaDevices.getUserMedia({ audio: true });
    } catch (e) {
      setState({ phase: "idle", seconds: 0, blob: null, error: micProblem(e) });
      return;
    }
    const chunks: Blob[] = [];
    const rec = new MediaRecorder(stream);
    rec.ondataavailable = (e) => {
      if (e.data.size > 0) chunks.push(e.data);
    };
    rec.onstop = () => {
      release();
      setState((s) => ({ ...s, phase: "done", blob: new Blob(chunks, { type: rec.mimeType || "audio/webm" }) }));
    };
    recorder.current = rec;
    rec.start(1000);
    const began = Date.now();
    timer.current = setInterval(
      () => setState((s) => ({ ...s, seconds: Math.floor((Date.now() - began) / 1000) })),
      500,
    );
    setState({ phase: "recording", seconds: 0, blob: null, error: null });
  }, [release]);

  const stop = useCallback(() => {
    if (recorder.current?.state === "recording") recorder.current.stop();
  }, []);
  const reset = useCallback(() => setState({ phase: "idle", seconds: 0, blob: null, error: null }), []);

  return { state, start, stop, reset };
}
