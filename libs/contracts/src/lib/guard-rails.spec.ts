import {
  contractCautions,
  hoursAndMinutes,
  loweredToZeroCautions,
  PRESET_LIMITS,
  shiftTypeCautions,
  withinPresets,
} from './guard-rails';
import { CONTRACT_PRESETS } from './planning';

describe('guard rails', () => {
  it('takes the loosest limits of the working-time presets (EU Working Time Directive 2003/88/EC, Art. 3, 5, 6)', () => {
    expect(PRESET_LIMITS).toEqual({ minRestMinutes: 660, maxPaidMinutes: 2880, maxConsecutiveWorkDays: 6 });
    for (const p of CONTRACT_PRESETS) expect(withinPresets(p.rules)).toBe(true);
  });

  it('names each limit beyond the presets with its risk', () => {
    const words = contractCautions({ minRestMinutes: 120, maxPaidMinutes: 5400, maxConsecutiveWorkDays: 21 });
    expect(words).toHaveLength(3);
    expect(words[0]).toMatch(/^Rest between shifts of 2 h is less than the 11 h .*fatigue/);
    expect(words[1]).toMatch(/^Up to 90 h a week is more than the 48 h .*ill health/);
    expect(words[2]).toMatch(/^Up to 21 working days in a row is more than the 6/);
    expect(
      contractCautions({ minRestMinutes: null, maxPaidMinutes: 2880, maxConsecutiveWorkDays: 6 })[0],
    ).toMatch(/^No minimum rest between shifts/);
    expect(
      contractCautions({ minRestMinutes: 660, maxPaidMinutes: 2880, maxConsecutiveWorkDays: 6 }),
    ).toEqual([]);
  });

  it('cautions on shifts over 12 hours only', () => {
    expect(shiftTypeCautions({ start: '19:00', end: '07:00' })).toEqual([]);
    expect(shiftTypeCautions({ start: '19:00', end: '07:15' })[0]).toMatch(
      /lasts 12 h 15 min, more than 12 h/,
    );
    expect(shiftTypeCautions({ start: '08:00', end: '08:00' })[0]).toMatch(/lasts 24 h/);
  });

  it('words hours and minutes without a sign', () => {
    expect([hoursAndMinutes(30), hoursAndMinutes(-30), hoursAndMinutes(660), hoursAndMinutes(570)]).toEqual([
      '30 min',
      '30 min',
      '11 h',
      '9 h 30 min',
    ]);
  });

  it('finds minimums lowered to 0 or dropped, not those raised or already 0', () => {
    const row = (day: number, min: number, skillId: string | null = null) => ({
      day,
      shiftTypeId: 'n',
      skillId,
      min,
    });
    const out = loweredToZeroCautions(
      [row(0, 2), row(1, 1), row(2, 0), row(3, 1), row(4, 1, 'rn')],
      [row(0, 0), row(2, 0), row(3, 2), row(4, 1, 'rn')],
      (r) => `Night on day ${r.day}`,
    );
    expect(out.map((c) => c.split(' had')[0])).toEqual(['Night on day 0', 'Night on day 1']);
    expect(out[0]).toMatch(/had a minimum of 2 and now has none/);
  });
});
