"use client";
// The student's self-check after a check-in: their recording with the listening aid's strip and the
// stage's music (loaded lazily by the assignment page: abcjs comes with it).
import type { SelfCheck } from "@/lib/teaching/learn-self-check";
import { ListeningPanel } from "./listening-panel";

export default function SelfCheckView({ selfCheck, title }: { selfCheck: SelfCheck; title: string }) {
  return (
    <ListeningPanel
      listening={selfCheck.listening}
      uploadId={selfCheck.uploadId}
      abc={selfCheck.abc}
      recordingLabel={`Your recording of stage ${selfCheck.stageIndex}`}
      musicLabel={`${title}, stage ${selfCheck.stageIndex}: ${selfCheck.stageName}`}
      audience="student"
    />
  );
}
