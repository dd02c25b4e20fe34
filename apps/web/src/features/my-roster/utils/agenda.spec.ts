import type { MyRosterShiftDto } from '@rotaplex/contracts';
import { agendaDays, nextShifts, shiftWhen } from './agenda';

const shift = (p: Partial<MyRosterShiftDto>): MyRosterShiftDto => ({
  mine: true,
  name: 'Robin Tallis',
  unitId: 'u',
  unitName: 'Ward 7',
  timeZone: 'Europe/London',
  date: '2027-01-04',
  shiftCode: 'E',
  shiftName: 'Early',
  colour: 'teal',
  start: '2027-01-04T07:00:00Z',
  end: '2027-01-04T15:00:00Z',
  ...p,
});

describe('my agenda', () => {
  // Europe/London is UTC+0 in January and UTC+1 in July (IANA tz database; UK summer time).
  it('words a day shift and a night across midnight as one shift, in the unit time zone', () => {
    expect(shiftWhen(shift({}))).toBe('Mon 4 Jan, 07:00–15:00');
    expect(shiftWhen(shift({ start: '2027-01-04T22:00:00Z', end: '2027-01-05T07:30:00Z' }))).toBe(
      'Mon 4 Jan, 22:00 to Tue 5 Jan, 07:30',
    );
    expect(shiftWhen(shift({ start: '2027-07-05T06:00:00Z', end: '2027-07-05T14:00:00Z' }))).toBe(
      'Mon 5 Jul, 07:00–15:00',
    );
  });
  it('lists my own shifts not yet ended, soonest first, and leaves colleagues out', () => {
    const now = new Date('2027-01-04T12:00:00Z');
    const list = nextShifts(
      [
        shift({ date: '2027-01-06', start: '2027-01-06T07:00:00Z', end: '2027-01-06T15:00:00Z' }),
        shift({}), // running now: still next
        shift({ date: '2027-01-03', start: '2027-01-03T07:00:00Z', end: '2027-01-03T15:00:00Z' }),
        shift({
          mine: false,
          name: 'Grace Holloway',
          start: '2027-01-05T07:00:00Z',
          end: '2027-01-05T15:00:00Z',
        }),
      ],
      now,
    );
    expect(list.map((s) => s.date)).toEqual(['2027-01-04', '2027-01-06']);
  });
  it('groups shifts by roster day in order', () => {
    const days = agendaDays([
      shift({ date: '2027-01-05', start: '2027-01-05T07:00:00Z' }),
      shift({ date: '2027-01-04', mine: false }),
      shift({}),
    ]);
    expect(days.map((d) => [d.date, d.shifts.length])).toEqual([
      ['2027-01-04', 2],
      ['2027-01-05', 1],
    ]);
  });
});
