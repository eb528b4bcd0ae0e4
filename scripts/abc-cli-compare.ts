// `compare` for the tune-engine CLI, kept apart so the main CLI stays small.
import type { Problem } from "../lib/abc/index";

export type CompareOutcome = { ok: true; value: unknown } | { ok: false; problems: { a: Problem[]; b: Problem[] } };

export function runCompare(a: string, b: string): CompareOutcome {
  void a;
  void b;
  return { ok: false, problems: { a: [{ line: 1, column: 1, message: "Setting comparison is not available yet." }], b: [] } };
}
