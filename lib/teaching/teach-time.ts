// Wall-clock times in a person's own zone (issue 6: due dates are taken, shown and reminded in each
// student's time zone). Written on Intl (ECMA-402) rather than a date package: the app only needs
// "local date+time in zone Z ↔ instant", which Intl's zone data answers in a few lines.

const LOCAL = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/;

export function isTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat("en", { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

function wallParts(ms: number, zone: string): number[] {
  const parts = new Intl.DateTimeFormat("en-GB", {
    timeZone: zone,
    hourCycle: "h23",
    year: "numeric",
    month: "2-digit",
    day: "2-digit",
    hour: "2-digit",
    minute: "2-digit",
    second: "2-digit",
  }).formatToParts(new Date(ms));
  const get = (t: Intl.DateTimeFormatPartTypes) => Number(parts.find((p) => p.type === t)?.value ?? 0);
  return [get("year"), get("month"), get("day"), get("hour"), get("minute"), get("second")];
}

/** How far the zone's wall clock is ahead of UTC at that instant, in ms. */
function offsetAt(ms: number, zone: string): number {
  const [y, mo, d, h, mi, s] = wallParts(ms, zone);
  return Date.UTC(y, mo - 1, d, h, mi, s) - Math.floor(ms / 1000) * 1000;
}

/** "2026-12-11T18:00" in `zone` → the instant; null when the text is not such a date. */
export function zonedLocalToInstant(local: string, zone: string): Date | null {
  const m = LOCAL.exec(local);
  if (!m) return null;
  const [y, mo, d, h, mi] = m.slice(1).map(Number);
  const wall = Date.UTC(y, mo - 1, d, h, mi);
  if (new Date(wall).getUTCDate() !== d || h > 23 || mi > 59) return null; // 31 February and the like
  // Two passes: the offset at the first guess may differ from the offset at the answer around a DST change.
  const first = wall - offsetAt(wall, zone);
  const second = wall - offsetAt(first, zone);
  return new Date(second);
}

/** The instant as "YYYY-MM-DDTHH:mm" on the zone's wall clock (the value of an <input type="datetime-local">). */
export function instantToZonedLocal(instant: Date, zone: string): string {
  const [y, mo, d, h, mi] = wallParts(instant.getTime(), zone);
  const p = (n: number) => String(n).padStart(2, "0");
  return `${y}-${p(mo)}-${p(d)}T${p(h)}:${p(mi)}`;
}

/** "Friday 11 December, 18:00" in the zone, as the teaching e-mails expect (lib/mail/types-teaching.ts). */
export function dueForMail(instant: Date, zone: string): string {
  const date = new Intl.DateTimeFormat("en-GB", {
    timeZone: zone,
    weekday: "long",
    day: "numeric",
    month: "long",
  }).format(instant);
  const time = new Intl.DateTimeFormat("en-GB", {
    timeZone: zone,
    hour: "2-digit",
    minute: "2-digit",
    hourCycle: "h23",
  }).format(instant);
  return `${date}, ${time}`;
}
