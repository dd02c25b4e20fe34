import ICAL from 'ical.js';
import { type FeedEvent, isAmbiguousLocalTime, writeCalendar } from './ical-feed';

// Read back with ical.js (a general-purpose iCalendar parser) against RFC 5545: text escaping
// (3.3.11), line folding at 75 octets (3.1), VTIMEZONE observances (3.6.5).
describe('writeCalendar', () => {
  const at = new Date('2030-01-02T03:04:05.678Z');
  const event = (over: Partial<FeedEvent['content']> = {}, rest: Partial<FeedEvent> = {}): FeedEvent => ({
    uid: '2030-03-30-abc@rotaplex',
    sequence: 2,
    cancelled: false,
    createdAt: at,
    changedAt: at,
    content: {
      summary: 'Night, Ward 7; east',
      location: 'Ward 7',
      description: 'A long description that goes on and on, with commas; semicolons\nand a new line. '.repeat(
        3,
      ),
      timeZone: 'Europe/London',
      start: '2030-03-30T22:00:00.000Z',
      end: '2030-03-31T06:30:00.000Z',
      ...over,
    },
    ...rest,
  });

  it('writes text that a parser reads back unchanged, in lines of at most 75 octets', () => {
    const e = event();
    const text = writeCalendar('Rotaplex roster (Robin Tallis)', [e]);
    for (const line of text.split('\r\n')) expect(Buffer.byteLength(line, 'utf8')).toBeLessThanOrEqual(75);
    const cal = new ICAL.Component(ICAL.parse(text));
    const v = cal.getFirstSubcomponent('vevent')!;
    expect(v.getFirstPropertyValue('summary')).toBe(e.content.summary);
    expect(v.getFirstPropertyValue('description')).toBe(e.content.description);
    expect(v.getFirstPropertyValue('sequence')).toBe(2);
    expect(String(v.getFirstPropertyValue('dtstamp'))).toBe('2030-01-02T03:04:05Z');
    expect(cal.getFirstPropertyValue('prodid')).toContain('Rotaplex');
  });

  it('writes one VTIMEZONE per zone and times a parser turns into the same instants', () => {
    const text = writeCalendar('x', [
      event(),
      event(
        { timeZone: 'Australia/Sydney', start: '2030-04-05T21:00:00.000Z', end: '2030-04-06T20:00:00.000Z' },
        { uid: 'b' },
      ),
      event(
        { timeZone: 'UTC', start: '2030-07-01T08:00:00.000Z', end: '2030-07-01T16:00:00.000Z' },
        { uid: 'c' },
      ),
    ]);
    const cal = new ICAL.Component(ICAL.parse(text));
    const zones = cal.getAllSubcomponents('vtimezone');
    expect(zones.map((z) => z.getFirstPropertyValue('tzid'))).toEqual([
      'Australia/Sydney',
      'Europe/London',
      'UTC',
    ]);
    for (const z of zones) ICAL.TimezoneService.register(z);
    const times = cal
      .getAllSubcomponents('vevent')
      .map((v) => new ICAL.Event(v))
      .map((e) => [
        e.uid,
        e.startDate.toString(),
        e.startDate.toJSDate().toISOString(),
        e.endDate.toJSDate().toISOString(),
      ]);
    expect(times).toEqual([
      [
        '2030-03-30-abc@rotaplex',
        '2030-03-30T22:00:00',
        '2030-03-30T22:00:00.000Z',
        '2030-03-31T06:30:00.000Z',
      ],
      // Sydney: 08:00 AEDT (UTC+11) on 6 April; summer time ends 03:00 local that day (from memory).
      ['b', '2030-04-06T08:00:00', '2030-04-05T21:00:00.000Z', '2030-04-06T20:00:00.000Z'],
      ['c', '2030-07-01T08:00:00', '2030-07-01T08:00:00.000Z', '2030-07-01T16:00:00.000Z'],
    ]);
  });

  it('folds by octets without splitting a character', () => {
    const summary = 'Nuit à l’unité Ærø, équipe '.repeat(6);
    const text = writeCalendar('x', [event({ summary })]);
    for (const line of text.split('\r\n')) expect(Buffer.byteLength(line, 'utf8')).toBeLessThanOrEqual(75);
    expect(text).not.toContain('\uFFFD');
    const v = new ICAL.Component(ICAL.parse(text)).getFirstSubcomponent('vevent')!;
    expect(v.getFirstPropertyValue('summary')).toBe(summary);
  });

  it('writes times in the repeated hour of an autumn clock change in UTC, so no reader can misplace them', () => {
    // Europe/London, 27 October 2030 (last Sunday of October, from memory): 01:00-02:00 local happens
    // twice, first in BST (00:00-01:00 UTC) then in GMT (01:00-02:00 UTC).
    expect(isAmbiguousLocalTime(Date.parse('2030-10-27T01:30:00Z'), 'Europe/London')).toBe(true);
    expect(isAmbiguousLocalTime(Date.parse('2030-10-27T00:30:00Z'), 'Europe/London')).toBe(true);
    expect(isAmbiguousLocalTime(Date.parse('2030-10-26T23:30:00Z'), 'Europe/London')).toBe(false);
    expect(isAmbiguousLocalTime(Date.parse('2030-10-27T02:30:00Z'), 'Europe/London')).toBe(false);
    expect(isAmbiguousLocalTime(Date.parse('2030-03-31T01:30:00Z'), 'Europe/London')).toBe(false);
    const text = writeCalendar('x', [
      event({ start: '2030-10-27T01:30:00.000Z', end: '2030-10-27T09:00:00.000Z' }),
      event({ start: '2030-10-26T23:30:00.000Z', end: '2030-10-27T00:30:00.000Z' }, { uid: 'first' }),
    ]);
    const cal = new ICAL.Component(ICAL.parse(text));
    for (const z of cal.getAllSubcomponents('vtimezone')) ICAL.TimezoneService.register(z);
    const times = cal
      .getAllSubcomponents('vevent')
      .map((v) => new ICAL.Event(v))
      .map((e) => [e.startDate.toJSDate().toISOString(), e.endDate.toJSDate().toISOString()]);
    expect(times).toEqual([
      ['2030-10-27T01:30:00.000Z', '2030-10-27T09:00:00.000Z'],
      ['2030-10-26T23:30:00.000Z', '2030-10-27T00:30:00.000Z'],
    ]);
  });

  it('marks a cancelled event', () => {
    const cal = new ICAL.Component(ICAL.parse(writeCalendar('x', [event({}, { cancelled: true })])));
    expect(cal.getFirstSubcomponent('vevent')!.getFirstPropertyValue('status')).toBe('CANCELLED');
  });

  it('writes an empty calendar when there is nothing to list', () => {
    const cal = new ICAL.Component(ICAL.parse(writeCalendar('x', [])));
    expect(cal.getAllSubcomponents('vevent')).toEqual([]);
    expect(cal.getFirstPropertyValue('version')).toBe('2.0');
  });
});
