// The one S3 client of the app (@aws-sdk/client-s3 with its presigner). It talks to whatever
// S3-compatible service S3_* names; nothing here knows which one. Objects are private: a browser
// reaches one only through a short-lived presigned address issued by lib/storage/recordings.ts.
import {
  CopyObjectCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { env } from "@/lib/env";

// Short lives, because a presigned address is a bearer credential: whoever holds it can use it until
// it expires, even after the person lost access. Five minutes covers starting a 25 MB upload on a slow
// line (S3 checks the expiry when the request starts, not when it ends — AWS S3 docs: "Sharing objects
// with presigned URLs"); ten minutes covers listening to a recording without the player's address
// running out mid-review (the player fetches a new one when it does).
export const PUT_URL_SECONDS = 5 * 60;
export const GET_URL_SECONDS = 10 * 60;

export class StorageConfigError extends Error {}

type StorageConfig = { client: S3Client; bucket: string };
let cached: StorageConfig | undefined;

/** The client and bucket from the environment; a missing setting is named in the error. */
export function storage(): StorageConfig {
  if (cached) return cached;
  const e = env();
  const missing = (["S3_ENDPOINT", "S3_ACCESS_KEY_ID", "S3_SECRET_ACCESS_KEY"] as const).filter((k) => !e[k]);
  if (missing.length) {
    throw new StorageConfigError(
      `Recording storage is not configured: ${missing.join(", ")} ${missing.length === 1 ? "is" : "are"} missing (see .env.example).`,
    );
  }
  const client = new S3Client({
    endpoint: e.S3_ENDPOINT,
    region: e.S3_REGION,
    forcePathStyle: e.S3_FORCE_PATH_STYLE === "true",
    credentials: { accessKeyId: e.S3_ACCESS_KEY_ID ?? "", secretAccessKey: e.S3_SECRET_ACCESS_KEY ?? "" },
    // Only checksums the operation requires: newer SDKs otherwise add CRC32 headers to presigned
    // PUTs that a browser cannot compute and several S3-compatible services do not accept.
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
  cached = { client, bucket: e.S3_BUCKET };
  return cached;
}

/** Whether the S3 settings are present (the worker skips its storage chores without them). */
export function storageConfigured(): boolean {
  try {
    storage();
    return true;
  } catch (e) {
    if (e instanceof StorageConfigError) return false;
    throw e;
  }
}

/**
 * A presigned PUT for one object. Content-Type and Content-Length are signed headers, so the
 * upload must declare exactly what was asked for (AWS Signature Version 4: signed headers).
 */
export async function presignPut(
  key: string,
  contentType: string,
  sizeBytes: number,
): Promise<{ url: string; headers: Record<string, string> }> {
  const { client, bucket } = storage();
  const command = new PutObjectCommand({
    Bucket: bucket,
    Key: key,
    ContentType: contentType,
    ContentLength: sizeBytes,
  });
  const url = await getSignedUrl(client, command, {
    expiresIn: PUT_URL_SECONDS,
    signableHeaders: new Set(["content-type", "content-length"]),
  });
  // The browser sets Content-Length itself from the body; only Content-Type is for the caller to send.
  return { url, headers: { "Content-Type": contentType } };
}

/**
 * A presigned GET answered with the checked type, and as an attachment: opened as a page it downloads
 * rather than renders, while an <audio> element plays it all the same (S3 API reference, GetObject:
 * response-content-type, response-content-disposition).
 */
export async function presignGet(key: string, contentType: string): Promise<string> {
  const { client, bucket } = storage();
  const command = new GetObjectCommand({
    Bucket: bucket,
    Key: key,
    ResponseContentType: contentType,
    ResponseContentDisposition: 'attachment; filename="recording"',
  });
  return getSignedUrl(client, command, { expiresIn: GET_URL_SECONDS });
}

/** A server-side copy with the type given here (S3 API reference, CopyObject: MetadataDirective REPLACE). */
export async function copyObject(from: string, to: string, contentType: string): Promise<void> {
  const { client, bucket } = storage();
  await client.send(
    new CopyObjectCommand({
      Bucket: bucket,
      // The source is "bucket/key", URL-encoded (S3 API reference, CopyObject: x-amz-copy-source).
      CopySource: `${bucket}/${key(from)}`,
      Key: to,
      MetadataDirective: "REPLACE",
      ContentType: contentType,
      ContentDisposition: 'attachment; filename="recording"',
    }),
  );
}

const key = (k: string) => k.split("/").map(encodeURIComponent).join("/");

/** Size and type as stored, or null when there is no such object. */
export async function headObject(key: string): Promise<{ sizeBytes: number; contentType: string | undefined } | null> {
  const { client, bucket } = storage();
  try {
    const head = await client.send(new HeadObjectCommand({ Bucket: bucket, Key: key }));
    return { sizeBytes: head.ContentLength ?? 0, contentType: head.ContentType };
  } catch (e) {
    if (isMissing(e)) return null;
    throw e;
  }
}

/** The first `count` bytes (fewer when the object is shorter): a Range request (RFC 9110 §14.2). */
export async function readStart(key: string, count: number): Promise<Uint8Array> {
  const { client, bucket } = storage();
  const res = await client.send(new GetObjectCommand({ Bucket: bucket, Key: key, Range: `bytes=0-${count - 1}` }));
  if (!res.Body) return new Uint8Array();
  const bytes = await res.Body.transformToByteArray();
  // A service that ignores Range sends everything; only the start is wanted.
  return bytes.length > count ? bytes.subarray(0, count) : bytes;
}

/** The whole object (a recording, at most 25 MB), for the listening aid's job. */
export async function readObject(key: string): Promise<Uint8Array> {
  const { client, bucket } = storage();
  const res = await client.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
  return res.Body ? res.Body.transformToByteArray() : new Uint8Array();
}

export async function deleteObject(key: string): Promise<void> {
  const { client, bucket } = storage();
  await client.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));
}

// HEAD answers carry no body, so "not found" shows only as the status (AWS S3 API reference: HeadObject).
function isMissing(e: unknown): boolean {
  if (!(e instanceof S3ServiceException)) return false;
  return e.$metadata.httpStatusCode === 404 || e.name === "NotFound" || e.name === "NoSuchKey";
}
