// How a course's stages open, in words for the tune page and the ladder (pure; the browser imports it).
export type Pace = "self_paced" | "teacher_sign_off";

export const PACE_NAME: Record<Pace, string> = {
  self_paced: "Self-paced",
  teacher_sign_off: "Teacher sign-off",
};

/** One sentence on how this course's stages open. */
export function paceWords(pace: Pace, teacherName: string): string {
  return pace === "self_paced"
    ? `Each check-in opens the next stage at once; ${teacherName} sees every check-in and may leave you a word.`
    : `${teacherName} listens to each check-in and opens the next stage when it is ready.`;
}

/** What checking in this stage does next. */
export function opensNextWords(pace: Pace, teacherName: string, next: { index: number; name: string } | null): string {
  if (!next) return "This is the tune's last stage: checking it in completes the tune.";
  const what = `stage ${next.index} (${next.name})`;
  return pace === "self_paced"
    ? `Checking in opens ${what} at once.`
    : `When ${teacherName} signs off your check-in, ${what} opens.`;
}
