// `npm run -s abc -- listen <tune.abc> <recording> [--stage N] [--tempo BPM]`: the listening aid on
// the command line. Prints the result as JSON (bars numbered as the phrase map numbers them, pickup 0).
// Exit 2 with a message on stderr for a tune or recording that cannot be read.
import { readFileSync } from "node:fs";
import { analyze, splitTunes } from "../lib/abc/index";
import { listenTo, UnreadableAudio, UnreadableTune } from "../lib/listen/index";

const USAGE = "usage: npm run -s abc -- listen <tune.abc> <recording> [--stage N] [--tempo BPM]  (stage 1 by default)";

function fail(message: string): never {
  process.stderr.write(message + "\n");
  process.exit(2);
}

function option(argv: string[], name: string): number | null {
  const i = argv.indexOf(name);
  if (i < 0) return null;
  const value = Number(argv[i + 1]);
  if (!Number.isFinite(value) || value <= 0)
    fail(`${name} needs a positive number, not "${argv[i + 1] ?? ""}"\n${USAGE}`);
  return value;
}

export async function runListen(argv: string[]): Promise<void> {
  const stageIndex = option(argv, "--stage") ?? 1;
  const tempo = option(argv, "--tempo");
  const files = argv.filter((a, i) => !a.startsWith("--") && !["--stage", "--tempo"].includes(argv[i - 1] ?? ""));
  const [tuneFile, recording] = files;
  if (!tuneFile || !recording) fail(USAGE);
  let text: string;
  try {
    text = readFileSync(tuneFile, "utf8");
  } catch (e) {
    fail(`${tuneFile}: cannot read the file (${e instanceof Error ? e.message : String(e)})`);
  }
  const [tune] = splitTunes(text);
  if (!tune) fail(`${tuneFile}:1:1: No tune found: a tune starts with an X: field and needs a K: field.`);
  const analysis = analyze(tune.abc, { lineOffset: tune.lineOffset });
  if (!analysis.ok) fail(analysis.problems.map((p) => `${tuneFile}:${p.line}:${p.column}: ${p.message}`).join("\n"));
  const stage = analysis.value.stages.find((s) => s.index === stageIndex);
  if (!stage) fail(`${tuneFile}: the tune has stages 1 to ${analysis.value.stages.length}, not ${stageIndex}`);
  try {
    const result = await listenTo(stage.abc, recording, { tempo: tempo ?? undefined });
    process.stdout.write(JSON.stringify(result, null, 2) + "\n");
  } catch (e) {
    if (e instanceof UnreadableAudio) fail(`${recording}: ${e.message}`);
    if (e instanceof UnreadableTune) fail(`${tuneFile}: ${e.message}`);
    fail(`${recording}: ${e instanceof Error ? e.message : String(e)}`);
  }
}
