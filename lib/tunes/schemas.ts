// Inputs of the tune editor's routes, checked with the same schemas in the browser and the route
// handlers (ENGINEERING.md: zod on both sides). Shape only: what the engine thinks of the music
// (problems with line and column, plan reasons) is lib/tunes/check.ts.
import { z } from "zod";
import { MAX_ABC_BYTES, MAX_BARS } from "@/lib/abc/limits";
import { KINDS } from "@/lib/abc/types";

/**
 * One tune's ABC: the engine's own limit (200 kB, lib/abc/limits.ts), counted here in characters
 * so a request is refused before it is read; the engine counts bytes and says where the text passes.
 */
export const MAX_TUNE_CHARS = MAX_ABC_BYTES;
export const MAX_STAGES = 8;

export const stagePlanInput = z.object({
  stages: z
    .array(
      z.object({
        name: z.string().trim().min(1, "Every stage needs a name.").max(60, "Keep stage names under 60 characters."),
        adds: z.array(z.enum(KINDS)).max(KINDS.length),
      }),
    )
    .min(1, "A plan needs at least one stage.")
    .max(MAX_STAGES, `A plan has at most ${MAX_STAGES} stages.`),
});

/** The tune engine's bar limit (lib/abc/limits.ts) bounds the keys; a tune has at most that many turns. */
export const turnedBarsInput = z
  .record(z.string().regex(/^\d{1,4}$/, "A bar is named by its number."), z.enum(["upper", "lower"]))
  .refine((r) => Object.keys(r).length <= MAX_BARS, `A tune has at most ${MAX_BARS} bars.`);

/** The turned bars stored in the tunes row (jsonb); nothing when they do not read. */
export function storedTurns(json: unknown): Record<string, "upper" | "lower"> {
  const parsed = turnedBarsInput.safeParse(json);
  return parsed.success ? parsed.data : {};
}

export const abcText = z
  .string()
  .min(1, "Write the tune in ABC first.")
  .max(
    MAX_TUNE_CHARS,
    `One tune is at most ${MAX_TUNE_CHARS.toLocaleString("en")} characters; use Import for a file of many tunes.`,
  );

export const tuneInput = z.object({
  abc: abcText,
  /** null: the default plan (lib/abc DEFAULT_PLAN). */
  stagePlan: stagePlanInput.nullable().default(null),
  /** Phrase ids of near twins played like their model in the learning version. */
  acceptedSwaps: z.array(z.string().min(1).max(16)).max(64).default([]),
  /** Bars (melody bar index) whose double stops keep the other voice than the engine read. */
  turnedBars: turnedBarsInput.default({}),
});
export type TuneInput = z.input<typeof tuneInput>;

export const tuneId = z.object({ tuneId: z.uuid("Unknown tune.") });

export const stageEditInput = tuneId.extend({
  index: z.coerce.number().int().min(1).max(MAX_STAGES),
  abc: abcText,
});

export const stageRef = tuneId.extend({ index: z.coerce.number().int().min(1).max(MAX_STAGES) });

/** The plan stored in the tunes row (jsonb) as the engine takes it; null for the default plan. */
export function storedPlan(json: unknown): z.output<typeof stagePlanInput> | null {
  const parsed = stagePlanInput.safeParse(json);
  return parsed.success ? parsed.data : null;
}
