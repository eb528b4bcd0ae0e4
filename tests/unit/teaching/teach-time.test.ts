import { describe, expect, it } from "vitest";
import { dueForMail, instantToZonedLocal, zonedLocalToInstant } from "@/lib/teaching/teach-time";

// Offsets from the IANA time zone database as shipped in Node's ICU (London: GMT in winter, BST +1 in summer;
// New York EST −5; Auckland NZDT +13 in December).
describe("zoned local times", () => {
  it("reads a winter and a summer wall time in London", () => {
    expect(zonedLocalToInstant("2026-12-11T18:00", "Europe/London")?.toISOString()).toBe("2026-12-11T18:00:00.000Z");
    expect(zonedLocalToInstant("2026-07-01T09:30", "Europe/London")?.toISOString()).toBe("2026-07-01T08:30:00.000Z");
  });
  it("reads other zones and writes the wall time back", () => {
    const ny = zonedLocalToInstant("2026-12-11T18:00", "America/New_York");
    expect(ny?.toISOString()).toBe("2026-12-11T23:00:00.000Z");
    expect(instantToZonedLocal(ny as Date, "Pacific/Auckland")).toBe("2026-12-12T12:00");
  });
  it("refuses text that is not a date and time", () => {
    expect(zonedLocalToInstant("2026-02-31T10:00", "UTC")).toBeNull();
    expect(zonedLocalToInstant("tomorrow", "UTC")).toBeNull();
  });
  it("writes the e-mail form in the student's zone", () => {
    expect(dueForMail(new Date("2026-12-11T23:00:00Z"), "America/New_York")).toBe("Friday 11 December, 18:00");
  });
});
