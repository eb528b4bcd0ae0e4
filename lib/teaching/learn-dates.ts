// Calendar days in a person's own time zone, and the practice streak. Pure: no database.
// Days are "YYYY-MM-DD" strings (the practice log's `date` column), so comparing them as strings
// orders them, and stepping a day is done on a UTC midnight where no zone shift can intervene.

/** The calendar day an instant falls on in a time zone (IANA name). */
export function dayIn(zone: string, at: Date = new Date()): string {
  // en-CA writes dates as YYYY-MM-DD (common practice for ISO-like output from Intl).
  return new Intl.DateTimeFormat("en-CA", { timeZone: zone, year: "numeric", month: "2-digit", day: "2-digit" }).format(
    at,
  );
}

export function addDays(day: string, n: number): string {
  const d = new Date(`${day}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + n);
  return d.toISOString().slice(0, 10);
}

/** Every day from `from` to `to`, both included. */
export function daysBetween(from: string, to: string): string[] {
  const out: string[] = [];
  for (let d = from; d <= to; d = addDays(d, 1)) out.push(d);
  return out;
}

/**
 * Consecutive days with practice ending today or yesterday. A day with no practice yet today does
 * not break the streak: the day is not over, so a streak that reached yesterday still stands (common
 * practice for habit streaks — it breaks only when a whole day passes without practice). Today
 * counts once something is logged for it.
 * `days`: the days with practice, any order, duplicates allowed.
 */
export function streakOf(days: readonly string[], today: string): number {
  const set = new Set(days);
  let day = set.has(today) ? today : addDays(today, -1);
  let n = 0;
  while (set.has(day)) {
    n += 1;
    day = addDays(day, -1);
  }
  return n;
}

/** A due date written out in the student's zone, e.g. "Friday 11 December, 18:00". */
export function dueWords(due: Date, zone: string): string {
  return new Intl.DateTimeFormat("en-GB", {
    timeZone: zone,
    weekday: "long",
    day: "numeric",
    month: "long",
    hour: "2-digit",
    minute: "2-digit",
    hour12: false,
  })
    .format(due)
    .replace(" at ", ", ");
}

/** A short name of the zone for showing beside a time ("GMT", "GMT-4", "AEDT"). */
export function zoneShort(zone: string, at: Date): string {
  const part = new Intl.DateTimeFormat("en-GB", { timeZone: zone, timeZoneName: "short" })
    .formatToParts(at)
    .find((p) => p.type === "timeZoneName");
  return part?.value ?? zone;
}
