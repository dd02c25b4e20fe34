import { needs, person, problem, solveAndCheck } from '../model/fixtures.test-helpers';
import { buildModel } from '../model/build-model';

describe('rule oneShiftPerDay', () => {
  it('one person cannot cover an early and a late on the same day', async () => {
    // Needs: E and L on day 0, one each (100 per person short). One person can take one of them:
    // optimum = 100 (the other need is short by one).
    const p = problem({
      days: 1,
      people: [person('a')],
      coverNeeds: [...needs('E', [0]), ...needs('L', [0])],
    });
    expect((await solveAndCheck(p)).objective).toBe(100);
  });

  it('writes one row per person and day with two or more possible shifts', () => {
    // 2 people × 3 days, three shift types each possible: 6 rows named one_p_d.
    const m = buildModel(problem({ days: 3, people: [person('a'), person('b')] }));
    expect(m.rows.filter((r) => r.rule === 'oneShiftPerDay')).toHaveLength(6);
  });
});
