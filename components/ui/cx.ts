/** Joins class names, skipping falsy ones; too small a job to add a dependency for. */
export function cx(...parts: Array<string | false | null | undefined>): string {
  return parts.filter(Boolean).join(" ");
}
