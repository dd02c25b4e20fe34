import { coverOver } from './cover-over';
import { coverUnderMin } from './cover-under-min';
import { coverUnderTarget } from './cover-under-target';
import { grid, needs, person, problem, solveAndCheck } from '../model/fixtures.test-helpers';

describe('cover goals', () => {
  // One need: min 2, target 3 early on day 0; default weights 1000 per person under min,
  // 100 under target, 1 over.
  const p = problem({
    days: 1,
    people: [
      person('a', {}, { skills: ['rn'] }),
      person('b'),
      person('c', {}, { skills: ['rn'] }),
      person('d', {}, { skills: ['rn'] }),
    ],
    coverNeeds: [{ day: 0, shiftTypeId: 'E', skillId: 'rn', min: 2, target: 3 }],
  });

  it('split a shortfall into below-minimum and below-target parts', () => {
    const { index } = grid(p, {});
    // Only a (rn) and b (no rn) on E: 1 counted. Short of min by 1 (1000), short of target by 2,
    // of which 1 is below the minimum → 1 × 100.
    const g = grid(p, { a: 'E', b: 'E' }).grid;
    expect(coverUnderMin.check(index, g)).toBe(1000);
    expect(coverUnderTarget.check(index, g)).toBe(100);
    expect(coverOver.check(index, g)).toBe(0);
    // a, c, d with rn: 3 = target → all zero.
    const full = grid(p, { a: 'E', c: 'E', d: 'E' }).grid;
    expect(
      coverUnderMin.check(index, full) + coverUnderTarget.check(index, full) + coverOver.check(index, full),
    ).toBe(0);
  });

  it('counts people above target', () => {
    const q = problem({
      days: 1,
      people: [person('a'), person('b'), person('c')],
      coverNeeds: needs('E', [0], 1),
    });
    const { index } = grid(q, {});
    expect(coverOver.check(index, grid(q, { a: 'E', b: 'E', c: 'E' }).grid)).toBe(2);
  });

  it('uses the weights of the need when given', () => {
    const q = problem({
      days: 1,
      people: [person('a')],
      coverNeeds: [
        {
          day: 0,
          shiftTypeId: 'E',
          skillId: null,
          min: 1,
          target: 2,
          weightUnderMin: 7,
          weightUnderTarget: 3,
        },
      ],
    });
    const { index, grid: g } = grid(q, { a: '.' });
    expect(coverUnderMin.check(index, g)).toBe(7);
    expect(coverUnderTarget.check(index, g)).toBe(3);
  });

  it('the model puts the people with the skill on the shift', async () => {
    // Three rn people available for min 2 / target 3: all covered → 0.
    expect((await solveAndCheck(p)).objective).toBe(0);
  });

  it('the model reports the shortfall when too few people have the skill', async () => {
    // Only a has rn: counted 1 → 1000 (below min) + 100 (below target beyond min) = 1100.
    const q = { ...p, people: [person('a', {}, { skills: ['rn'] }), person('b')] };
    const r = await solveAndCheck(q);
    expect(r.objective).toBe(1100);
    expect(r.check.terms.coverUnderMin).toBe(1000);
    expect(r.check.terms.coverUnderTarget).toBe(100);
  });
});
