import type { SwapCellChangeDto } from '@rotaplex/contracts';
import { changeSummary, dayLabel, statusColour } from './swapText';

const change = (
  name: string,
  date: string,
  before: string | null,
  after: string | null,
): SwapCellChangeDto => ({
  staffMemberId: name,
  staffName: name,
  date,
  beforeShiftTypeId: before,
  beforeShiftCode: before,
  afterShiftTypeId: after,
  afterShiftCode: after,
});

describe('swap texts', () => {
  // 4 January 2027 is a Monday (ISO 8601 calendar; from memory, checked against Date in any runtime).
  it('names the weekday of a calendar date without a time zone shift', () => {
    expect(dayLabel('2027-01-04')).toBe('Mon 4 Jan');
  });

  it('says who works what after the change and leaves out cells that become days off', () => {
    expect(
      changeSummary([
        change('Ann', '2027-01-04', 'E', null),
        change('Ann', '2027-01-06', null, 'L'),
        change('Bo', '2027-01-06', 'L', null),
        change('Bo', '2027-01-04', null, 'E'),
      ]),
    ).toBe('Ann works L on Wed 6 Jan; Bo works E on Mon 4 Jan');
  });

  it('colours statuses by outcome', () => {
    expect(statusColour('approved')).toBe('success');
    expect(statusColour('refused')).toBe('danger');
  });
});
