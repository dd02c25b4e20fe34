import { type ContractRules } from '@rotaplex/contracts';
import { expandCoverNeeds, periodContract } from './roster-input.service';

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

describe('roster input mapping', () => {
  // Calendar facts (checked with GNU date +%A): 2030-01-07 is a Monday, 2030-01-13 a Sunday.
  const dates = [
    '2030-01-07',
    '2030-01-08',
    '2030-01-09',
    '2030-01-10',
    '2030-01-11',
    '2030-01-12',
    '2030-01-13',
  ];

  it('lays the weekly pattern over the dates by weekday, and a date override replaces its row', () => {
    const pattern = [
      { weekday: 1, shiftTypeId: 'E', skillId: null, min: 3, target: 4 }, // Mondays
      { weekday: 1, shiftTypeId: 'E', skillId: 'rn', min: 1, target: 1 },
      { weekday: 0, shiftTypeId: 'N', skillId: null, min: 2, target: 2 }, // Sundays
    ];
    const overrides = [
      { date: '2030-01-07', shiftTypeId: 'E', skillId: null, min: 5, target: 6 }, // replaces Monday's E/any row
      { date: '2030-01-09', shiftTypeId: 'L', skillId: null, min: 1, target: 2 }, // adds a need on Wednesday
      { date: '2030-01-13', shiftTypeId: 'N', skillId: null, min: 0, target: 0 }, // removes Sunday's need
    ];
    const needs = expandCoverNeeds(pattern, overrides, dates);
    expect(needs).toEqual([
      { day: 0, shiftTypeId: 'E', skillId: null, min: 5, target: 6 },
      { day: 0, shiftTypeId: 'E', skillId: 'rn', min: 1, target: 1 },
      { day: 2, shiftTypeId: 'L', skillId: null, min: 1, target: 2 },
    ]);
  });

  it("scales weekly contract rules to the period and keys shift limits by this unit's shift type ids", () => {
    const rules: ContractRules = {
      ...NONE,
      maxShiftsPerType: { N: 2, X: 1 },
      maxPaidMinutes: 48 * 60, // EU Working Time Directive 2003/88/EC, Art. 6: 48 hours a week
      minRestMinutes: 11 * 60, // Art. 3: 11 consecutive hours of daily rest
      maxWeekends: 2,
    };
    const byCode = new Map([
      ['E', 'id-e'],
      ['N', 'id-n'],
    ]);
    // Four weeks: 4 × 2 nights, 4 × 48 h, 2 weekends in 4 weeks; rest is not scaled. Code X is not in the unit.
    expect(periodContract(rules, 28, byCode)).toEqual({
      maxShiftsPerType: { 'id-n': 8 },
      maxPaidMinutes: 4 * 48 * 60,
      minRestMinutes: 660,
      maxWeekends: 2,
    });
    expect(periodContract({ ...NONE, maxShiftsPerType: { X: 1 } }, 7, byCode)).toEqual({});
  });
});
