"use client";
// The engine run in the browser as the teacher types (debounced): the same checkTune the server
// runs on save, so the problems listed here are the ones a save would be refused with.
import { useEffect, useState } from "react";
import type { StagePlan } from "@/lib/abc/types";
import type { TuneCheck } from "@/lib/tunes/check";

export interface LiveCheck {
  /** The check with the teacher's plan: problems, or the tune with its stages. */
  check: TuneCheck | null;
  /** When the plan is not valid: the tune checked with the default plan, so the music still shows. */
  fallback: TuneCheck | null;
  checking: boolean;
}

const DELAY_MS = 350;

export function useLiveCheck(
  abc: string,
  plan: StagePlan | null,
  acceptedSwaps: readonly string[],
  turnedBars: Readonly<Record<string, "upper" | "lower">>,
): LiveCheck {
  const [state, setState] = useState<LiveCheck>({ check: null, fallback: null, checking: true });
  useEffect(() => {
    let live = true;
    setState((s) => ({ ...s, checking: true }));
    const timer = setTimeout(() => {
      // The engine parses with abcjs: loaded here so pages without an editor never download it.
      void import("@/lib/tunes/check").then(({ checkTune }) => {
        if (!live) return;
        const check = checkTune(abc, { stagePlan: plan, acceptedSwaps, turnedBars });
        const fallback = !check.ok && check.planReasons.length ? checkTune(abc, { acceptedSwaps, turnedBars }) : null;
        setState({ check, fallback, checking: false });
      });
    }, DELAY_MS);
    return () => {
      live = false;
      clearTimeout(timer);
    };
  }, [abc, plan, acceptedSwaps, turnedBars]);
  return state;
}
