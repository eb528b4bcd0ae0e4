// Limits of the tune page's forms, apart from the zod schemas so that a page can show them without
// shipping zod in its first load (the schemas load when a form is sent).

/** Bars are numbered as the phrase map numbers them: a pickup is bar 0. */
export const MAX_BAR = 999;
export const NOTE_MAX = 2000;
export const COMPARE_MAX = 20_000;
