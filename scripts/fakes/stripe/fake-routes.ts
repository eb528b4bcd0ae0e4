// The stand-in's own controls under /_fake/ (no API key: loopback only, used by the seed, tests and
// developers): health, the clock, what was sent, and importing objects for the demo school.
import type { Fake } from "./context";
import { invalidParam } from "./errors";
import { importObjects } from "./import";
import { runDue } from "./objects/lifecycle";
import { Params, parseForm } from "./params";
import type { Json, JsonObject } from "./types";
import { publicEvent } from "./webhooks";

function bodyParams(body: string): Params {
  const text = body.trim();
  if (text.startsWith("{"))
    return new Params(
      parseForm(
        new URLSearchParams(
          Object.entries(JSON.parse(text) as Record<string, string>).map(([k, v]) => [k, String(v)]),
        ).toString(),
      ),
    );
  return new Params(parseForm(text));
}

export function clockInfo(fake: Fake): JsonObject {
  const now = fake.clock.now();
  return { now, iso: new Date(now * 1000).toISOString(), offset_seconds: fake.store.clockOffset };
}

/** Moves the clock forward and runs, in time order, what became due (renewals, retries, period ends). */
export function advance(fake: Fake, seconds: number): JsonObject {
  if (!Number.isInteger(seconds) || seconds < 0)
    throw invalidParam("seconds", "seconds must be a whole number, 0 or more (the clock only moves forward).");
  fake.clock.advance(seconds);
  const ran = runDue(fake, fake.clock.now());
  fake.store.save();
  return { ...clockInfo(fake), ran };
}

export async function fakeRoutes(
  fake: Fake,
  method: string,
  path: string,
  body: string,
  query: URLSearchParams,
): Promise<JsonObject | null> {
  if (path === "/_fake/health") return { ok: true, now: fake.clock.now() };
  if (path === "/_fake/clock" && method === "GET") return clockInfo(fake);
  if (path === "/_fake/clock/advance" && method === "POST") {
    const seconds = bodyParams(body).int("seconds");
    if (seconds === undefined) throw invalidParam("seconds", "Missing required param: seconds.", "parameter_missing");
    const out = advance(fake, seconds);
    await fake.hooks.settled();
    return out;
  }
  if (path === "/_fake/events" && method === "GET") {
    const type = query.get("type");
    const events = fake.store.events.filter((e) => !type || e.type === type);
    const data: Json[] = events.map((e) => ({
      ...(publicEvent(e) as unknown as JsonObject),
      delivery: e.delivery as unknown as JsonObject,
    }));
    return { object: "list", data: data.reverse(), has_more: false, url: "/_fake/events" };
  }
  if (path === "/_fake/import" && method === "POST") {
    const counts = importObjects(fake, JSON.parse(body || "{}") as unknown);
    fake.store.save();
    return { imported: counts };
  }
  return null;
}
