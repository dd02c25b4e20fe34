import { buildModel } from './build-model';
import { checkRoster } from '../check/checker';
import { InvalidProblemError } from '../check/validate';
import { construct } from '../heuristic/construct';
import type { HighsModelArrays } from './builder';
import { needs, person, problem, roster, solveAndCheck } from './fixtures.test-helpers';
import { randomProblem } from './random.test-helpers';
import { solveDirect, STATUS_OPTIMAL } from './highs.test-helpers';

/** Rows whose activity is outside their bounds for a column vector. */
function brokenRows(a: HighsModelArrays, values: Float64Array): string[] {
  const out: string[] = [];
  for (let i = 0; i < a.numRows; i++) {
    let act = 0;
    for (let k = a.matrix.starts[i]; k < a.matrix.starts[i + 1]; k++)
      act += a.matrix.values[k] * values[a.matrix.indices[k]];
    if (act < a.rowLower[i] - 1e-9 || act > a.rowUpper[i] + 1e-9) out.push(a.rowNames[i]);
  }
  for (let j = 0; j < a.numCols; j++) {
    if (values[j] < a.colLower[j] - 1e-9 || values[j] > a.colUpper[j] + 1e-9) out.push(a.colNames[j]);
  }
  return out;
}

describe('buildModel', () => {
  it('solves random small problems with every rule and goal, and the checker agrees', async () => {
    // solveAndCheck fails on any hard violation or any objective difference between solver and checker.
    for (const seed of [1, 2, 3]) {
      const r = await solveAndCheck(randomProblem(seed));
      expect(r.check.violations).toEqual([]);
    }
  });

  it('encode gives a column vector that satisfies every row for a valid roster, with the checker objective', () => {
    for (const seed of [4, 5]) {
      const p = randomProblem(seed);
      const m = buildModel(p);
      const r = construct(p, { timeLimitMs: 300, seed });
      const check = checkRoster(p, r);
      const values = m.encode(r);
      expect(check.violations).toEqual([]);
      expect(brokenRows(m.arrays, values)).toEqual([]);
      expect(m.objectiveOf(values)).toBeCloseTo(check.objective, 6);
      expect(m.decode(values)).toEqual(r);
    }
  });

  it('the rows catch a hand-planted violation', () => {
    // Five earlies in a row against a maximum of 3: encode keeps the x values, so a maxCons row breaks.
    const p = problem({
      days: 5,
      people: [person('a', { maxConsecutiveWorkDays: 3 })],
      coverNeeds: needs('E', [0, 1, 2, 3, 4]),
    });
    const m = buildModel(p);
    const broken = brokenRows(m.arrays, m.encode(roster({ a: 'EEEEE' })));
    expect(broken).toEqual(['maxCons_0_0', 'maxCons_0_1']);
    const meta = m.rows[m.arrays.rowNames.indexOf('maxCons_0_1')];
    expect(meta).toEqual({ rule: 'maxConsecutiveWorkDays', personId: 'a', day: 1, lastDay: 4 });
  });

  it('elastic mode prices each unit of violation and accepts any roster', async () => {
    // Five earlies in a row against a maximum of 3 → windows days 0-3 and 1-4 each hold 4 > 3:
    // two units of violation at 10,000 each on top of the checker's objective.
    const p = problem({
      days: 5,
      people: [person('a', { maxConsecutiveWorkDays: 3 })],
      coverNeeds: needs('E', [0, 1, 2, 3, 4]),
    });
    const m = buildModel(p, { elastic: 10_000 });
    const bad = roster({ a: 'EEEEE' });
    const values = m.encode(bad);
    expect(brokenRows(m.arrays, values)).toEqual([]);
    expect(m.objectiveOf(values)).toBeCloseTo(checkRoster(p, bad).objective + 20_000, 6);
    // A pin on a leave day: one of the two rows must give way (1,000); covering the early then
    // saves the 100 of the shortfall, so the optimum is 1,000 with a on the early.
    const q = problem({
      days: 1,
      people: [person('a')],
      coverNeeds: needs('E', [0]),
      pins: [{ personId: 'a', day: 0, shiftTypeId: 'E' }],
      absences: [{ personId: 'a', day: 0, kind: 'leave' }],
    });
    const e = buildModel(q, { elastic: 1000 });
    const r = await solveDirect(e.arrays);
    expect(r.status).toBe(STATUS_OPTIMAL);
    expect(r.objective).toBeCloseTo(1000, 6);
    expect(e.decode(r.values)).toEqual({ a: ['E'] });
  });

  it('elastic mode prices minutes rules per longest shift, not per minute', () => {
    // Two days, minimum 960 paid minutes, one early (480) worked: 480 minutes short. The longest
    // shift of the fixtures is the night (540 minutes), so the shortfall costs 1,000 · 480 / 540.
    const p = problem({ days: 2, people: [person('a', { minPaidMinutes: 960 })] });
    const m = buildModel(p, { elastic: 1000 });
    const short = roster({ a: 'E.' });
    const values = m.encode(short);
    expect(brokenRows(m.arrays, values)).toEqual([]);
    expect(m.objectiveOf(values)).toBeCloseTo(checkRoster(p, short).objective + (1000 * 480) / 540, 6);
  });

  it('maps each x column to its person, day and shift type', () => {
    const p = problem({
      days: 2,
      people: [person('a'), person('b')],
      absences: [{ personId: 'a', day: 0, kind: 'leave' }],
    });
    const m = buildModel(p);
    expect(m.x(0, 0, 0)).toBe(-1);
    const c = m.x(1, 1, 2);
    expect(m.columns[c]).toMatchObject({ kind: 'x', personId: 'b', day: 1, shiftTypeId: 'N' });
    expect(m.arrays.colNames[c]).toBe('x_1_1_2');
    // Integrality only on x: 2 people × 2 days × 3 types − 3 blocked = 9 binary columns.
    expect(Array.from(m.arrays.integrality).filter((v) => v === 1)).toHaveLength(9);
  });

  it('rejects an invalid problem with clear errors', () => {
    const p = problem({
      days: 2,
      people: [person('a')],
      coverNeeds: [{ day: 5, shiftTypeId: 'X', skillId: null, min: 2, target: 1 }],
    });
    expect(() => buildModel(p)).toThrow(InvalidProblemError);
    try {
      buildModel(p);
    } catch (e) {
      expect((e as InvalidProblemError).errors).toEqual([
        'cover need 0 (day 5, X): day is outside the period 0…1',
        'cover need 0 (day 5, X): unknown shift type',
        'cover need 0 (day 5, X): min 2 is above target 1',
      ]);
    }
  });
});
