/**
 * Writes a person's calendar feed as an iCalendar object (RFC 5545) with ical.js, which escapes
 * text values and folds long lines as section 3.1 requires. Times are written in the unit's zone
 * (DTSTART/DTEND with TZID) and each zone used gets a VTIMEZONE built from the runtime's IANA data.
 */
import ICAL from 'ical.js';
import { offsetChanges, offsetMinutes, wallClock } from './time-zone-rules';

/** What an event says; hashed to notice a change, and kept to send a removed shift as cancelled. */
export interface FeedEventContent {
  summary: string;
  location: string;
  description: string;
  /** IANA zone the times are written in. */
  timeZone: string;
  /** ISO 8601 UTC instants. */
  start: string;
  end: string;
}

export interface FeedEvent {
  uid: string;
  sequence: number;
  cancelled: boolean;
  createdAt: Date;
  /** When the event last changed: DTSTAMP and LAST-MODIFIED. */
  changedAt: Date;
  content: FeedEventContent;
}

export const FEED_PRODUCT_ID = '-//Rotaplex//My roster feed//EN';

type Component = InstanceType<typeof ICAL.Component>;

const YEAR_MS = 366 * 86_400_000;

/** A date-time with the given wall-clock fields and no zone of its own (the TZID parameter gives it). */
function localTime(instant: number, timeZone: string): InstanceType<typeof ICAL.Time> {
  const w = wallClock(instant, timeZone);
  return ICAL.Time.fromData({
    year: w.year,
    month: w.month,
    day: w.day,
    hour: w.hour,
    minute: w.minute,
    second: w.second,
    isDate: false,
  });
}

function utcTime(date: Date): InstanceType<typeof ICAL.Time> {
  return ICAL.Time.fromJSDate(new Date(Math.floor(date.getTime() / 1000) * 1000), true);
}

/**
 * Whether an instant's wall-clock time happens twice in its zone (the hour repeated when clocks go
 * back). RFC 5545 3.3.5 reads such a local time as its first occurrence, but parsers differ (ical.js
 * takes the second), so these instants are written in UTC, which no reader can get wrong.
 */
export function isAmbiguousLocalTime(instant: number, timeZone: string): boolean {
  const own = JSON.stringify(wallClock(instant, timeZone));
  const offset = offsetMinutes(instant, timeZone);
  for (const probe of [instant - 3 * 3_600_000, instant + 3 * 3_600_000]) {
    const other = offsetMinutes(probe, timeZone);
    if (other === offset) continue;
    // The same wall-clock time under the other offset, if it exists.
    const twin = instant - (other - offset) * 60_000;
    if (offsetMinutes(twin, timeZone) === other && JSON.stringify(wallClock(twin, timeZone)) === own)
      return true;
  }
  return false;
}

function zonedProperty(name: string, instant: number, timeZone: string) {
  const prop = new ICAL.Property(name);
  if (isAmbiguousLocalTime(instant, timeZone)) {
    prop.setValue(utcTime(new Date(instant)));
    return prop;
  }
  prop.setParameter('tzid', timeZone);
  prop.setValue(localTime(instant, timeZone));
  return prop;
}

/** Whether an offset is the zone's summer time: above the smaller of its January and July offsets. */
function isDaylight(offset: number, instant: number, timeZone: string): boolean {
  const year = new Date(instant).getUTCFullYear();
  const jan = offsetMinutes(Date.UTC(year, 0, 1), timeZone);
  const jul = offsetMinutes(Date.UTC(year, 6, 1), timeZone);
  return jan !== jul && offset > Math.min(jan, jul);
}

function observance(timeZone: string, at: number, from: number, to: number): Component {
  const c = new ICAL.Component(isDaylight(to, at, timeZone) ? 'daylight' : 'standard');
  // RFC 5545 3.6.5: DTSTART of an observance is the local time, in the offset before it, it starts at.
  const local = new Date(at + from * 60_000);
  c.addPropertyWithValue(
    'dtstart',
    ICAL.Time.fromData({
      year: local.getUTCFullYear(),
      month: local.getUTCMonth() + 1,
      day: local.getUTCDate(),
      hour: local.getUTCHours(),
      minute: local.getUTCMinutes(),
      second: 0,
      isDate: false,
    }),
  );
  c.addPropertyWithValue('tzoffsetfrom', ICAL.UtcOffset.fromSeconds(from * 60));
  c.addPropertyWithValue('tzoffsetto', ICAL.UtcOffset.fromSeconds(to * 60));
  return c;
}

/**
 * VTIMEZONE of an IANA zone over [fromMs, toMs): one observance at the start of the range (the
 * offset then in force) and one for each offset change inside it, each with its own DTSTART (no
 * recurrence rules, so the object says exactly what the tz database says for those years).
 */
export function vtimezone(timeZone: string, fromMs: number, toMs: number): Component {
  const tz = new ICAL.Component('vtimezone');
  tz.addPropertyWithValue('tzid', timeZone);
  const first = offsetMinutes(fromMs, timeZone);
  tz.addSubcomponent(observance(timeZone, fromMs, first, first));
  for (const change of offsetChanges(timeZone, fromMs, toMs)) {
    tz.addSubcomponent(observance(timeZone, change.at, change.from, change.to));
  }
  return tz;
}

function vevent(event: FeedEvent): Component {
  const { content } = event;
  const v = new ICAL.Component('vevent');
  v.addPropertyWithValue('uid', event.uid);
  v.addPropertyWithValue('dtstamp', utcTime(event.changedAt));
  v.addPropertyWithValue('created', utcTime(event.createdAt));
  v.addPropertyWithValue('last-modified', utcTime(event.changedAt));
  v.addPropertyWithValue('sequence', event.sequence);
  v.addProperty(zonedProperty('dtstart', Date.parse(content.start), content.timeZone));
  v.addProperty(zonedProperty('dtend', Date.parse(content.end), content.timeZone));
  v.addPropertyWithValue('summary', content.summary);
  v.addPropertyWithValue('location', content.location);
  v.addPropertyWithValue('description', content.description);
  v.addPropertyWithValue('status', event.cancelled ? 'CANCELLED' : 'CONFIRMED');
  v.addPropertyWithValue('transp', event.cancelled ? 'TRANSPARENT' : 'OPAQUE');
  return v;
}

/** The whole feed: VCALENDAR with one VTIMEZONE per zone used and one VEVENT per event. */
export function writeCalendar(name: string, events: readonly FeedEvent[]): string {
  const cal = new ICAL.Component('vcalendar');
  cal.addPropertyWithValue('prodid', FEED_PRODUCT_ID);
  cal.addPropertyWithValue('version', '2.0');
  cal.addPropertyWithValue('calscale', 'GREGORIAN');
  // NAME and REFRESH-INTERVAL are RFC 7986; X-WR-CALNAME and X-PUBLISHED-TTL are common practice.
  cal.addPropertyWithValue('name', name);
  cal.addPropertyWithValue('x-wr-calname', name);
  // ical.js writes the VALUE=DURATION parameter RFC 7986 requires for REFRESH-INTERVAL.
  cal.addPropertyWithValue('refresh-interval', ICAL.Duration.fromString('PT1H'));
  cal.addPropertyWithValue('x-published-ttl', 'PT1H');

  const zones = new Map<string, { from: number; to: number }>();
  for (const e of events) {
    const start = Date.parse(e.content.start);
    const end = Date.parse(e.content.end);
    const range = zones.get(e.content.timeZone);
    zones.set(e.content.timeZone, {
      from: Math.min(range?.from ?? start, start),
      to: Math.max(range?.to ?? end, end),
    });
  }
  for (const [timeZone, range] of [...zones].sort(([a], [b]) => a.localeCompare(b))) {
    // Whole years around the events, so a client placing nearby times finds the right offset.
    const from = Date.UTC(new Date(range.from).getUTCFullYear(), 0, 1);
    const to = Math.max(Date.UTC(new Date(range.to).getUTCFullYear() + 1, 0, 1), from + YEAR_MS);
    cal.addSubcomponent(vtimezone(timeZone, from, to));
  }
  for (const e of events) cal.addSubcomponent(vevent(e));
  // ical.js folds by characters (75 plus the leading space); refold by octets as RFC 5545 3.1 asks.
  return (
    cal
      .toString()
      .replace(/\r\n[ \t]/g, '')
      .split('\r\n')
      .map(foldLine)
      .join('\r\n') + '\r\n'
  );
}

/**
 * Folds a content line into lines of at most 75 octets (the leading space of a continuation line
 * included), never splitting a character's UTF-8 bytes (RFC 5545 3.1).
 */
export function foldLine(line: string): string {
  const out: string[] = [];
  let current = '';
  let octets = 0;
  for (const ch of line) {
    const size = Buffer.byteLength(ch, 'utf8');
    if (octets + size > 75) {
      out.push(current);
      current = ' ';
      octets = 1;
    }
    current += ch;
    octets += size;
  }
  out.push(current);
  return out.join('\r\n');
}
