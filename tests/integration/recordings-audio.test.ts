// The "is it audio?" rule on its own (no database, no storage): recognised from the first bytes with
// file-type; WebM/Ogg/MP4 containers count only when the uploader declared an audio type.
import { describe, expect, it } from "vitest";
import { judgeAudio } from "@/lib/storage/audio";
import { pngBytes, wavBytes } from "./helpers/recordings-world";

// The start of a WebM file as Chrome's MediaRecorder writes it: an EBML header whose DocType is
// "webm", then the Segment element (Matroska/WebM: RFC 9559 §5.1 and the WebM container guidelines).
const WEBM = new Uint8Array([
  0x1a, 0x45, 0xdf, 0xa3, 0x9f, 0x42, 0x86, 0x81, 0x01, 0x42, 0xf7, 0x81, 0x01, 0x42, 0xf2, 0x81, 0x04, 0x42, 0xf3,
  0x81, 0x08, 0x42, 0x82, 0x84, 0x77, 0x65, 0x62, 0x6d, 0x42, 0x87, 0x81, 0x04, 0x42, 0x85, 0x81, 0x02, 0x18, 0x53,
  0x80, 0x67, 0x01, 0xff, 0xff, 0xff, 0xff, 0xff, 0xff, 0xff,
]);

// An Ogg page carrying an Opus identification header, as Firefox's MediaRecorder writes (RFC 3533 §6, RFC 7845 §5.1).
function oggOpus(): Uint8Array {
  const b = Buffer.alloc(80);
  b.write("OggS", 0, "ascii");
  b[5] = 2; // beginning of stream
  b[26] = 1; // one segment
  b[27] = 19; // of 19 bytes: the OpusHead packet
  b.write("OpusHead", 28, "ascii");
  return new Uint8Array(b);
}

describe("judgeAudio", () => {
  it("accepts a WAV by its RIFF/WAVE header whatever audio type was declared", async () => {
    expect(await judgeAudio(wavBytes(10), "audio/mpeg")).toEqual({ ok: true, contentType: "audio/wav" });
  });

  it("accepts a browser's WebM recording when an audio type was declared, stored as audio/webm", async () => {
    expect(await judgeAudio(WEBM, "audio/webm")).toEqual({ ok: true, contentType: "audio/webm" });
  });

  it("refuses the same WebM bytes declared as video", async () => {
    expect(await judgeAudio(WEBM, "video/webm")).toEqual({ ok: false, reason: "not an audio file" });
  });

  it("accepts Ogg Opus as audio by content", async () => {
    const verdict = await judgeAudio(oggOpus(), "audio/ogg");
    expect(verdict.ok && verdict.contentType.startsWith("audio/ogg")).toBe(true);
  });

  it("refuses an image and bytes of no known type, even under an audio type", async () => {
    expect(await judgeAudio(pngBytes(), "audio/wav")).toEqual({ ok: false, reason: "not an audio file" });
    expect(await judgeAudio(new TextEncoder().encode("just some words, not a recording"), "audio/wav")).toEqual({
      ok: false,
      reason: "not an audio file",
    });
  });
});
