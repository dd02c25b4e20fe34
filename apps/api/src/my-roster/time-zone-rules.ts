/**
 * UTC offsets and their changes for an IANA time zone, read from the runtime's own time zone data
 * (Intl, which Node builds with ICU and the IANA tz database). Used to write the VTIMEZONE of a feed.
 */

const MINUTE_MS = 60_000;
const DAY_MS = 86_400_000;

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatter(timeZone: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone,
      hourCycle: 'h23',
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      second: '2-digit',
    });
    formatters.set(timeZone, f);
  }
  return f;
}

/** Wall-clock fields of an instant in a zone. */
export interface WallClock {
  year: number;
  month: number;
  day: number;
  hour: number;
  minute: number;
  second: number;
}

export function wallClock(instant: number, timeZone: string): WallClock {
  const parts = Object.fromEntries(
    formatter(timeZone)
      .formatToParts(new Date(instant))
      .filter((p) => p.type !== 'literal')
      .map((p) => [p.type, Number(p.value)]),
  ) as Record<string, number>;
  return {
    year: parts.year,
    month: parts.month,
    day: parts.day,
    hour: parts.hour,
    minute: parts.minute,
    second: parts.second,
  };
}

/** Offset of the zone from UTC at an instant, in minutes (east positive: Europe/London in summer = 60). */
export function offsetMinutes(instant: number, timeZone: string): number {
  const w = wallClock(instant, timeZone);
  const asUtc = Date.UTC(w.year, w.month - 1, w.day, w.hour, w.minute, w.second);
  const whole = Math.floor(instant / 1000) * 1000;
  return Math.round((asUtc - whole) / MINUTE_MS);
}

export interface OffsetChange {
  /** The instant the new offset starts (epoch ms, on a whole minute). */
  at: number;
  from: number;
  to: number;
}

/**
 * Every offset change in [fromMs, toMs). Scans day by day (zones change at most a few times a year)
 * and narrows each change down to the minute by bisection.
 */
export function offsetChanges(timeZone: string, fromMs: number, toMs: number): OffsetChange[] {
  const changes: OffsetChange[] = [];
  let t = fromMs;
  let offset = offsetMinutes(t, timeZone);
  while (t < toMs) {
    const next = Math.min(t + DAY_MS, toMs);
    const nextOffset = offsetMinutes(next, timeZone);
    if (nextOffset !== offset) {
      let lo = t; // offset here is `offset`
      let hi = next; // offset here is `nextOffset`
      while (hi - lo > MINUTE_MS) {
        const mid = lo + Math.floor((hi - lo) / 2 / MINUTE_MS) * MINUTE_MS;
        if (offsetMinutes(mid, timeZone) === offset) lo = mid;
        else hi = mid;
      }
      changes.push({ at: hi, from: offset, to: nextOffset });
      offset = nextOffset;
    }
    t = next;
  }
  return changes;
}
