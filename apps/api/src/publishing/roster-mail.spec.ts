import { shiftInterval } from '@rotaplex/roster-model';
import { formatShiftTimes, rosterMail } from './roster-mail';

describe('roster e-mail', () => {
  const night = { start: '22:00', end: '07:00' };

  it('writes times as wall-clock times of the unit across the spring clock change', () => {
    // Directive 2000/84/EC: summer time starts on the last Sunday of March at 01:00 UTC; in 2030
    // that is Sunday 31 March. A night from Saturday 22:00 to Sunday 07:00 London time is then
    // 8 hours long, not 9, but the e-mail shows the clock times people read on the wall.
    const period = { startDate: '2030-03-25', timeZone: 'Europe/London' };
    expect(formatShiftTimes({ day: 5, ...night }, period)).toBe(
      'Sat 30 Mar 2030, 22:00 – Sun 31 Mar 2030, 07:00',
    );
    const { start, end } = shiftInterval(period, 5, night);
    expect((end - start) / 3_600_000).toBe(8);
  });

  it('uses the unit zone, not UTC (Australia/Sydney is UTC+10 in July, IANA tz database)', () => {
    const period = { startDate: '2030-07-01', timeZone: 'Australia/Sydney' };
    expect(formatShiftTimes({ day: 0, start: '07:00', end: '15:00' }, period)).toBe(
      'Mon 1 Jul 2030, 07:00–15:00',
    );
    const { start } = shiftInterval(period, 0, { start: '07:00', end: '15:00' });
    expect(new Date(start).toISOString()).toBe('2030-06-30T21:00:00.000Z');
  });

  it("lists only the person's own shifts in day order, in text and HTML, escaping HTML (OWASP XSS Prevention Cheat Sheet, rule 1)", () => {
    const m = rosterMail({
      displayName: 'Ana <b>Reyes</b>',
      unitName: 'Ward & Annex',
      timeZone: 'Europe/London',
      startDate: '2030-07-01',
      days: 7,
      shifts: [
        { day: 3, code: 'L', name: 'Late', start: '14:30', end: '22:30' },
        { day: 0, code: 'E', name: 'Early', start: '07:00', end: '15:00' },
      ],
      link: 'http://rotaplex.test/',
      kind: 'published',
    });
    expect(m.subject).toBe('Your roster for Ward & Annex, Mon 1 Jul 2030 to Sun 7 Jul 2030');
    const lines = m.text.split('\n').filter((l) => l.startsWith('- '));
    expect(lines).toEqual([
      '- Mon 1 Jul 2030, 07:00–15:00  E (Early)',
      '- Thu 4 Jul 2030, 14:30–22:30  L (Late)',
    ]);
    expect(m.text).toContain('Europe/London');
    expect(m.html).toContain('Ana &lt;b&gt;Reyes&lt;/b&gt;');
    expect(m.html).not.toContain('<b>Reyes');
    expect(m.html).toContain('Ward &amp; Annex');
  });

  it('says so when the person has no shift', () => {
    const m = rosterMail({
      displayName: 'Ana',
      unitName: 'Ward',
      timeZone: 'Europe/London',
      startDate: '2030-07-01',
      days: 7,
      shifts: [],
      link: 'http://rotaplex.test/',
      kind: 'changed',
    });
    expect(m.subject).toMatch(/has changed/);
    expect(m.text).toContain('You have no shifts in this period.');
  });
});
