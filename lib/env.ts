import { z } from "zod";

// Every setting the app reads, validated once. A missing or malformed value stops start-up with its name.
const schema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  DATABASE_URL: z
    .string({ error: "is missing (a postgres:// address of the database)" })
    .regex(/^postgres(ql)?:\/\//, "must start with postgres:// or postgresql://"),
  APP_URL: z
    .url({ error: "must be the app's public address, e.g. http://127.0.0.1:3000" })
    .default("http://127.0.0.1:3000"),
  // When true the session cookie is sent over plain http (local development and tests only).
  INSECURE_COOKIES: z.enum(["true", "false"]).default("false"),
  // How many proxies in front of the app append to X-Forwarded-For; the client's address is the entry that
  // many places before the last (the last is the socket's, added by scripts/serve-worker.mjs). 0: no proxy,
  // the socket's address; anything the client wrote itself is never trusted.
  TRUSTED_PROXIES: z.coerce
    .number({ error: "must be a whole number of proxies from 0 to 10" })
    .int("must be a whole number of proxies from 0 to 10")
    .min(0, "must be a whole number of proxies from 0 to 10")
    .max(10, "must be a whole number of proxies from 0 to 10")
    .default(0),
  // E-mail. Only the worker sends, so the key may be absent for the web app; the worker checks it at start.
  RESEND_API_KEY: z.string().min(1, "must not be empty (a Resend API key, re_…)").optional(),
  RESEND_BASE_URL: z.url({ error: "must be the Resend API's address, e.g. https://api.resend.com" }).optional(),
  MAIL_FROM: z
    .string()
    .regex(/^(?:[^<>]+<[^<>\s@]+@[^<>\s@]+>|[^<>\s@]+@[^<>\s@]+)$/, 'must be an address or "Name <address>"')
    .default("Rosinwood <hello@rosinwood.test>"),
  // Set only while the local Resend stand-in runs: turns on the /dev/mail page that reads its messages.
  RESEND_FAKE_URL: z
    .url({ error: "must be the local Resend stand-in's address, e.g. http://127.0.0.1:4010" })
    .optional(),
  // Recordings: S3-compatible object storage through @aws-sdk/client-s3. npm start / npm test point these at the
  // local stand-in (scripts/fakes/s3.ts); lib/storage says which one is missing when an upload is attempted.
  S3_ENDPOINT: z.url({ error: "must be the storage's address, e.g. https://s3.eu-west-2.amazonaws.com" }).optional(),
  S3_REGION: z.string().min(1).default("us-east-1"),
  S3_BUCKET: z
    .string()
    .regex(
      /^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/,
      "must be a bucket name (3–63 lower-case letters, digits, dots, hyphens)",
    )
    .default("rosinwood-recordings"),
  S3_ACCESS_KEY_ID: z.string().min(1, "must not be empty").optional(),
  S3_SECRET_ACCESS_KEY: z.string().min(1, "must not be empty").optional(),
  // Path-style addresses (http://host/bucket/key): what most S3-compatible services, and the stand-in, expect.
  S3_FORCE_PATH_STYLE: z.enum(["true", "false"]).default("true"),
  // Memberships: Stripe through the official SDK. STRIPE_API_BASE is unset for the real service.
  STRIPE_SECRET_KEY: z
    .string()
    .regex(/^(sk|rk)_(test|live)_/, "must be a Stripe secret key (sk_test_… or sk_live_…)")
    .optional(),
  STRIPE_API_BASE: z.url({ error: "must be the Stripe API's address, e.g. https://api.stripe.com" }).optional(),
  STRIPE_WEBHOOK_SECRET: z
    .string()
    .regex(/^whsec_/, "must be a webhook signing secret (whsec_…)")
    .optional(),
  // The school's name on receipts and e-mails; the default is the invented demo school's.
  SCHOOL_NAME: z
    .string()
    .trim()
    .min(1, "must not be empty (the school's name, e.g. Larchmoor Fiddle School)")
    .max(80, "must be at most 80 characters")
    .default("Larchmoor Fiddle School"),
  // Set only while the local Stripe stand-in runs: turns on the /dev/stripe page (its clock) for the demo.
  STRIPE_FAKE_URL: z
    .url({ error: "must be the local Stripe stand-in's address, e.g. http://127.0.0.1:4020" })
    .optional(),
});

export type Env = z.infer<typeof schema>;

export class EnvError extends Error {}

export function parseEnv(source: Record<string, string | undefined>): Env {
  const result = schema.safeParse(source);
  if (!result.success) {
    const lines = result.error.issues.map((i) => `  ${i.path.join(".") || "(environment)"}: ${i.message}`);
    throw new EnvError(`Rosinwood cannot start: the environment is not right.\n${lines.join("\n")}\nSee .env.example.`);
  }
  return result.data;
}

let cached: Env | undefined;
export function env(): Env {
  cached ??= parseEnv(process.env);
  return cached;
}
