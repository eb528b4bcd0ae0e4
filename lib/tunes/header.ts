// What the tune list and the editor show about a tune, read from its ABC header. Pure (no
// database types), so the editor runs it in the browser as the teacher types.

/** The tune types the catalogue knows; db/schema/catalogue.ts builds tuneTypeEnum from this list. */
export const TUNE_TYPES = [
  "reel",
  "jig",
  "slip jig",
  "hornpipe",
  "polka",
  "waltz",
  "strathspey",
  "slide",
  "march",
  "mazurka",
  "barndance",
  "other",
] as const;
export type TuneType = (typeof TUNE_TYPES)[number];

/** A header field's value (before K:, where the music starts), trimmed; "" when absent. */
export function headerField(abc: string, letter: string): string {
  const k = /^K:.*$/m.exec(abc);
  const head = k ? abc.slice(0, k.index) : abc;
  return new RegExp(`^${letter}:(.*)$`, "m").exec(head)?.[1]?.replace(/%.*/, "").trim() ?? "";
}

/** The tune type from the R: field (ABC 2.1 §3.1.9 "rhythm"), "other" when it names none we know. */
export function tuneTypeOf(abc: string): TuneType {
  const r = headerField(abc, "R")
    .toLowerCase()
    .replace(/[-_\s]+/g, " ");
  const name = r === "slipjig" ? "slip jig" : r;
  return (TUNE_TYPES as readonly string[]).includes(name) ? (name as TuneType) : "other";
}
