import {
  dateOf,
  isNightShift,
  isValidTimeZone,
  parseDate,
  parseHm,
  restMinutes,
  shiftInterval,
  weekdayOf,
  weekendsOf,
} from './time';

const LATE = { start: '14:00', end: '22:00' };
const EARLY = { start: '06:00', end: '14:00' };
const NIGHT = { start: '22:00', end: '06:00' };

describe('rest across daylight-saving changes in Europe/London', () => {
  // UK summer time rule (Summer Time Order; EU Directive 2000/84/EC): clocks go forward from
  // 01:00 GMT to 02:00 BST on the last Sunday of March and back from 02:00 BST to 01:00 GMT on the
  // last Sunday of October. In 2026 those Sundays are 29 March and 25 October.
  const spring = { startDate: '2026-03-28', timeZone: 'Europe/London' }; // day 0 = Saturday 28 March
  const autumn = { startDate: '2026-10-24', timeZone: 'Europe/London' }; // day 0 = Saturday 24 October

  it('late Sat 28 Mar to early Sun 29 Mar gives 7 h of rest, not the 8 h of the wall clock', () => {
    // Late ends 22:00 GMT Sat (= 22:00 UTC). Early starts 06:00 BST Sun (= 05:00 UTC).
    // 22:00 UTC → 05:00 UTC is 7 h = 420 minutes; the wall clock shows 22:00 → 06:00 = 8 h.
    expect(restMinutes(spring, 0, LATE, 1, EARLY)).toBe(420);
  });

  it('late Sat 24 Oct to early Sun 25 Oct gives 9 h of rest', () => {
    // Late ends 22:00 BST Sat (= 21:00 UTC). Early starts 06:00 GMT Sun (= 06:00 UTC): 9 h = 540 min.
    expect(restMinutes(autumn, 0, LATE, 1, EARLY)).toBe(540);
  });

  it('a night shift over the change lasts 7 h in March and 9 h in October', () => {
    // 22:00 GMT (22:00 UTC) → 06:00 BST (05:00 UTC) = 7 h;  22:00 BST (21:00 UTC) → 06:00 GMT (06:00 UTC) = 9 h.
    const m = shiftInterval(spring, 0, NIGHT);
    expect((m.end - m.start) / 3_600_000).toBe(7);
    const o = shiftInterval(autumn, 0, NIGHT);
    expect((o.end - o.start) / 3_600_000).toBe(9);
  });

  it('away from the changes the wall clock and real time agree', () => {
    // Sat 7 → Sun 8 March 2026, both GMT: 22:00 → 06:00 = 8 h.
    expect(restMinutes({ startDate: '2026-03-07', timeZone: 'Europe/London' }, 0, LATE, 1, EARLY)).toBe(480);
    // Start instant: 14:00 GMT on 7 March 2026 = 2026-03-07T14:00:00Z.
    expect(shiftInterval({ startDate: '2026-03-07', timeZone: 'Europe/London' }, 0, LATE).start).toBe(
      Date.parse('2026-03-07T14:00:00Z'),
    );
  });

  it('rest to a shift two days later is measured too', () => {
    // Early Mon 2 Mar 06:00-14:00 UTC, early Wed 4 Mar 06:00: 14:00 Mon → 06:00 Wed = 40 h = 2400 min.
    expect(restMinutes({ startDate: '2026-03-02', timeZone: 'UTC' }, 0, EARLY, 2, EARLY)).toBe(2400);
  });
});

describe('calendar helpers', () => {
  it('weekday of a day index', () => {
    // 2 March 2026 is a Monday (ISO calendar), so day 5 is Saturday and day 6 Sunday.
    expect(weekdayOf({ startDate: '2026-03-02' }, 0)).toBe(1);
    expect(weekdayOf({ startDate: '2026-03-02' }, 5)).toBe(6);
    expect(weekdayOf({ startDate: '2026-03-02' }, 6)).toBe(0);
    expect(dateOf({ startDate: '2026-02-27' }, 2)).toBe('2026-03-01');
  });

  it('weekends group consecutive weekend days, also when cut by the period', () => {
    // From Sunday 1 March 2026 for 14 days: Sun 1 (day 0, alone), Sat 7 + Sun 8 (days 6, 7), Sat 14 (day 13).
    expect(weekendsOf({ startDate: '2026-03-01', days: 14 })).toEqual([[0], [6, 7], [13]]);
    // A Friday-to-Sunday weekend from Monday 2 March 2026: days 4-6 and 11-13.
    expect(weekendsOf({ startDate: '2026-03-02', days: 14, weekendDays: [5, 6, 0] })).toEqual([
      [4, 5, 6],
      [11, 12, 13],
    ]);
  });

  it('night shifts: at least 3 h inside 00:00-05:00 (Directive 2003/88/EC, Art. 2)', () => {
    expect(isNightShift({ start: '22:00', end: '06:00' })).toBe(true); // 5 h inside
    expect(isNightShift({ start: '20:00', end: '02:00' })).toBe(false); // 2 h inside
    expect(isNightShift({ start: '02:00', end: '10:00' })).toBe(true); // 02:00-05:00 = 3 h
    expect(isNightShift({ start: '07:00', end: '15:00' })).toBe(false);
    expect(isNightShift({ start: '07:00', end: '15:00', night: true })).toBe(true); // explicit flag wins
  });

  it('rejects malformed times, dates and zones', () => {
    expect(parseHm('07:30')).toBe(450);
    expect(() => parseHm('7:30')).toThrow(/HH:mm/);
    expect(() => parseHm('24:00')).toThrow();
    expect(() => parseDate('2026-02-30')).toThrow(/does not exist/);
    expect(isValidTimeZone('Europe/London')).toBe(true);
    expect(isValidTimeZone('Mars/Olympus')).toBe(false);
  });
});
