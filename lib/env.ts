import { z } from "zod";

// Every setting the app reads, validated once. A missing or malformed value stops start-up with its name.
const schema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  DATABASE_URL: z
    .string({ error: "is missing (a postgres:// address of the database)" })
    .regex(/^postgres(ql)?:\/\//, "must start with postgres:// or postgresql://"),
  APP_URL: z.url({ error: "must be the app's public address, e.g. http://127.0.0.1:3000" }).default("http://127.0.0.1:3000"),
  // When true the session cookie is sent over plain http (local development and tests only).
  INSECURE_COOKIES: z.enum(["true", "false"]).default("false"),
  // E-mail. Only the worker sends, so the key may be absent for the web app; the worker checks it at start.
  RESEND_API_KEY: z.string().min(1, "must not be empty (a Resend API key, re_…)").optional(),
  RESEND_BASE_URL: z.url({ error: "must be the Resend API's address, e.g. https://api.resend.com" }).optional(),
  MAIL_FROM: z
    .string()
    .regex(/^(?:[^<>]+<[^<>\s@]+@[^<>\s@]+>|[^<>\s@]+@[^<>\s@]+)$/, 'must be an address or "Name <address>"')
    .default("Rosinwood <hello@rosinwood.test>"),
  // Set only while the local Resend stand-in runs: turns on the /dev/mail page that reads its messages.
  RESEND_FAKE_URL: z.url({ error: "must be the local Resend stand-in's address, e.g. http://127.0.0.1:4010" }).optional(),
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
