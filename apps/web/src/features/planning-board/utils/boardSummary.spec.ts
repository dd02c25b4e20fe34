import {
  CONTRACT_PRESETS,
  type ContractDto,
  type CoverNeedsDto,
  type ShiftTypeDto,
} from '@rotaplex/contracts';
import { coverState, hoursAgainstContract, hoursText, needFor } from './boardSummary';

const shift = (id: string, paidMinutes: number): ShiftTypeDto => ({
  id,
  unitId: 'u',
  code: id,
  name: id,
  start: '07:00',
  end: '15:00',
  paidMinutes,
  colour: 'teal',
  night: null,
});

describe('cover against needs', () => {
  const needs: CoverNeedsDto = {
    unitId: 'u',
    pattern: [{ weekday: 1, shiftTypeId: 'E', skillId: null, min: 2, target: 3 }],
    overrides: [{ id: 'o', date: '2027-01-11', shiftTypeId: 'E', skillId: null, min: 1, target: 1 }],
  };
  it('takes the weekly pattern by weekday and lets a date override replace it', () => {
    // Gregorian calendar: 4 and 11 January 2027 are Mondays (weekday 1, JavaScript numbering).
    expect(needFor(needs, '2027-01-04', 'E', null)).toEqual({ min: 2, target: 3 });
    expect(needFor(needs, '2027-01-11', 'E', null)).toEqual({ min: 1, target: 1 });
    expect(needFor(needs, '2027-01-05', 'E', null)).toBeNull();
    expect(needFor(needs, '2027-01-04', 'E', 'skill')).toBeNull();
  });
  it('names short, below target, met and over against the minimum and target (common practice)', () => {
    const need = { min: 2, target: 3 };
    expect([1, 2, 3, 4].map((n) => coverState(n, need))).toEqual(['short', 'belowTarget', 'met', 'over']);
    expect(coverState(5, null)).toBe('none');
  });
});

describe('hours against contract', () => {
  const eu = CONTRACT_PRESETS.find((p) => p.key === 'eu-wtd')!;
  const contract: ContractDto = { id: 'c', unitId: null, name: 'EU', ...eu.rules };
  const types = new Map([['E', shift('E', 450)]]);
  it('holds four weeks to 4 x 48 h, the EU Working Time Directive 2003/88/EC Art. 6 weekly limit', () => {
    const cells = Array.from({ length: 28 }, (_, i) => ({ shiftTypeId: i < 26 ? 'E' : null }));
    const line = hoursAgainstContract(cells, types, contract, 28);
    expect(line.max).toBe(4 * 48 * 60);
    // 26 shifts of 7 h 30 min = 195 h, over 192 h.
    expect(line.paidMinutes).toBe(26 * 450);
    expect(line.state).toBe('over');
    expect(hoursAgainstContract(cells.slice(0, 7), types, contract, 7).state).toBe('over');
    expect(
      hoursAgainstContract(cells.slice(0, 6).concat([{ shiftTypeId: null }]), types, contract, 7).state,
    ).toBe('within');
  });
  it('reports people without a contract as such', () => {
    expect(hoursAgainstContract([{ shiftTypeId: 'E' }], types, undefined, 7)).toMatchObject({
      paidMinutes: 450,
      state: 'noContract',
    });
    expect(hoursText(450)).toBe('7 h 30 min');
  });
});
