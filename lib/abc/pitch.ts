// Sounding pitch of a written note: key signature, then accidentals carried to the end of the
// bar for the same pitch in the same octave (ABC 2.1 §4.2, from memory of the standard's text).
// The skeleton writer runs the same rules on its output, so a note whose accidental context
// changed (an accidental lived on a removed note) gets an explicit one.

const STEPS = [0, 2, 4, 5, 7, 9, 11];
const LETTERS = "CDEFGAB";

// Step within the octave of each letter's character code ("A" = 65 … "G" = 71, "a" = 97 …).
const STEP_OF_CODE = [5, 6, 0, 1, 2, 3, 4];

/** Staff position of a note name: C (middle C) = 0, c = 7, each ' +7, each , −7. */
export function staffPos(name: string): number {
  const code = name.charCodeAt(0);
  let pos = code >= 97 ? STEP_OF_CODE[code - 97] + 7 : (STEP_OF_CODE[code - 65] ?? -1);
  for (let i = 1; i < name.length; i++) {
    const ch = name.charCodeAt(i);
    pos += ch === 39 ? 7 : ch === 44 ? -7 : 0;
  }
  return pos;
}

export function naturalMidi(pos: number): number {
  const oct = Math.floor(pos / 7);
  return 60 + 12 * oct + STEPS[pos - oct * 7];
}

const LOWER = LETTERS.toLowerCase();
export function letterOf(pos: number): string {
  return LOWER[((pos % 7) + 7) % 7];
}

export const ACC_VALUE: Readonly<Record<string, number>> = { "^^": 2, "^": 1, "=": 0, _: -1, __: -2 };
const ACC_TEXT: Readonly<Record<number, string>> = { 2: "^^", 1: "^", 0: "=", [-1]: "_", [-2]: "__" };

export type KeyAcc = ReadonlyMap<string, number>; // lower-case letter → semitones

/** abcjs key.accidentals ([{acc:"sharp", note:"f"}]) → letter → semitones. */
export function keyAccOf(key: unknown): KeyAcc {
  const map = new Map<string, number>();
  const list: unknown = key && typeof key === "object" ? Reflect.get(key, "accidentals") : undefined;
  if (!Array.isArray(list)) return map;
  const values: Record<string, number> = { sharp: 1, flat: -1, natural: 0, dblsharp: 2, dblflat: -2 };
  for (const a of list) {
    const acc: unknown = Reflect.get(a, "acc");
    const note: unknown = Reflect.get(a, "note");
    if (typeof acc === "string" && typeof note === "string" && acc in values) map.set(note.toLowerCase(), values[acc]);
  }
  return map;
}

function stepsOf(key: KeyAcc): number[] {
  const steps: number[] = [];
  for (let i = 0; i < 7; i++) steps.push(key.get(LOWER[i]) ?? 0);
  return steps;
}

/** Accidentals in force in one bar of one voice. */
export class BarAccidentals {
  // Carried accidentals as parallel lists of staff position and semitones: a bar carries a few
  // at most, so a scan beats a map, and making one or clearing it costs next to nothing (this
  // runs for every note of every analysis).
  private carriedPos: number[] = [];
  private carriedVal: number[] = [];
  private keyAcc: KeyAcc;
  private keySteps: number[]; // the key's semitones by step (C = 0 … B = 6), read once per key
  constructor(key: KeyAcc) {
    this.keyAcc = key;
    this.keySteps = stepsOf(key);
  }
  get key(): KeyAcc {
    return this.keyAcc;
  }
  set key(k: KeyAcc) {
    if (k === this.keyAcc) return;
    this.keyAcc = k;
    this.keySteps = stepsOf(k);
  }
  reset(): void {
    if (this.carriedPos.length) {
      this.carriedPos.length = 0;
      this.carriedVal.length = 0;
    }
  }
  /** Sounding pitch of a note written with `acc` (may be "") at `pos`; records the accidental. */
  sound(pos: number, acc: string): number {
    const v = acc === "" ? undefined : ACC_VALUE[acc];
    if (v !== undefined) this.carry(pos, v);
    return naturalMidi(pos) + this.expected(pos);
  }
  expected(pos: number): number {
    const i = this.carriedPos.length ? this.carriedPos.indexOf(pos) : -1;
    return i >= 0 ? this.carriedVal[i] : this.keySteps[((pos % 7) + 7) % 7];
  }
  /** The accidental to write so that `pos` sounds `midi` here ("" when none is needed). */
  spell(pos: number, written: string, midi: number): string {
    if (written) {
      const v = ACC_VALUE[written];
      if (v !== undefined && naturalMidi(pos) + v === midi) return this.record(pos, written);
    } else if (naturalMidi(pos) + this.expected(pos) === midi) return "";
    const text = ACC_TEXT[midi - naturalMidi(pos)];
    return text === undefined ? written : this.record(pos, text);
  }
  private record(pos: number, text: string): string {
    this.carry(pos, ACC_VALUE[text]);
    return text;
  }
  private carry(pos: number, value: number): void {
    const i = this.carriedPos.indexOf(pos);
    if (i >= 0) this.carriedVal[i] = value;
    else {
      this.carriedPos.push(pos);
      this.carriedVal.push(value);
    }
  }
}
