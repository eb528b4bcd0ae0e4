// Storage that is not configured says which setting is missing, and the routes answer 503 with it.
import { afterEach, describe, expect, it, vi } from "vitest";

const KEYS = ["S3_ENDPOINT", "S3_ACCESS_KEY_ID", "S3_SECRET_ACCESS_KEY"] as const;
const saved = Object.fromEntries(KEYS.map((k) => [k, process.env[k]]));

afterEach(() => {
  for (const k of KEYS) {
    if (saved[k] === undefined) delete process.env[k];
    else process.env[k] = saved[k];
  }
  vi.resetModules();
});

describe("recording storage configuration", () => {
  it("names the missing S3 settings", async () => {
    vi.resetModules(); // env() and the client are read once per module instance
    process.env.DATABASE_URL ??= "postgres://unused@127.0.0.1/unused";
    delete process.env.S3_ENDPOINT;
    delete process.env.S3_SECRET_ACCESS_KEY;
    process.env.S3_ACCESS_KEY_ID = "AKIDEXAMPLE";
    const { storage, StorageConfigError } = await import("@/lib/storage/s3");
    expect(() => storage()).toThrow(StorageConfigError);
    expect(() => storage()).toThrow("S3_ENDPOINT, S3_SECRET_ACCESS_KEY are missing");
  });

  it("turns it into a 503 naming the setting, not a bare 500", async () => {
    vi.resetModules();
    process.env.DATABASE_URL ??= "postgres://unused@127.0.0.1/unused";
    for (const k of KEYS) delete process.env[k];
    const { withStorage } = await import("@/lib/storage/respond");
    const { storage } = await import("@/lib/storage/s3");
    await expect(withStorage(async () => storage())).rejects.toMatchObject({
      status: 503,
      message: expect.stringContaining("S3_ACCESS_KEY_ID"),
    });
  });
});
