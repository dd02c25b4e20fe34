import {
  RED_FLAG_MIN_REGISTERED,
  RED_FLAG_SHORTFALL_HOURS,
  RED_FLAG_SHORTFALL_SHARE,
  redFlagRules,
  shiftRedFlags,
} from './safe-staffing';

// Every threshold below is from NICE safe-staffing guideline SG1 (2014, adult inpatient wards), as
// quoted in PRODUCT.md "Safe staffing": "red flags include fewer than 2 registered nurses on a shift,
// or a registered-nurse shortfall of more than 8 hours or 25% of the shift's need". Shift lengths
// (7.5 h day, 11.5 h night paid) are common practice, no source.

const night = { date: '2027-01-09', shiftTypeId: 'n', shiftCode: 'N', shiftName: 'Night', paidMinutes: 690 };
const rn = { skillId: 'rn', skillCode: 'RN', skillName: 'Registered nurse' };

describe('safe-staffing red flags (NICE SG1 2014 via PRODUCT.md)', () => {
  it('keeps the thresholds of the guideline as quoted (NICE SG1 2014 via PRODUCT.md)', () => {
    expect(RED_FLAG_MIN_REGISTERED).toBe(2);
    expect(RED_FLAG_SHORTFALL_HOURS).toBe(8);
    expect(RED_FLAG_SHORTFALL_SHARE).toBe(0.25);
  });

  it('flags fewer than 2 registered nurses on a shift that needs 2 (NICE SG1 2014: "fewer than 2")', () => {
    expect(redFlagRules(2, 1, 450)).toContain('fewerThanTwo');
    expect(redFlagRules(2, 0, 450)).toContain('fewerThanTwo');
    expect(redFlagRules(3, 1, 450)).toContain('fewerThanTwo');
    // 2 on the shift is not fewer than 2, even below a minimum of 3 (1 short of 3 is 33%, that rule flags).
    expect(redFlagRules(3, 2, 450)).not.toContain('fewerThanTwo');
    // Our reading: a shift the ward plans with 1 of the skill is not held to the two-nurse floor.
    expect(redFlagRules(1, 1, 450)).toEqual([]);
  });

  it('flags a shortfall of more than 8 hours, not of exactly 8 (NICE SG1 2014: "more than 8 hours")', () => {
    // 8 needed, 7 on: 1 short (12.5% of the need, under 25%), so only the hours decide.
    expect(redFlagRules(8, 7, 8 * 60)).toEqual([]); // exactly 8 h: not more than 8
    expect(redFlagRules(8, 7, 8 * 60 + 1)).toEqual(['shortfallHours']); // 8 h 1 min
    expect(redFlagRules(8, 7, 690)).toEqual(['shortfallHours']); // an 11.5 h night
    expect(redFlagRules(8, 6, 4 * 60)).toEqual([]); // 2 short of a 4 h shift: exactly 8 h, 25%
    expect(redFlagRules(8, 6, 4 * 60 + 30)).toEqual(['shortfallHours']); // 2 x 4.5 h = 9 h
  });

  it('flags a shortfall of more than 25% of the need, not of exactly 25% (NICE SG1 2014: "25%")', () => {
    // 7.5 h shifts: 1 short is 7.5 h, under 8 h, so only the share decides.
    expect(redFlagRules(4, 3, 450)).toEqual([]); // exactly 25%
    expect(redFlagRules(3, 2, 450)).toEqual(['shortfallShare']); // 33%
    expect(redFlagRules(5, 4, 450)).toEqual([]); // 20%
    expect(redFlagRules(12, 9, 150)).toEqual([]); // 3 of 12: exactly 25%, 7.5 h
    expect(redFlagRules(12, 8, 120)).toEqual(['shortfallShare']); // 4 of 12: 33%, 8 h exactly
  });

  it('finds nothing when the need is met or there is no need', () => {
    expect(redFlagRules(2, 2, 690)).toEqual([]);
    expect(redFlagRules(2, 3, 690)).toEqual([]);
    expect(redFlagRules(0, 0, 690)).toEqual([]);
  });

  it('names every rule a night with 1 of 2 registered nurses breaks, in words', () => {
    const [flag, ...rest] = shiftRedFlags(night, [{ ...rn, need: 2, onShift: 1 }]);
    expect(rest).toEqual([]);
    // 1 short of 2 on an 11.5 h night: fewer than 2, 11.5 h > 8 h, 50% > 25% (NICE SG1 2014 via PRODUCT.md).
    expect(flag.rules).toEqual(['fewerThanTwo', 'shortfallHours', 'shortfallShare']);
    expect(flag.shortHours).toBe(11.5);
    expect(flag.shortShare).toBe(0.5);
    expect(flag.text).toBe(
      'Sat 9 Jan, Night, Registered nurse (RN): 1 on the shift of 2 needed (fewer than 2 on the shift; ' +
        '11.5 h short, more than 8 h; 50% of the need short, more than 25%)',
    );
  });

  it('keeps only the registered skills that break a rule, in the order given', () => {
    const flags = shiftRedFlags(night, [
      { ...rn, need: 2, onShift: 2 },
      { skillId: 'rm', skillCode: 'RM', skillName: 'Registered midwife', need: 4, onShift: 3 },
      { skillId: 'ra', skillCode: 'RA', skillName: 'Registered anaesthetist', need: 2, onShift: 0 },
    ]);
    // RM: 1 short of 4 is exactly 25%, but 11.5 h > 8 h; RA: none of 2.
    expect(flags.map((f) => [f.skillCode, f.rules])).toEqual([
      ['RM', ['shortfallHours']],
      ['RA', ['fewerThanTwo', 'shortfallHours', 'shortfallShare']],
    ]);
  });
});
