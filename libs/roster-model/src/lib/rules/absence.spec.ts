import { absence } from './absence';
import { grid, needs, person, problem, solveAndCheck } from '../model/fixtures.test-helpers';
import { buildModel } from '../model/build-model';

describe('rule absence', () => {
  const base = problem({
    days: 2,
    people: [person('a')],
    coverNeeds: needs('E', [0, 1]),
    absences: [{ personId: 'a', day: 1, kind: 'leave' }],
  });

  it('finds a shift on a leave day and names the kind of absence', () => {
    const { index, grid: g } = grid(base, { a: 'EE' });
    const v = absence.check(index, g);
    expect(v).toHaveLength(1);
    expect(v[0].days).toEqual([1]);
    expect(v[0].message).toMatch(/on leave on day 1/);
    expect(absence.check(index, grid(base, { a: 'E.' }).grid)).toEqual([]);
  });

  it('blocks only the listed shift types for a partial unavailability', () => {
    const p = {
      ...base,
      absences: [{ personId: 'a', day: 0, kind: 'unavailable' as const, shiftTypeIds: ['L'] }],
    };
    const { index } = grid(p, {});
    expect(absence.check(index, grid(p, { a: 'L.' }).grid)).toHaveLength(1);
    expect(absence.check(index, grid(p, { a: 'E.' }).grid)).toEqual([]);
  });

  it('the model leaves the leave day uncovered', async () => {
    // Need E on days 0 and 1; the only person is on leave on day 1: optimum 100 (day 1 short).
    expect((await solveAndCheck(base)).objective).toBe(100);
  });

  it('blocked cells have no column', () => {
    const m = buildModel(base);
    // 2 days × 3 shift types = 6 cells, 3 blocked by the whole-day leave.
    expect(m.numX).toBe(3);
  });
});
