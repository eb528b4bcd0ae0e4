"use client";
// The music of the stage being worked on: player and notation with the phrase map (like the tune page).
import { useState } from "react";
import { Notation, TunePlayer } from "@/components/notation";
import type { LearnAssignment } from "@/lib/teaching/learn-assignment";

export default function AssignmentMusic({
  music,
  title,
}: {
  music: NonNullable<LearnAssignment["music"]>;
  title: string;
}) {
  const [loop, setLoop] = useState<string | null>(null);
  return (
    <div className="flex flex-col gap-4">
      <TunePlayer abc={music.abc} phraseMap={music.phraseMap} onLoopChange={setLoop} />
      <Notation
        abc={music.abc}
        phraseMap={music.phraseMap}
        highlightPhrase={loop}
        label={`${title}, stage ${music.index}: ${music.name}`}
      />
    </div>
  );
}
