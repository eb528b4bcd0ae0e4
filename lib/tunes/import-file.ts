// The uploaded file before any tune is read (issue 5 item 3): its size, encoding and tune count,
// each refused with a message that says what to do. Pure apart from reading the request body.
import { splitTunes, type TuneText } from "@/lib/abc/split";
import { HttpError, unprocessable } from "@/lib/auth/errors";

import { IMPORT_FILE_NAME, IMPORT_MAX_BYTES, IMPORT_MAX_TUNES } from "./import-limits";

export { IMPORT_FILE_NAME, IMPORT_MAX_BYTES, IMPORT_MAX_TUNES };

const MB = (n: number): string => `${(n / 1024 / 1024).toFixed(n % (1024 * 1024) === 0 ? 0 : 1)} MB`;

export const tooBig = (bytes?: number): HttpError =>
  new HttpError(
    413,
    `${bytes ? `This file is ${MB(bytes)}; ` : "This file is too big; "}the most one import takes is ${MB(IMPORT_MAX_BYTES)}. Split it into smaller files.`,
  );

/** The body as text, stopping as soon as it passes the limit instead of holding an endless upload. */
export async function readUpload(req: Request, maxBytes = IMPORT_MAX_BYTES): Promise<string> {
  const declared = Number(req.headers.get("content-length") ?? "0");
  if (declared > maxBytes) throw tooBig(declared);
  if (!req.body) throw unprocessable("The file is empty.");
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > maxBytes) {
      await reader.cancel();
      throw tooBig();
    }
    chunks.push(value);
  }
  return decodeText(Buffer.concat(chunks));
}

/** ABC files are plain text (ABC 2.1 §2.1 recommends UTF-8); anything else is refused, not guessed at. */
export function decodeText(bytes: Uint8Array): string {
  if (bytes.byteLength === 0) throw unprocessable("The file is empty.");
  if (bytes.includes(0)) throw unprocessable("This is not a text file. Choose a .abc file saved as plain text.");
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes).replace(/^\uFEFF/, "");
  } catch {
    throw unprocessable("This file is not UTF-8 text. Save it as UTF-8 (plain text) and try again.");
  }
}

/** The tunes of a file, or a message when there are none or too many. */
export function tunesOfFile(text: string): TuneText[] {
  const tunes = splitTunes(text);
  if (tunes.length === 0)
    throw unprocessable("No tunes found: each tune in an ABC file starts with an X: line and has a K: line.");
  if (tunes.length > IMPORT_MAX_TUNES) {
    throw unprocessable(
      `This file holds ${tunes.length} tunes; the most one import takes is ${IMPORT_MAX_TUNES}. Split it into smaller files.`,
    );
  }
  return tunes;
}
