// What the teacher's tune routes answer, as plain types the browser can import (no database).
import type { Problem, StagePlan } from "@/lib/abc/types";
import type { TuneType } from "./header";

export interface TuneSummary {
  id: string;
  title: string;
  tuneType: TuneType;
  key: string;
  meter: string;
  teacherName: string;
  updatedAt: string;
  stageCount: number;
}

export interface StageView {
  index: number;
  name: string;
  kinds: string[];
  abc: string;
  handEdited: boolean;
  sourceChanged: boolean;
}

export interface TuneView {
  id: string;
  title: string;
  tuneType: TuneType;
  key: string;
  meter: string;
  abc: string;
  stagePlan: StagePlan | null;
  acceptedSwaps: string[];
  /** Bars (melody bar index) whose double stops keep the other voice than the engine read. */
  turnedBars: Record<string, "upper" | "lower">;
  updatedAt: string;
  stages: StageView[];
  /** Courses whose ladders hold the tune. */
  courses: { id: string; title: string }[];
}

/** 422 from a save: nothing was stored. */
export interface ProblemsBody {
  error: string;
  problems: Problem[];
  planReasons: string[];
  /** Shown beside the problems; they alone would not have stopped the save. */
  notes: Problem[];
}

export interface SavedBody {
  tuneId: string;
  title: string;
  /** Accepted swaps the phrase map no longer offers after the change; they were let go. */
  droppedSwaps: string[];
  /** Hand-edited stages flagged by this save because the source changed under them. */
  flaggedStages: number[];
  /** What the engine noted about the tune (a bar longer than its meter …); the tune was saved. */
  notes: Problem[];
}
