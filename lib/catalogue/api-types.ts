// The JSON the catalogue, ladder and tune routes answer with; the browser's queries read these
// types. Types only: nothing here pulls server code into a client bundle.
import type { PhraseMap } from "@/lib/abc/phrase-types";

export type RungState = "open" | "inProgress" | "done" | "locked";

export interface CatalogueRung {
  tuneId: string;
  tuneTitle: string;
  tuneType: string;
  tuneKey: string;
  isTaster: boolean;
}

export type CoursePace = "self_paced" | "teacher_sign_off";

export interface CatalogueCourse {
  id: string;
  slug: string;
  title: string;
  summary: string;
  /** The lead teacher, who follows new members. */
  teacherName: string;
  pace: CoursePace;
  grades: { title: string; rungs: CatalogueRung[] }[];
}

export interface MyCourse {
  id: string;
  slug: string;
  title: string;
  summary: string;
  teacherName: string;
  pace: CoursePace;
  /** "teaching" for a teacher's own course. */
  relation: "active" | "paused" | "ended" | "teaching";
  rungs: number;
  done: number;
  /** The first open rung not yet done: where to carry on. */
  next: { tuneId: string; tuneTitle: string } | null;
}

/** A course a student could start next (My courses): its page is /catalogue/courses/<slug>. */
export interface SuggestedCourse {
  id: string;
  slug: string;
  title: string;
  summary: string;
  teacherName: string;
  pace: CoursePace;
  grades: number;
  tunes: number;
}

export interface LadderRungJson extends CatalogueRung {
  rungId: string;
  position: number;
  requiredStage: number;
  requiredStageName: string;
  stageCount: number;
  /** The stage to check in next on this tune (reached + 1); null when every stage is reached. */
  nextStageName: string | null;
  state: RungState;
  reached: number;
  reason?: string;
}

export interface LadderJson {
  course: { id: string; slug: string; title: string; summary: string; teacherName: string; pace: CoursePace };
  standing: { pathway: "staff" | "ladder" | "taster"; why?: string };
  grades: { id: string; title: string; rungs: LadderRungJson[] }[];
}

export interface StageJson {
  index: number;
  name: string;
  kinds: string[];
  allowed: boolean;
  reason?: string;
}

export interface TuneJson {
  /** `words`: type, key and meter in plain words ("polka in G major, 2/4 time"). */
  tune: { id: string; title: string; tuneType: string; key: string; meter: string; words: string };
  rung: { courseId: string; courseTitle: string; gradeTitle: string; position: number; isTaster: boolean } | null;
  reached: number;
  stages: StageJson[];
  phraseMap: PhraseMap | null;
}

export interface StageAbcJson {
  index: number;
  name: string;
  kinds: string[];
  abc: string;
}

export interface NoteJson {
  id: string;
  bar: number;
  body: string;
  createdAt: string;
  updatedAt: string;
}

/** Every refusal from the guard and the routes: a message in words, and field messages for forms. */
export interface ErrorJson {
  error: string;
  fieldErrors?: Record<string, string>;
}
