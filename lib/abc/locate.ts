// Offsets in a tune's text → 1-based line and column, and the error the engine throws for input
// it cannot read at a known place (a length divided by zero …): guard() reports it there.
import type { Problem } from "./types";

/** Line starts are found once, on the first question, so many problems cost one scan. */
export class Locator {
  private starts: number[] | null = null;
  constructor(
    private readonly text: string,
    private readonly lineOffset = 0,
  ) {}
  at(offset: number, message: string): Problem {
    if (this.starts === null) {
      const starts = [0];
      for (let i = this.text.indexOf("\n"); i >= 0; i = this.text.indexOf("\n", i + 1)) starts.push(i + 1);
      this.starts = starts;
    }
    const starts = this.starts;
    let lo = 0;
    let hi = starts.length;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (starts[mid] <= offset) lo = mid;
      else hi = mid;
    }
    return { line: lo + 1 + this.lineOffset, column: Math.max(0, offset - starts[lo]) + 1, message };
  }
}

/** Input the engine cannot read, at an offset in the tune's text. */
export class AbcInputError extends Error {
  constructor(
    readonly at: number,
    message: string,
  ) {
    super(message);
    this.name = "AbcInputError";
  }
}
