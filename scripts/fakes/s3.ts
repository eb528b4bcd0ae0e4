// The local S3-compatible stand-in that npm start and npm test launch: the s3rver package (npm), which
// speaks S3's REST API and checks Signature V4 on presigned addresses, so the app's @aws-sdk/client-s3
// code runs unchanged against it. Loopback only. The bucket is private (no public-read policy); a
// browser reaches an object only through a presigned address, and CORS allows those cross-origin
// PUTs and GETs (the app runs on another port). Credentials: s3rver's fixed pair S3RVER / S3RVER.
import { mkdirSync } from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";
import S3rver from "s3rver";

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
  const server = new S3rver({
    port: options.port,
    address: "127.0.0.1",
    directory: options.directory,
    silent: true,
    configureBuckets: [{ name: options.bucket, configs: [CORS] }],
  });
  const { port } = await server.run();
  return { url: `http://127.0.0.1:${port}`, close: () => server.close() };
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
