// The music components of the tune page (issue 5 item 6). Each loads abcjs only when it mounts.
export { Notation, type NotationProps } from "./notation";
export { TunePlayer, type TunePlayerProps } from "./tune-player";
export { MemoryMode, type MemoryModeProps } from "./memory-mode";
export { PrintStage, type PrintStageProps } from "./print-stage";
export { StageSelector, type StageChoice, type StageSelectorProps } from "./stage-selector";
export { phraseLabel, twinWords, phraseList, barsText } from "./phrase-words";
