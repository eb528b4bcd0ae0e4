"use client";
// The learning version for some twin swaps, made in the browser by the engine (loaded on demand).
import { useEffect, useState } from "react";
import type { PhraseMap } from "@/lib/abc/phrase-types";
import type { LearningVersion } from "@/lib/tunes/learning";

export function useLearning(
  abc: string,
  map: PhraseMap | null,
  which: readonly string[] | null,
): LearningVersion | null {
  const [version, setVersion] = useState<LearningVersion | null>(null);
  const key = which?.join(",") ?? null;
  useEffect(() => {
    if (!map || key === null) {
      setVersion(null);
      return;
    }
    let live = true;
    void import("@/lib/tunes/learning").then(({ learningVersion }) => {
      if (live) setVersion(learningVersion(abc, map, key ? key.split(",") : []));
    });
    return () => {
      live = false;
    };
  }, [abc, map, key]);
  return version;
}
