// A file of many tunes → one text per tune, remembering where each starts so problems can point
// at the line of the whole file. ABC 2.1 §2.2: a tune starts at an X: field and ends at the
// first empty line (or the end of the file); text between tunes is free text and is skipped.

export interface TuneText {
  abc: string;
  /** Lines before this tune in the file (add to a 1-based line inside the tune). */
  lineOffset: number;
  /** Characters before this tune in the file. */
  charOffset: number;
}

export function splitTunes(file: string): TuneText[] {
  const text = file.replace(/\r\n?/g, "\n");
  const lines = text.split("\n");
  const tunes: TuneText[] = [];
  let char = 0;
  let start = -1;
  let startChar = 0;
  const close = (end: number): void => {
    if (start < 0) return;
    tunes.push({ abc: lines.slice(start, end).join("\n") + "\n", lineOffset: start, charOffset: startChar });
    start = -1;
  };
  lines.forEach((line, i) => {
    if (start < 0 && /^X:/.test(line)) {
      start = i;
      startChar = char;
    } else if (start >= 0 && line.trim() === "") close(i);
    char += line.length + 1;
  });
  close(lines.length);
  // A lone tune without X: (a teacher pasting one tune) is still a tune when it has a K: field.
  if (tunes.length === 0 && /^K:/m.test(text)) tunes.push({ abc: text, lineOffset: 0, charOffset: 0 });
  return tunes;
}
