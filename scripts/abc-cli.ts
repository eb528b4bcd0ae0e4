// Command line for teachers' bulk work and for checking the tune engine:
//   npm run -s abc -- <skeleton|stages|phrases|swap|embellishments|doublestops> <file> [--highest|--lowest] [--skeleton]
//   npm run -s abc -- compare <file> <file2>
//   npm run -s abc -- listen <tune.abc> <recording> [--stage N] [--tempo BPM]   (./abc-cli-listen.ts)
// One tune in the file prints its result; several print one result per tune. A tune the engine
// refuses prints its problems on stderr as file:line:column: message and the exit code is 2;
// notes (the tune is read, but something deserves a look) go to stderr as file:line:column: note:
// message, with exit code 0. Each command is one entry of COMMANDS.
import { readFileSync } from "node:fs";
import { analyze, splitTunes, type Analysis, type Problem } from "../lib/abc/index";
import { runCompare } from "./abc-cli-compare";
import { runListen } from "./abc-cli-listen";

type Command =
  | {
      usage: string;
      /** Runs on the non-flag arguments; returns the problems and notes, already as file:line:column lines. */
      run: (args: string[], flags: ReadonlySet<string>) => { problems: string[]; notes: string[] } | null;
    }
  | {
      usage: string;
      /** Reads its own arguments (options with values) and does its own output and exit code. */
      raw: (argv: string[]) => void | Promise<void>;
    };

const report = (file: string, list: readonly Problem[], kind = ""): string[] =>
  list.map((p) => `${file}:${p.line}:${p.column}: ${kind}${p.message}`);

function read(file: string): string {
  try {
    return readFileSync(file, "utf8");
  } catch (e) {
    fail([`${file}: cannot read the file (${e instanceof Error ? e.message : String(e)})`]);
  }
}

function fail(lines: string[]): never {
  process.stderr.write(lines.join("\n") + "\n");
  process.exit(2);
}

type Shape = (a: Analysis) => unknown;

/** Every tune of a file analysed; `shape` prints one result (JSON), or `text` prints ABC. */
function perTune(shape: Shape | null, text: ((a: Analysis, flags: ReadonlySet<string>) => string) | null): Command {
  return {
    usage: "<file>",
    run: ([file], flags) => {
      if (!file) return null;
      const tunes = splitTunes(read(file));
      if (tunes.length === 0)
        return {
          problems: [`${file}:1:1: No tune found: a tune starts with an X: field and needs a K: field.`],
          notes: [],
        };
      const problems: string[] = [];
      const notes: string[] = [];
      const results: { index: number; title: string; analysis: Analysis }[] = [];
      const doubleStop = flags.has("--lowest") ? "lowest" : flags.has("--highest") ? "highest" : undefined;
      tunes.forEach((t, i) => {
        const r = analyze(t.abc, { lineOffset: t.lineOffset, doubleStop });
        notes.push(...report(file, r.notes, "note: "));
        if (r.ok) results.push({ index: i + 1, title: r.value.title, analysis: r.value });
        else problems.push(...report(file, r.problems));
      });
      if (shape && results.length) {
        const value =
          tunes.length === 1 && results[0]
            ? shape(results[0].analysis)
            : { tunes: results.map((r) => ({ index: r.index, title: r.title, ...Object(shape(r.analysis)) })) };
        process.stdout.write(JSON.stringify(value, null, 2) + "\n");
      }
      if (text && results.length) process.stdout.write(results.map((r) => text(r.analysis, flags)).join("\n"));
      return { problems, notes };
    },
  };
}

const COMMANDS: Record<string, Command> = {
  skeleton: perTune(null, (a) => a.skeleton.abc),
  stages: perTune(
    // merged: the default plan's stages taken into this one (the tune has none of their kinds)
    (a) => ({ stages: a.stages.map(({ index, name, kinds, merged, abc }) => ({ index, name, kinds, merged, abc })) }),
    null,
  ),
  phrases: perTune((a) => a.phraseMap, null),
  embellishments: perTune((a) => ({ embellishments: a.embellishments }), null),
  doublestops: perTune(
    (a) => ({
      doubleStops: a.doubleStops.map(({ bar, part, keptName, otherName, reason }) => ({
        bar,
        part,
        keeps: keptName,
        leaves: otherName,
        reason,
      })),
    }),
    null,
  ),
  swap: perTune(null, (a, flags) => (flags.has("--skeleton") ? a.learningSkeleton : a.learning)),
  compare: {
    usage: "<file> <file2>",
    run: ([file, file2]) => {
      if (!file || !file2) return null;
      const out = runCompare(read(file), read(file2));
      const notes = [...report(file, out.notes.a, "note: "), ...report(file2, out.notes.b, "note: ")];
      if (!out.ok) return { problems: [...report(file, out.problems.a), ...report(file2, out.problems.b)], notes };
      process.stdout.write(JSON.stringify(out.value, null, 2) + "\n");
      return { problems: [], notes };
    },
  },
  listen: { usage: "<tune.abc> <recording> [--stage N] [--tempo BPM]", raw: runListen },
};

const usage = (): string =>
  Object.entries(COMMANDS)
    .map(([name, c], i) => `${i === 0 ? "usage:" : "      "} npm run -s abc -- ${name} ${c.usage}`)
    .join("\n") +
  "\n       options: --highest | --lowest (the upper or lower note of every double stop, instead of reading each), --skeleton (swap)";

function main(argv: string[]): void {
  const flags = new Set(argv.filter((a) => a.startsWith("--")));
  const [name, ...args] = argv.filter((a) => !a.startsWith("--"));
  const command = name === undefined ? undefined : COMMANDS[name];
  if (!command) fail([name ? `unknown command "${name}"` : "no command given", usage()]);
  if ("raw" in command) return void command.raw(argv.slice(argv.indexOf(name as string) + 1));
  const out = command.run(args, flags);
  if (out === null) fail([usage()]);
  if (out.notes.length) process.stderr.write(out.notes.join("\n") + "\n");
  if (out.problems.length) fail(out.problems);
}

main(process.argv.slice(2));
