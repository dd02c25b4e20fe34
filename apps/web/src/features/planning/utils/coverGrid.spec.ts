import type { CoverPatternRowDto } from '@rotaplex/contracts';
import {
  addLine,
  cellKey,
  copyDay,
  GRID_WEEKDAYS,
  gridFromPattern,
  lineKey,
  patternFromGrid,
  setCell,
} from './coverGrid';

const EARLY = 'shift-early';
const NIGHT = 'shift-night';
const RN = 'skill-rn';

describe('weekly cover grid', () => {
  it('runs Monday to Sunday while keeping JavaScript weekday numbers', () => {
    // ISO 8601 weeks start on Monday; ECMAScript Date.prototype.getDay numbers Sunday 0 … Saturday 6.
    expect(GRID_WEEKDAYS).toEqual([1, 2, 3, 4, 5, 6, 0]);
    // 4 January 2027 is a Monday (ISO 8601 week 1 of 2027 contains 4 January).
    expect(new Date('2027-01-04T00:00:00Z').getUTCDay()).toBe(GRID_WEEKDAYS[0]);
  });

  it('reads a pattern into one line per shift type and skill, in shift type order, "anyone" first', () => {
    const pattern: CoverPatternRowDto[] = [
      { weekday: 1, shiftTypeId: NIGHT, skillId: null, min: 2, target: 2 },
      { weekday: 1, shiftTypeId: EARLY, skillId: RN, min: 1, target: 2 },
      { weekday: 0, shiftTypeId: EARLY, skillId: null, min: 3, target: 4 },
    ];
    const lines = gridFromPattern(pattern, [EARLY, NIGHT]);
    expect(lines.map((l) => lineKey(l.shiftTypeId, l.skillId))).toEqual([
      lineKey(EARLY, null),
      lineKey(EARLY, RN),
      lineKey(NIGHT, null),
    ]);
    expect(lines[0].cells[0]).toEqual({ min: '3', target: '4' });
    expect(lines[0].cells[1]).toEqual({ min: '', target: '' });
  });

  it('turns the grid back into the same rows (round trip)', () => {
    const pattern: CoverPatternRowDto[] = [
      { weekday: 1, shiftTypeId: EARLY, skillId: null, min: 3, target: 4 },
      { weekday: 6, shiftTypeId: EARLY, skillId: RN, min: 1, target: 1 },
    ];
    const { rows, errors } = patternFromGrid(gridFromPattern(pattern, [EARLY]));
    expect(errors).toEqual({});
    expect(rows).toEqual(expect.arrayContaining(pattern));
    expect(rows).toHaveLength(2);
  });

  it('treats an empty target as the minimum and drops cells with no need', () => {
    let lines = addLine([], EARLY, null);
    const key = lineKey(EARLY, null);
    lines = setCell(lines, key, 2, { min: '2' });
    lines = setCell(lines, key, 3, { min: '0', target: '0' });
    lines = setCell(lines, key, 4, { min: '', target: '1' });
    expect(patternFromGrid(lines).rows).toEqual([
      { weekday: 2, shiftTypeId: EARLY, skillId: null, min: 2, target: 2 },
      { weekday: 4, shiftTypeId: EARLY, skillId: null, min: 0, target: 1 },
    ]);
  });

  it('refuses a target below the minimum and anything that is not a whole number, cell by cell', () => {
    let lines = addLine([], NIGHT, RN);
    const key = lineKey(NIGHT, RN);
    lines = setCell(lines, key, 1, { min: '3', target: '2' });
    lines = setCell(lines, key, 5, { min: '1.5' });
    lines = setCell(lines, key, 6, { min: '-1' });
    const { rows, errors } = patternFromGrid(lines);
    expect(rows).toEqual([]);
    expect(Object.keys(errors).sort()).toEqual([cellKey(key, 1), cellKey(key, 5), cellKey(key, 6)].sort());
    expect(errors[cellKey(key, 1)]).toMatch(/target/);
  });

  it('copies one day to the chosen days on every line, leaving the others alone', () => {
    let lines = addLine(addLine([], EARLY, null), NIGHT, null);
    lines = setCell(lines, lineKey(EARLY, null), 1, { min: '4', target: '5' });
    lines = setCell(lines, lineKey(NIGHT, null), 1, { min: '2' });
    lines = setCell(lines, lineKey(EARLY, null), 6, { min: '1' });
    const copied = copyDay(lines, 1, [2, 3, 4, 5]);
    for (const d of [1, 2, 3, 4, 5]) {
      expect(copied[0].cells[d]).toEqual({ min: '4', target: '5' });
      expect(copied[1].cells[d]).toEqual({ min: '2', target: '' });
    }
    expect(copied[0].cells[6]).toEqual({ min: '1', target: '' });
    expect(copied[0].cells[0]).toEqual({ min: '', target: '' });
  });

  it('does not add the same shift type and skill twice', () => {
    const lines = addLine(addLine([], EARLY, RN), EARLY, RN);
    expect(lines).toHaveLength(1);
  });
});
