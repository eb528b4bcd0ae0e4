// Signature Version 4 checking for the S3 stand-in. s3rver accepts any V4 signature and anonymous
// requests ("Signature version 4 calculation is unimplemented" in its authentication middleware), so
// on its own it could not show that objects are private or that presigned addresses expire. This check,
// run before s3rver sees a request, refuses what S3 refuses: no signature (the bucket is
// private), a wrong signature (including a changed signed header such as Content-Type or
// Content-Length) and an expired presigned address. Written here because no npm package verifies
// SigV4 server-side; the algorithm is AWS's published one (AWS S3 API reference: "Authenticating
// Requests (AWS Signature Version 4)").
import { createHash, createHmac, timingSafeEqual } from "node:crypto";
import type { IncomingMessage, ServerResponse } from "node:http";

const hmac = (key: Buffer | string, data: string) => createHmac("sha256", key).update(data, "utf8").digest();
const sha256hex = (data: string) => createHash("sha256").update(data, "utf8").digest("hex");
// RFC 3986 unreserved characters stay; everything else is percent-encoded (SigV4's UriEncode).
const uriEncode = (s: string) =>
  encodeURIComponent(s).replace(/[!'()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);

type Parsed = {
  accessKeyId: string;
  scope: string[];
  signedHeaders: string[];
  signature: string;
  amzDate: string;
  payloadHash: string;
  expires?: number;
};

function parse(req: IncomingMessage, query: URLSearchParams): Parsed | null {
  const header = req.headers.authorization;
  if (query.get("X-Amz-Algorithm") === "AWS4-HMAC-SHA256") {
    const credential = (query.get("X-Amz-Credential") ?? "").split("/");
    return {
      accessKeyId: credential[0],
      scope: credential.slice(1),
      signedHeaders: (query.get("X-Amz-SignedHeaders") ?? "").split(";"),
      signature: query.get("X-Amz-Signature") ?? "",
      amzDate: query.get("X-Amz-Date") ?? "",
      payloadHash: "UNSIGNED-PAYLOAD",
      expires: Number(query.get("X-Amz-Expires") ?? "0"),
    };
  }
  const m =
    header && /^AWS4-HMAC-SHA256 Credential=([^,]+),\s*SignedHeaders=([^,]+),\s*Signature=([0-9a-f]+)$/.exec(header);
  if (!m) return null;
  const credential = m[1].split("/");
  return {
    accessKeyId: credential[0],
    scope: credential.slice(1),
    signedHeaders: m[2].split(";"),
    signature: m[3],
    amzDate: String(req.headers["x-amz-date"] ?? ""),
    payloadHash: String(req.headers["x-amz-content-sha256"] ?? "UNSIGNED-PAYLOAD"),
  };
}

function canonicalRequest(
  req: IncomingMessage,
  method: string,
  path: string,
  query: URLSearchParams,
  p: Parsed,
): string {
  const pairs = [...query.entries()]
    .filter(([k]) => k !== "X-Amz-Signature")
    .map(([k, v]) => [uriEncode(k), uriEncode(v)]);
  pairs.sort(([a, av], [b, bv]) => (a < b ? -1 : a > b ? 1 : av < bv ? -1 : av > bv ? 1 : 0));
  const headers = p.signedHeaders.map((name) => {
    const raw = req.headers[name];
    const value = Array.isArray(raw) ? raw.join(",") : (raw ?? "");
    return `${name}:${value.trim().replace(/\s+/g, " ")}\n`;
  });
  return [
    method,
    path,
    pairs.map(([k, v]) => `${k}=${v}`).join("&"),
    headers.join(""),
    p.signedHeaders.join(";"),
    p.payloadHash,
  ].join("\n");
}

/** "20261202T023544Z" → epoch ms. */
function amzTime(s: string): number {
  const m = /^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z$/.exec(s);
  return m ? Date.UTC(+m[1], +m[2] - 1, +m[3], +m[4], +m[5], +m[6]) : NaN;
}

/** Why the request is refused, or null when its signature holds. */
export function sigV4Problem(req: IncomingMessage, secrets: Record<string, string>, now = Date.now()): string | null {
  const url = new URL(req.url ?? "/", "http://stand-in");
  const p = parse(req, url.searchParams);
  if (!p) return "Access Denied (the bucket is private; requests must be signed)";
  const secret = secrets[p.accessKeyId];
  if (!secret) return "The AWS Access Key Id you provided does not exist in our records.";
  const [date, region, service, terminal] = p.scope;
  const signedAt = amzTime(p.amzDate);
  if (Number.isNaN(signedAt) || terminal !== "aws4_request" || p.amzDate.slice(0, 8) !== date)
    return "The credential scope is malformed.";
  if (p.expires !== undefined && now > signedAt + p.expires * 1000) return "Request has expired";
  const method = req.method ?? "GET";
  const path = (req.url ?? "/").split("?")[0];
  const stringToSign = [
    "AWS4-HMAC-SHA256",
    p.amzDate,
    p.scope.join("/"),
    sha256hex(canonicalRequest(req, method, path, url.searchParams, p)),
  ].join("\n");
  const key = hmac(hmac(hmac(hmac(`AWS4${secret}`, date), region), service), "aws4_request");
  const expected = Buffer.from(createHmac("sha256", key).update(stringToSign, "utf8").digest("hex"));
  const given = Buffer.from(p.signature);
  if (given.length !== expected.length || !timingSafeEqual(given, expected))
    return "The request signature we calculated does not match the signature you provided.";
  return null;
}

/**
 * Answers the request with S3's 403 when its signature does not hold; returns true when it did.
 * CORS preflights (OPTIONS) pass: browsers send them without credentials by design (Fetch Standard §3.2.3).
 */
export function refuseUnsigned(req: IncomingMessage, res: ServerResponse, secrets: Record<string, string>): boolean {
  if (req.method === "OPTIONS") return false;
  const problem = sigV4Problem(req, secrets);
  if (!problem) return false;
  const code = problem.startsWith("The request signature")
    ? "SignatureDoesNotMatch"
    : problem.startsWith("The AWS Access")
      ? "InvalidAccessKeyId"
      : "AccessDenied";
  // Answer only after an upload's body is read: answering mid-upload lets the client see a reset
  // connection instead of the 403.
  req.on("end", () => {
    // Access-Control-Allow-Origin so a browser's cross-origin request can read why it was refused.
    res.writeHead(403, { "content-type": "application/xml", "access-control-allow-origin": "*" });
    res.end(`<?xml version="1.0" encoding="UTF-8"?>\n<Error><Code>${code}</Code><Message>${problem}</Message></Error>`);
  });
  req.resume();
  return true;
}
