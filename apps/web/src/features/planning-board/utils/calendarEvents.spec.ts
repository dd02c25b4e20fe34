import {
  SHIFT_COLOURS,
  type AssignmentGridDto,
  type ShiftColour,
  type ShiftTypeDto,
} from '@rotaplex/contracts';
import { addDays, assignmentEvents, eventId, shiftInstants, wallClock } from './calendarEvents';

const shift = (id: string, start: string, end: string, colour: ShiftColour): ShiftTypeDto => ({
  id,
  unitId: 'u',
  code: id,
  name: `${id} shift`,
  start,
  end,
  paidMinutes: 450,
  colour,
  night: null,
});

// Distinct strings per palette key, so the test sees which key's colours an event got.
const colours = Object.fromEntries(
  SHIFT_COLOURS.map((c) => [c, { background: `bg-${c}`, foreground: `fg-${c}`, border: `bd-${c}` }]),
) as Record<ShiftColour, { background: string; foreground: string; border: string }>;

const HOUR = 3_600_000;

// Europe/London follows the EU summer-time rule (Directive 2000/84/EC, Arts. 2-3, and the UK Summer
// Time Order 2002; as recorded in the IANA tz database "EU" rule, from memory): clocks go forward at
// 01:00 UTC on the last Sunday of March and back at 01:00 UTC on the last Sunday of October.
// In 2026 those Sundays are 29 March and 25 October (Gregorian calendar).
describe('shift times in the unit time zone across the Europe/London daylight-saving changes', () => {
  const night = { start: '20:00', end: '08:00' };
  it('a night from Saturday 28 March 2026 is 11 real hours and keeps its wall-clock times', () => {
    const { start, end } = shiftInstants('2026-03-28', night, 'Europe/London');
    // 20:00 GMT (UTC+0) on the 28th; 08:00 BST (UTC+1) on the 29th is 07:00 UTC.
    expect(new Date(start).toISOString()).toBe('2026-03-28T20:00:00.000Z');
    expect(new Date(end).toISOString()).toBe('2026-03-29T07:00:00.000Z');
    expect((end - start) / HOUR).toBe(11);
    expect(wallClock(start, 'Europe/London')).toBe('2026-03-28T20:00:00');
    expect(wallClock(end, 'Europe/London')).toBe('2026-03-29T08:00:00');
  });
  it('a night from Saturday 24 October 2026 is 13 real hours', () => {
    const { start, end } = shiftInstants('2026-10-24', night, 'Europe/London');
    // 20:00 BST is 19:00 UTC; 08:00 GMT on the 25th is 08:00 UTC.
    expect(new Date(start).toISOString()).toBe('2026-10-24T19:00:00.000Z');
    expect(new Date(end).toISOString()).toBe('2026-10-25T08:00:00.000Z');
    expect((end - start) / HOUR).toBe(13);
    expect(wallClock(end, 'Europe/London')).toBe('2026-10-25T08:00:00');
  });
  it('summer and winter days sit one hour apart in UTC but at the same wall-clock time', () => {
    const winter = shiftInstants('2026-03-27', { start: '07:00', end: '15:00' }, 'Europe/London');
    const summer = shiftInstants('2026-03-30', { start: '07:00', end: '15:00' }, 'Europe/London');
    expect(new Date(winter.start).toISOString()).toBe('2026-03-27T07:00:00.000Z');
    expect(new Date(summer.start).toISOString()).toBe('2026-03-30T06:00:00.000Z');
    expect(wallClock(summer.start, 'Europe/London')).toBe('2026-03-30T07:00:00');
  });
  it('a start inside the skipped hour (01:30 on 29 March 2026) is moved forward to 02:30 BST', () => {
    const { start } = shiftInstants('2026-03-29', { start: '01:30', end: '09:30' }, 'Europe/London');
    expect(new Date(start).toISOString()).toBe('2026-03-29T01:30:00.000Z');
    expect(wallClock(start, 'Europe/London')).toBe('2026-03-29T02:30:00');
  });
  it('uses the unit zone, not UTC: America/New_York changes on the second Sunday of March', () => {
    // US rule since 2007 (Energy Policy Act of 2005, s. 110; from memory): second Sunday of March,
    // 8 March 2026, 02:00 EST -> 03:00 EDT. EST is UTC-5, EDT is UTC-4.
    const night = shiftInstants('2026-03-07', { start: '22:00', end: '06:00' }, 'America/New_York');
    expect(new Date(night.start).toISOString()).toBe('2026-03-08T03:00:00.000Z');
    expect(new Date(night.end).toISOString()).toBe('2026-03-08T10:00:00.000Z');
    expect((night.end - night.start) / HOUR).toBe(7);
  });
  it('rejects malformed dates and times', () => {
    expect(() => shiftInstants('2026-3-1', night, 'Europe/London')).toThrow(/YYYY-MM-DD/);
    expect(() => shiftInstants('2026-03-01', { start: '24:00', end: '08:00' }, 'Europe/London')).toThrow(
      /HH:mm/,
    );
  });
});

describe('assignments as calendar events', () => {
  const types = new Map([
    ['E', shift('E', '07:00', '15:00', 'teal')],
    ['N', shift('N', '20:00', '08:00', 'plum')],
  ]);
  const grid: AssignmentGridDto = {
    rosterPeriodId: 'p',
    dates: ['2026-03-28', '2026-03-29'],
    rows: [
      {
        staffMemberId: 's1',
        name: 'Ada Byrne',
        cells: [
          { shiftTypeId: 'N', pinned: true },
          { shiftTypeId: null, pinned: false },
        ],
      },
      {
        staffMemberId: 's2',
        name: 'Ben Cole',
        cells: [
          { shiftTypeId: null, pinned: false },
          { shiftTypeId: 'E', pinned: false },
        ],
      },
    ],
    check: { violations: [], terms: {}, objective: 0 },
  };

  it('makes one event per worked cell with the person, the code, the colours and the local times', () => {
    const events = assignmentEvents(
      grid,
      types,
      'Europe/London',
      colours,
      new Set([eventId('s2', '2026-03-29')]),
    );
    expect(events.map((e) => e.title)).toEqual(['Ada Byrne · N', 'Ben Cole · E']);
    const [n, e] = events;
    expect(n).toMatchObject({
      id: 's1|2026-03-28',
      start: '2026-03-28T20:00:00',
      end: '2026-03-29T08:00:00',
      backgroundColor: 'bg-plum',
      textColor: 'fg-plum',
      borderColor: 'bd-plum',
    });
    expect(n.extendedProps).toMatchObject({
      date: '2026-03-28',
      pinned: true,
      flagged: false,
      minutes: 11 * 60,
    });
    // 07:00 BST on the first day of summer time is 06:00 UTC.
    expect(e).toMatchObject({
      start: '2026-03-29T07:00:00',
      end: '2026-03-29T15:00:00',
      textColor: 'fg-teal',
    });
    expect(e.extendedProps).toMatchObject({
      startUtc: '2026-03-29T06:00:00.000Z',
      flagged: true,
      minutes: 480,
    });
  });

  it('draws the same roster in another unit zone at the same wall-clock times but other instants', () => {
    const tokyo = assignmentEvents(grid, types, 'Asia/Tokyo', colours);
    // Japan keeps UTC+9 all year (no daylight saving since 1951, IANA tz "Japan" history, from memory).
    expect(tokyo[0]).toMatchObject({ start: '2026-03-28T20:00:00', end: '2026-03-29T08:00:00' });
    expect(tokyo[0].extendedProps.startUtc).toBe('2026-03-28T11:00:00.000Z');
    expect(tokyo[0].extendedProps.minutes).toBe(12 * 60);
  });

  it('skips days off and unknown shift types', () => {
    const only = assignmentEvents(grid, new Map([['E', types.get('E')!]]), 'Europe/London', colours);
    expect(only.map((e) => e.id)).toEqual(['s2|2026-03-29']);
  });

  it('adds days across month ends (the exclusive end of the valid range)', () => {
    expect(addDays('2026-12-07', 28)).toBe('2027-01-04');
    expect(addDays('2028-02-28', 1)).toBe('2028-02-29');
  });
});
