import { describe, expect, it } from "vitest";
import { clientIp } from "@/lib/auth/context";
import { parseEnv } from "@/lib/env";
import { withPeer } from "@/scripts/peer-address.mjs";

const xff = (value?: string) => new Headers(value === undefined ? {} : { "x-forwarded-for": value });

describe("the client address for per-IP limits", () => {
  it("is the socket's address without a trusted proxy, whatever the client wrote", () => {
    // What scripts/serve-worker.mjs hands the app when a client sent its own header straight to it.
    const forged = withPeer("203.0.113.9, 198.51.100.7", "127.0.0.1");
    expect(forged).toBe("203.0.113.9, 198.51.100.7, 127.0.0.1");
    expect(clientIp(xff(forged), 0)).toBe("127.0.0.1");
    expect(clientIp(xff(withPeer(undefined, "::ffff:192.0.2.44")), 0)).toBe("192.0.2.44");
    expect(clientIp(xff(withPeer(["198.51.100.1", "198.51.100.2"], "2001:db8::1")), 0)).toBe("2001:db8::1");
  });

  it("is the entry the nearest trusted proxy appended, and never one further left", () => {
    // Client 198.51.100.7 → proxy (appends it) → the app's socket sees the proxy at 10.0.0.2.
    const chain = withPeer("203.0.113.9, 198.51.100.7", "10.0.0.2");
    expect(clientIp(xff(chain), 1)).toBe("198.51.100.7");
    expect(clientIp(xff(withPeer("198.51.100.7, 10.0.0.3", "10.0.0.2")), 2)).toBe("198.51.100.7");
    // More proxies configured than entries: the left-most, not nothing.
    expect(clientIp(xff(withPeer(undefined, "10.0.0.2")), 3)).toBe("10.0.0.2");
    expect(clientIp(xff(), 0)).toBe("unknown");
  });

  it("reads TRUSTED_PROXIES from the environment, 0 by default, and names a bad value", () => {
    const base = { DATABASE_URL: "postgres://u:p@127.0.0.1:5432/db" };
    expect(parseEnv(base).TRUSTED_PROXIES).toBe(0);
    expect(parseEnv({ ...base, TRUSTED_PROXIES: "2" }).TRUSTED_PROXIES).toBe(2);
    expect(() => parseEnv({ ...base, TRUSTED_PROXIES: "-1" })).toThrow(/TRUSTED_PROXIES: must be a whole number/);
    expect(() => parseEnv({ ...base, TRUSTED_PROXIES: "one" })).toThrow(/TRUSTED_PROXIES: must be a whole number/);
  });
});
