import type { AssignmentGridDto } from '@rotaplex/contracts';
import { draftContents, replaceWarning } from './draftContents';

const grid = (cells: [string | null, boolean][][]): AssignmentGridDto => ({
  rosterPeriodId: 'p',
  dates: ['2030-01-07', '2030-01-08'],
  rows: cells.map((row, i) => ({
    staffMemberId: `s${i}`,
    name: `Person ${i}`,
    cells: row.map(([shiftTypeId, pinned]) => ({ shiftTypeId, pinned })),
  })),
  check: { violations: [], terms: {}, objective: 0 },
});

describe('draftContents', () => {
  it('counts unpinned shifts as replaced and every pin (a shift or a day off) as kept', () => {
    const contents = draftContents(
      grid([
        [
          ['E', false],
          ['L', true],
        ],
        [
          [null, true],
          ['N', false],
        ],
        [
          [null, false],
          [null, false],
        ],
      ]),
    );
    expect(contents).toEqual({ replaced: 2, pinned: 2 });
  });

  it('finds nothing to replace in an empty draft or before the grid has loaded', () => {
    expect(draftContents(grid([[[null, false]]]))).toEqual({ replaced: 0, pinned: 0 });
    expect(draftContents(undefined)).toEqual({ replaced: 0, pinned: 0 });
  });

  it('says what is replaced and that pins are kept', () => {
    expect(replaceWarning({ replaced: 2, pinned: 2 })).toBe(
      'Generate replaces the 2 shifts of this draft that are not pinned, including changes made by hand. The 2 pinned cells stay as they are.',
    );
    expect(replaceWarning({ replaced: 1, pinned: 1 })).toMatch(
      /the 1 shift of .* The 1 pinned cell stays as it is\.$/,
    );
    expect(replaceWarning({ replaced: 5, pinned: 0 })).toMatch(/Pin a cell first to keep it/);
  });
});
