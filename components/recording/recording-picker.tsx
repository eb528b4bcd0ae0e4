"use client";
// A check-in's recording: recorded here or chosen from a file, uploaded straight to storage with a
// progress bar, then checked by the server (audio by its content, at most 25 MB). The parent form
// gets the upload's id through onStored once the server has kept it.
import { useEffect, useId, useMemo, useState, type ChangeEvent } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { MAX_RECORDING_BYTES, refusalWords, uploadRecording } from "./upload";
import { useRecorder } from "./use-recorder";

export type RecordingPickerProps = {
  /** The assignment the recording is for, or (on a course's tune page) the tune. */
  assignmentStudentId?: string;
  tuneId?: string;
  stageIndex: number;
  onStored: (uploadId: string) => void;
};

type Upload =
  | { phase: "idle" }
  | { phase: "sending"; percent: number }
  | { phase: "stored"; name: string }
  | { phase: "refused"; message: string };

const clock = (s: number) => `${Math.floor(s / 60)}:${String(s % 60).padStart(2, "0")}`;

export function RecordingPicker({ assignmentStudentId, tuneId, stageIndex, onStored }: RecordingPickerProps) {
  const fileId = useId();
  const { state: rec, start, stop, reset } = useRecorder();
  const [upload, setUpload] = useState<Upload>({ phase: "idle" });
  const preview = useMemo(() => (rec.blob ? URL.createObjectURL(rec.blob) : null), [rec.blob]);
  useEffect(() => () => (preview ? URL.revokeObjectURL(preview) : undefined), [preview]);
  const busy = upload.phase === "sending" || rec.phase === "recording";

  async function send(body: Blob, name: string) {
    if (body.size > MAX_RECORDING_BYTES) {
      setUpload({
        phase: "refused",
        message: `${name} is ${(body.size / 1048576).toFixed(1)} MB; a recording can be at most 25 MB.`,
      });
      return;
    }
    setUpload({ phase: "sending", percent: 0 });
    try {
      const uploadId = await uploadRecording(body, { assignmentStudentId, tuneId, stageIndex }, (percent) =>
        setUpload({ phase: "sending", percent }),
      );
      setUpload({ phase: "stored", name });
      onStored(uploadId);
    } catch (e) {
      setUpload({ phase: "refused", message: refusalWords(e) });
    }
  }

  function chosen(e: ChangeEvent<HTMLInputElement>) {
    const file = e.target.files?.[0];
    e.target.value = ""; // choosing the same file again still fires a change
    if (file) void send(file, file.name);
  }

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center gap-3">
        {rec.phase === "recording" ? (
          <Button variant="danger" onClick={stop}>
            Stop recording ({clock(rec.seconds)})
          </Button>
        ) : (
          <Button
            variant="secondary"
            onClick={() => {
              setUpload({ phase: "idle" });
              void start();
            }}
            disabled={busy}
          >
            {rec.phase === "done" ? "Record again" : "Record now"}
          </Button>
        )}
        <span className="text-bark">or</span>
        <label htmlFor={fileId} className="font-semibold text-ink">
          Choose a recording file
          <input
            id={fileId}
            type="file"
            accept="audio/*"
            disabled={busy}
            onChange={chosen}
            className="mt-1 block w-full max-w-xs text-small file:mr-3 file:min-h-11 file:rounded-knot file:border-2 file:border-cedar file:bg-paper file:px-3 file:font-semibold file:text-cedar"
          />
        </label>
      </div>
      <p className="text-small text-bark">Audio only, up to 25 MB.</p>
      {rec.error ? (
        <Alert tone="warning" live>
          {rec.error}
        </Alert>
      ) : null}
      {rec.phase === "done" && preview && rec.blob ? (
        <div className="flex flex-col gap-2">
          <audio controls src={preview} aria-label="Your new recording" className="w-full" />
          {/* Once this take is stored, the choice is made; "Record again" starts over. */}
          <div className={upload.phase === "stored" ? "hidden" : "flex flex-wrap gap-3"}>
            <Button onClick={() => rec.blob && void send(rec.blob, "Your recording")} disabled={busy}>
              Use this recording
            </Button>
            <Button variant="quiet" onClick={reset} disabled={busy}>
              Discard
            </Button>
          </div>
        </div>
      ) : null}
      {upload.phase === "sending" ? (
        <div className="flex items-center gap-3">
          <progress
            max={100}
            value={upload.percent}
            aria-label="Upload progress"
            className="h-3 w-full max-w-xs accent-cedar"
          />
          <span aria-live="polite" className="tabular-nums">
            {upload.percent}%
          </span>
        </div>
      ) : null}
      {upload.phase === "stored" ? (
        <Alert tone="success" live>
          {upload.name} is uploaded and ready to send with your check-in.
        </Alert>
      ) : null}
      {upload.phase === "refused" ? (
        <Alert tone="error" live>
          {upload.message}
        </Alert>
      ) : null}
    </div>
  );
}
