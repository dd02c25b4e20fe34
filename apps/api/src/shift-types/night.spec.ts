import { isNightByTimes } from '@rotaplex/contracts';
import { isNightShift } from '@rotaplex/roster-model';

/**
 * The shift-type screen (contracts) and the roster model derive "night shift" from the times with
 * two separate implementations of the same rule (EU Working Time Directive 2003/88/EC, Art. 2:
 * at least 3 hours inside 00:00-05:00). They must agree on every start and end time.
 */
describe('night shift rule: contracts and roster model agree', () => {
  it('on every pair of quarter-hour start and end times', () => {
    const times = Array.from({ length: 96 }, (_, i) => {
      const m = i * 15;
      return `${String(Math.floor(m / 60)).padStart(2, '0')}:${String(m % 60).padStart(2, '0')}`;
    });
    const disagreements: string[] = [];
    for (const start of times) {
      for (const end of times) {
        if (isNightByTimes(start, end) !== isNightShift({ start, end }))
          disagreements.push(`${start}-${end}`);
      }
    }
    expect(disagreements).toEqual([]);
  });
});
