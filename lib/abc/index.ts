// The tune engine's public surface (PRODUCT.md §4). Pure TypeScript: no database or framework.
export * from "./types";
export { splitTunes, type TuneText } from "./split";
export { parseTune, warningToProblem, warningKeys } from "./parse";
export { frac, add, sub, mul, div, cmp, eq, fromNumber, toString as fractionToString } from "./fraction";
export { classify } from "./classify";
export { skeletonOf, buildModel, type SkeletonOptions, type TuneShape } from "./skeleton";
export { DEFAULT_PLAN, validatePlan, buildStages, type PlanCheck } from "./stages";
export { analyze, type Analysis, type AnalyzeOptions } from "./analyze";
export { prepareTune, type Prepared } from "./tune";
export {
  pickStops,
  type BarVoices,
  type DoubleStop,
  type StopChoice,
  type StopReason,
  type Voice,
} from "./double-stops";
export { defaultUnit, parseMeter } from "./header";
export { kindOfDecoration, DEFAULT_SHORTHANDS } from "./decorations";
export { phraseMap, type PhraseMap } from "./phrase-map";
export { twinSwap } from "./twin-swap";
export { compareSettings, type Comparison } from "./compare";
