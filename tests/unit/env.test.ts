import { describe, expect, it } from "vitest";
import { EnvError, parseEnv } from "@/lib/env";

describe("environment validation", () => {
  it("accepts a complete environment and fills defaults", () => {
    const env = parseEnv({ DATABASE_URL: "postgres://u:p@127.0.0.1:5432/db" });
    expect(env.APP_URL).toBe("http://127.0.0.1:3000");
    expect(env.NODE_ENV).toBe("development");
    expect(env.SCHOOL_NAME).toBe("Larchmoor Fiddle School"); // the demo school, when none is configured
  });

  it("reads the school's name and refuses an empty one", () => {
    const db = { DATABASE_URL: "postgres://u:p@127.0.0.1:5432/db" };
    expect(parseEnv({ ...db, SCHOOL_NAME: "  Hollin Bank Fiddle School " }).SCHOOL_NAME).toBe(
      "Hollin Bank Fiddle School",
    );
    expect(() => parseEnv({ ...db, SCHOOL_NAME: " " })).toThrow(/SCHOOL_NAME: must not be empty/);
  });

  it("names a missing DATABASE_URL", () => {
    expect(() => parseEnv({})).toThrow(EnvError);
    expect(() => parseEnv({})).toThrow(/DATABASE_URL: is missing/);
  });

  it("says what is wrong with a malformed value", () => {
    expect(() => parseEnv({ DATABASE_URL: "mysql://x" })).toThrow(/DATABASE_URL: must start with postgres:\/\//);
    expect(() => parseEnv({ DATABASE_URL: "postgres://x", APP_URL: "not a url" })).toThrow(
      /APP_URL: must be the app's public address/,
    );
  });
});
