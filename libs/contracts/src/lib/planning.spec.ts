import {
  CONTRACT_PRESETS,
  contractForPeriod,
  type ContractRules,
  isNightByTimes,
  shiftLengthMinutes,
  WORKING_TIME_CAUTION,
} from './planning';

const NONE: ContractRules = {
  maxShiftsPerType: null,
  minPaidMinutes: null,
  maxPaidMinutes: null,
  targetPaidMinutes: null,
  maxConsecutiveWorkDays: null,
  minConsecutiveWorkDays: null,
  minConsecutiveDaysOff: null,
  maxWeekends: null,
  maxConsecutiveNights: null,
  minRestMinutes: null,
};

describe('shift times', () => {
  it('measures shifts that cross midnight', () => {
    expect(shiftLengthMinutes('07:00', '15:00')).toBe(480);
    expect(shiftLengthMinutes('22:00', '07:30')).toBe(570);
    expect(shiftLengthMinutes('08:00', '08:00')).toBe(1440);
  });

  // EU Working Time Directive 2003/88/EC, Art. 2: night time includes 00:00-05:00; a night worker
  // works at least 3 hours of night time.
  it.each([
    ['22:00', '07:30', true], // 5 h in 00:00-05:00
    ['21:00', '03:00', true], // exactly 3 h
    ['21:00', '02:59', false], // 2 h 59 min
    ['02:00', '04:00', false], // 2 h only
    ['03:00', '11:00', false], // 2 h
    ['07:00', '15:00', false],
    ['14:30', '22:30', false],
  ])('%s-%s is a night shift by its times: %s', (start, end, night) => {
    expect(isNightByTimes(start, end)).toBe(night);
  });
});

describe('contract rules for a period', () => {
  it('scales per-week hours and shift counts, keeps run lengths and rest', () => {
    // 37.5 paid hours a week is a common full-time week (common practice); 4 weeks = 150 h = 9000 min.
    const rules: ContractRules = {
      ...NONE,
      targetPaidMinutes: 2250,
      minPaidMinutes: 1800,
      maxPaidMinutes: 2880,
      maxShiftsPerType: { N: 4 },
      maxWeekends: 2,
      maxConsecutiveWorkDays: 6,
      minRestMinutes: 660,
    };
    expect(contractForPeriod(rules, 28)).toEqual({
      targetPaidMinutes: 9000,
      minPaidMinutes: 7200,
      maxPaidMinutes: 11520, // 48 h x 4 weeks (EU WTD Art. 6 limit applied week by week)
      maxShiftsPerType: { N: 16 },
      maxWeekends: 2,
      maxConsecutiveWorkDays: 6,
      minRestMinutes: 660,
    });
    // 10 days = 10/7 weeks: maxima round down, minima up, the target to the nearest minute.
    expect(contractForPeriod(rules, 10)).toMatchObject({
      maxPaidMinutes: 4114, // 2880 x 10 / 7 = 4114.29
      minPaidMinutes: 2572, // 1800 x 10 / 7 = 2571.43
      targetPaidMinutes: 3214, // 2250 x 10 / 7 = 3214.29
      maxShiftsPerType: { N: 5 }, // 4 x 10 / 7 = 5.71
      maxWeekends: 0, // 2 x 10 / 28 = 0.71
    });
    expect(contractForPeriod(NONE, 28)).toEqual({});
  });
});

describe('working-time presets', () => {
  it('state the limits of their sources and carry the caution', () => {
    const eu = CONTRACT_PRESETS.find((p) => p.key === 'eu-wtd')!;
    // Directive 2003/88/EC: Art. 3 daily rest 11 h; Art. 6 average week at most 48 h.
    expect(eu.rules.minRestMinutes).toBe(11 * 60);
    expect(eu.rules.maxPaidMinutes).toBe(48 * 60);
    expect(eu.basis).toMatch(/Art\. 3/);
    // UK Working Time Regulations 1998: 48 h average week.
    expect(CONTRACT_PRESETS.find((p) => p.key === 'uk-wtr')!.rules.maxPaidMinutes).toBe(48 * 60);
    // PRODUCT.md "Cautions shown in the product".
    expect(WORKING_TIME_CAUTION).toMatch(/not legal advice/);
    expect(WORKING_TIME_CAUTION).toMatch(/collective agreements/);
    expect(CONTRACT_PRESETS.every((p) => p.caution === WORKING_TIME_CAUTION)).toBe(true);
  });
});
