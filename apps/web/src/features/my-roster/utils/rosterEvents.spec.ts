import type { MyRosterShiftDto } from '@rotaplex/contracts';
import { rangeDays, rosterEvents, todayIn, wallClock } from './rosterEvents';

// Europe/London offsets from the IANA rules (from memory): GMT (UTC+0) until 01:00 UTC on the last
// Sunday of March (31 March 2030), BST (UTC+1) after. Australia/Sydney is UTC+11 in January (AEDT).
describe('my roster calendar events', () => {
  const shift = (over: Partial<MyRosterShiftDto>): MyRosterShiftDto => ({
    mine: false,
    name: 'Grace Holloway',
    unitId: 'u',
    unitName: 'Ward 7',
    timeZone: 'Europe/London',
    date: '2030-03-30',
    shiftCode: 'N',
    shiftName: 'Night',
    colour: 'plum',
    start: '2030-03-30T22:00:00.000Z',
    end: '2030-03-31T06:30:00.000Z',
    ...over,
  });
  const colours = {
    teal: { background: 'tb', foreground: 'tf', border: 'tbo' },
    amber: { background: 'ab', foreground: 'af', border: 'abo' },
    plum: { background: 'pb', foreground: 'pf', border: 'pbo' },
    slate: { background: 'sb', foreground: 'sf', border: 'sbo' },
    moss: { background: 'mb', foreground: 'mf', border: 'mbo' },
    coral: { background: 'cb', foreground: 'cf', border: 'cbo' },
    sky: { background: 'kb', foreground: 'kf', border: 'kbo' },
    sand: { background: 'db', foreground: 'df', border: 'dbo' },
  };

  it('turns instants into the unit zone wall clock across the clock change', () => {
    expect(wallClock('2030-03-30T22:00:00.000Z', 'Europe/London')).toBe('2030-03-30T22:00:00');
    expect(wallClock('2030-03-31T06:30:00.000Z', 'Europe/London')).toBe('2030-03-31T07:30:00');
    expect(wallClock('2030-01-01T12:00:00.000Z', 'Australia/Sydney')).toBe('2030-01-01T23:00:00');
    expect(todayIn('Australia/Sydney', new Date('2030-01-01T13:30:00Z'))).toBe('2030-01-02');
  });

  it('marks my shifts, names colleagues and puts mine first', () => {
    const events = rosterEvents(
      [shift({}), shift({ mine: true, name: 'Robin Tallis', colour: 'teal', shiftName: 'Early' })],
      'Europe/London',
      colours,
      { mine: 'mine', other: 'other' },
    );
    expect(events.map((e) => [e.title, e.classNames[0], e.backgroundColor, e.start, e.end])).toEqual([
      ['Early (you)', 'mine', 'tb', '2030-03-30T22:00:00', '2030-03-31T07:30:00'],
      ['Grace Holloway: Night', 'other', 'pb', '2030-03-30T22:00:00', '2030-03-31T07:30:00'],
    ]);
  });

  it('keeps only the shifts of the zone shown', () => {
    expect(
      rosterEvents([shift({ timeZone: 'Europe/Dublin' })], 'Europe/London', colours, {
        mine: 'a',
        other: 'b',
      }),
    ).toEqual([]);
  });

  it('turns the visible range into the days to ask for', () => {
    expect(rangeDays(new Date('2030-03-25T00:00:00Z'), new Date('2030-04-01T00:00:00Z'))).toEqual({
      from: '2030-03-25',
      to: '2030-03-31',
    });
  });
});
