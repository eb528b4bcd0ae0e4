// Is it audio? Decided from the file's first bytes with file-type (its magic-number tables), never
// from the name or the type the browser declared, which anyone can set.
import { fileTypeFromBuffer } from "file-type";

/** 25 MB in the binary sense (25·1024·1024 bytes), as the issue states it. */
export const MAX_RECORDING_BYTES = 25 * 1024 * 1024;
/** What file-type samples by default to recognise a type (file-type README: sampleSize, default 4100). */
export const SNIFF_BYTES = 4100;

// Containers that hold audio or video alike. By content alone a browser's recording is indistinguishable
// from a video: Chrome's MediaRecorder writes audio/webm (Opus in WebM), which file-type reports as
// video/webm; Safari's audio/mp4 can come back as video/mp4. So these pass only when the uploader
// declared an audio type, and the object is then stored as audio/<container>.
const AUDIO_CAPABLE_CONTAINERS: Record<string, string> = {
  "video/webm": "audio/webm",
  "video/ogg": "audio/ogg",
  "video/mp4": "audio/mp4",
};

export type AudioVerdict = { ok: true; contentType: string } | { ok: false; reason: string };

export async function judgeAudio(start: Uint8Array, declaredType: string): Promise<AudioVerdict> {
  const found = await fileTypeFromBuffer(start);
  if (!found) return { ok: false, reason: "not an audio file" };
  if (found.mime.startsWith("audio/")) return { ok: true, contentType: found.mime };
  const asAudio = AUDIO_CAPABLE_CONTAINERS[found.mime];
  if (asAudio && /^audio\//i.test(declaredType)) return { ok: true, contentType: asAudio };
  return { ok: false, reason: "not an audio file" };
}

export function megabytes(bytes: number): string {
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}
