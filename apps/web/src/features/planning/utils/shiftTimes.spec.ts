import { formatMinutes, shiftTypeFormErrors, summariseShiftTimes } from './shiftTimes';

describe('shift times in the form', () => {
  it('shows a 22:00-07:30 shift as 9 h 30 min, ending the next day, a night shift', () => {
    // Night time includes 00:00-05:00 and a night worker works at least 3 h of it
    // (Directive 2003/88/EC, Art. 2); this shift covers all 5 hours.
    expect(summariseShiftTimes('22:00', '07:30')).toEqual({
      lengthMinutes: 570,
      crossesMidnight: true,
      nightByTimes: true,
    });
  });

  it('shows a 07:00-15:00 early as 8 h on the same day, not a night shift', () => {
    expect(summariseShiftTimes('07:00', '15:00')).toEqual({
      lengthMinutes: 480,
      crossesMidnight: false,
      nightByTimes: false,
    });
  });

  it('does not count a late ending at 02:00 as a night (2 h in 00:00-05:00, fewer than 3)', () => {
    // Directive 2003/88/EC, Art. 2: at least 3 hours of night time.
    expect(summariseShiftTimes('18:00', '02:00')?.nightByTimes).toBe(false);
  });

  it('says nothing until both times are complete', () => {
    expect(summariseShiftTimes('7:00', '15:00')).toBeNull();
    expect(summariseShiftTimes('07:00', '')).toBeNull();
  });

  it('formats minutes for people', () => {
    expect(formatMinutes(450)).toBe('7 h 30 min');
    expect(formatMinutes(480)).toBe('8 h');
    expect(formatMinutes(45)).toBe('45 min');
  });

  it('refuses paid time longer than the shift and names each bad field', () => {
    const errors = shiftTypeFormErrors({
      code: 'early',
      name: ' ',
      start: '07:00',
      end: '15:00',
      paidMinutes: '500',
    });
    expect(Object.keys(errors).sort()).toEqual(['code', 'name', 'paidMinutes']);
    expect(errors.paidMinutes).toMatch(/8 h/);
    expect(
      shiftTypeFormErrors({ code: 'N', name: 'Night', start: '22:00', end: '07:30', paidMinutes: '540' }),
    ).toEqual({});
  });
});
