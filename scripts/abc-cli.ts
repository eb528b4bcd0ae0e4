// Command line for teachers' bulk work and for checking the tune engine (issue 3 §8):
//   npm run -s abc -- <skeleton|stages|phrases|swap|embellishments> <file> [--lowest] [--skeleton]
//   npm run -s abc -- compare <file> <file2>
//   npm run -s abc -- listen <tune.abc> <recording> [--stage N] [--tempo BPM]   (./abc-cli-listen.ts)
// One tune in the file prints the shapes of issue 3 §8; several print one result per tune.
// Bad input: the problems on stderr as file:line:column: message, exit code 2.
import { readFileSync } from "node:fs";
import { analyze, splitTunes, type Analysis, type Problem } from "../lib/abc/index";
import { runCompare } from "./abc-cli-compare";
import { runListen } from "./abc-cli-listen";

const USAGE =
  "usage: npm run -s abc -- <skeleton|stages|phrases|swap|embellishments> <file> [--lowest] [--skeleton]\n" +
  "       npm run -s abc -- compare <file> <file2>\n" +
  "       npm run -s abc -- listen <tune.abc> <recording> [--stage N] [--tempo BPM]";

function fail(lines: string[]): never {
  process.stderr.write(lines.join("\n") + "\n");
  process.exit(2);
}

function read(file: string): string {
  try {
    return readFileSync(file, "utf8");
  } catch (e) {
    return fail([`${file}: cannot read the file (${e instanceof Error ? e.message : String(e)})`]);
  }
}

const report = (file: string, problems: Problem[]): string[] =>
  problems.map((p) => `${file}:${p.line}:${p.column}: ${p.message}`);

type Shape = (a: Analysis) => unknown;
const JSON_SHAPES: Record<string, Shape> = {
  stages: (a) => ({ stages: a.stages.map(({ index, name, kinds, abc }) => ({ index, name, kinds, abc })) }),
  phrases: (a) => a.phraseMap,
  embellishments: (a) => ({ embellishments: a.embellishments }),
};

function main(argv: string[]): void {
  if (argv[0] === "listen") return void runListen(argv.slice(1));
  const flags = new Set(argv.filter((a) => a.startsWith("--")));
  const [command, file, file2] = argv.filter((a) => !a.startsWith("--"));
  if (!command || !file) fail([USAGE]);
  if (command === "compare") {
    if (!file2) fail([USAGE]);
    const out = runCompare(read(file), read(file2));
    if (!out.ok) fail([...report(file, out.problems.a), ...report(file2, out.problems.b)]);
    process.stdout.write(JSON.stringify(out.value, null, 2) + "\n");
    return;
  }
  const text = read(file);
  if (!(command in JSON_SHAPES) && command !== "skeleton" && command !== "swap")
    fail([`unknown command "${command}"`, USAGE]);
  const tunes = splitTunes(text);
  if (tunes.length === 0) fail([`${file}:1:1: No tune found: a tune starts with an X: field and needs a K: field.`]);
  const problems: string[] = [];
  const results: { index: number; title: string; analysis: Analysis }[] = [];
  tunes.forEach((t, i) => {
    const r = analyze(t.abc, { lineOffset: t.lineOffset, doubleStop: flags.has("--lowest") ? "lowest" : "highest" });
    if (r.ok) results.push({ index: i + 1, title: r.value.title, analysis: r.value });
    else problems.push(...report(file, r.problems));
  });
  const shape = JSON_SHAPES[command];
  if (shape) {
    const value =
      tunes.length === 1 && results[0]
        ? shape(results[0].analysis)
        : { tunes: results.map((r) => ({ index: r.index, title: r.title, ...Object(shape(r.analysis)) })) };
    if (results.length) process.stdout.write(JSON.stringify(value, null, 2) + "\n");
  } else {
    const abc = results.map((r) =>
      command === "skeleton"
        ? r.analysis.skeleton.abc
        : flags.has("--skeleton")
          ? r.analysis.learningSkeleton
          : r.analysis.learning,
    );
    if (abc.length) process.stdout.write(abc.join("\n"));
  }
  if (problems.length) fail(problems);
}

main(process.argv.slice(2));
