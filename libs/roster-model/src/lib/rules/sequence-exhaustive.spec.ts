/**
 * Exhaustive check of the run rules' formulations: for one person over 10 days, every one of the
 * 2^10 work patterns is encoded into the model's columns; the rows must all hold exactly when the
 * checker finds no violation. This proves, for these parameters, that the strong forms (start
 * indicators, the K + l windows) cut off no valid roster and let no invalid roster through.
 */
import { buildModel } from '../model/build-model';
import { checkRoster } from '../check/checker';
import type { Contract } from '../problem';
import { person, problem } from '../model/fixtures.test-helpers';

const E = { id: 'E', name: 'Early', start: '07:00', end: '15:00', paidMinutes: 480 };
const DAYS = 10;

function rowsHold(contract: Contract, pattern: number): { rows: boolean; checker: boolean } {
  const p = problem({ days: DAYS, shiftTypes: [E], people: [person('a', contract)] });
  const m = buildModel(p);
  const cells = [...Array(DAYS).keys()].map((d) => ((pattern >> d) & 1 ? 'E' : null));
  const values = m.encode({ a: cells });
  const a = m.arrays;
  let rows = true;
  for (let i = 0; i < a.numRows && rows; i++) {
    let act = 0;
    for (let k = a.matrix.starts[i]; k < a.matrix.starts[i + 1]; k++)
      act += a.matrix.values[k] * values[a.matrix.indices[k]];
    if (act < a.rowLower[i] - 1e-9 || act > a.rowUpper[i] + 1e-9) rows = false;
  }
  return { rows, checker: checkRoster(p, { a: cells }).violations.length === 0 };
}

describe('run rules: model rows hold exactly for the rosters the checker accepts', () => {
  const contracts: Contract[] = [
    { maxConsecutiveWorkDays: 3 },
    { maxConsecutiveWorkDays: 3, minConsecutiveDaysOff: 2 },
    { maxConsecutiveWorkDays: 2, minConsecutiveDaysOff: 3 },
    { maxConsecutiveWorkDays: 4, minConsecutiveDaysOff: 2, minConsecutiveWorkDays: 2 },
    { minConsecutiveWorkDays: 3 },
    { minConsecutiveDaysOff: 2 },
    { minConsecutiveWorkDays: 2, minConsecutiveDaysOff: 3, maxWeekends: 1 },
  ];
  it.each(contracts.map((c) => [JSON.stringify(c), c]))('%s', (_name, contract) => {
    let valid = 0;
    for (let pattern = 0; pattern < 1 << DAYS; pattern++) {
      const r = rowsHold(contract as Contract, pattern);
      if (r.rows !== r.checker)
        throw new Error(
          `pattern ${pattern.toString(2).padStart(DAYS, '0')}: rows ${r.rows}, checker ${r.checker}`,
        );
      if (r.checker) valid++;
    }
    // Sanity: each contract allows some but not all patterns.
    expect(valid).toBeGreaterThan(0);
    expect(valid).toBeLessThan(1 << DAYS);
  });
});
