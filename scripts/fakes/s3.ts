// The local S3-compatible stand-in that npm start and npm test launch: the s3rver package (npm), which
// speaks S3's REST API, so the app's @aws-sdk/client-s3 code runs unchanged against it. s3rver itself
// accepts anonymous and wrongly signed V4 requests, so every request first passes the Signature V4
// check in ./s3-sigv4.ts: the bucket is private, and a browser reaches an object only through an
// unexpired presigned address. CORS allows those cross-origin PUTs and GETs (the app runs on another
// port). Loopback only. Credentials: s3rver's fixed pair S3RVER / S3RVER.
import { mkdirSync } from "node:fs";
import { createServer } from "node:http";
import type { AddressInfo } from "node:net";
import path from "node:path";
import { pathToFileURL } from "node:url";
import S3rver from "s3rver";
import { refuseUnsigned } from "./s3-sigv4";

// s3rver's built-in account (its models/account.js); the app's S3_ACCESS_KEY_ID / S3_SECRET_ACCESS_KEY.
const SECRETS = { S3RVER: "S3RVER" };

// S3's CORS configuration document (AWS S3 API reference, PutBucketCors).
const CORS = `<CORSConfiguration>
  <CORSRule>
    <AllowedOrigin>*</AllowedOrigin>
    <AllowedMethod>GET</AllowedMethod>
    <AllowedMethod>HEAD</AllowedMethod>
    <AllowedMethod>PUT</AllowedMethod>
    <AllowedHeader>*</AllowedHeader>
    <ExposeHeader>ETag</ExposeHeader>
    <MaxAgeSeconds>600</MaxAgeSeconds>
  </CORSRule>
</CORSConfiguration>`;

export async function startS3Fake(options: { port: number; directory: string; bucket: string }) {
  mkdirSync(options.directory, { recursive: true });
  const s3rver = new S3rver({
    directory: options.directory,
    silent: true,
    configureBuckets: [{ name: options.bucket, configs: [CORS] }],
  });
  await s3rver.configureBuckets();
  // Our own listener in front of s3rver's request handler, so the signature check runs first.
  const handle = s3rver.callback();
  const server = createServer((req, res) => {
    if (!refuseUnsigned(req, res, SECRETS)) handle(req, res);
  });
  await new Promise<void>((resolve, reject) =>
    server.once("error", reject).listen(options.port, "127.0.0.1", () => resolve()),
  );
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const port = Number(process.env.S3_FAKE_PORT ?? 4568);
  const directory = path.resolve(process.env.S3_FAKE_DIR ?? ".data/s3");
  const bucket = process.env.S3_BUCKET ?? "rosinwood-recordings";
  startS3Fake({ port, directory, bucket }).then(
    (s) => console.log(`S3 stand-in (s3rver) on ${s.url}, bucket ${bucket}, files in ${directory}`),
    (error: unknown) => {
      console.error(`the S3 stand-in could not start: ${error instanceof Error ? error.message : String(error)}`);
      process.exit(1);
    },
  );
}
