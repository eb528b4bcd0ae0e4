// How a tune is named in lists: its title, then its type and key in plain words.
const MODES: Record<string, string> = {
  m: "minor",
  min: "minor",
  dor: "Dorian",
  mix: "Mixolydian",
  maj: "major",
  "": "major",
};

/** "G", "Am", "Ador" → "G major", "A minor", "A Dorian" (ABC 2.1 §3.1.14 key names). */
export function keyWords(key: string): string {
  const m = /^([A-G][#b]?)\s*([a-zA-Z]*)/.exec(key.trim());
  if (!m) return key;
  const mode = MODES[m[2].toLowerCase().slice(0, 3)] ?? MODES[m[2].toLowerCase()] ?? m[2];
  return `${m[1].replace("#", "♯").replace("b", "♭")} ${mode}`;
}

export function tuneWords(t: { tuneType: string; tuneKey: string }): string {
  const type = t.tuneType === "other" ? "tune" : t.tuneType;
  return t.tuneKey ? `${type} in ${keyWords(t.tuneKey)}` : type;
}
