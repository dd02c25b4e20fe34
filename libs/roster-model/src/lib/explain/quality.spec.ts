/**
 * The quality statement's wording. "No roster can be more than X% better" must follow from the
 * bound: every roster's penalty is at least `bound`, so the best possible improvement on
 * `objective` is (objective − bound) / objective, rounded UP so the sentence never overstates.
 */
import { formatPercentUp, improvementLimit, qualityStatement } from './quality';

describe('qualityStatement', () => {
  it('says a roster is proven best when objective and bound meet', () => {
    expect(qualityStatement({ status: 'optimal', objective: 607, bound: 607 })).toBe(
      'Proven best possible roster.',
    );
    // Solver bounds carry floating-point noise: 606.9999999 still proves 607.
    expect(qualityStatement({ status: 'optimal', objective: 607, bound: 606.9999999 })).toBe(
      'Proven best possible roster.',
    );
  });

  it('states the most a better roster could improve, rounded up to one decimal', () => {
    // (1000 − 988) / 1000 = 1.2% exactly.
    expect(qualityStatement({ status: 'timeLimit', objective: 1000, bound: 988 })).toBe(
      'No roster can be more than 1.2% better than this one (stopped at the time limit).',
    );
    // (1000 − 987.7) / 1000 = 1.23% → rounded up to 1.3%, never down to 1.2%.
    expect(qualityStatement({ status: 'feasible', objective: 1000, bound: 987.7 })).toBe(
      'No roster can be more than 1.3% better than this one.',
    );
    // A gap smaller than 0.1% still reads 0.1%.
    expect(qualityStatement({ status: 'optimal', objective: 10000, bound: 9999 })).toBe(
      'No roster can be more than 0.1% better than this one.',
    );
    expect(qualityStatement({ status: 'interrupted', objective: 200, bound: 150 })).toBe(
      'No roster can be more than 25% better than this one (stopped early).',
    );
  });

  it('says when no roster was found, or no useful bound is known', () => {
    expect(qualityStatement({ status: 'interrupted', objective: null, bound: null })).toBe(
      'Stopped before a roster was found.',
    );
    expect(qualityStatement({ status: 'timeLimit', objective: null, bound: 12 })).toBe(
      'Stopped at the time limit before a roster was found.',
    );
    expect(qualityStatement({ status: 'interrupted', objective: 50, bound: null })).toMatch(
      /not yet proved how close/,
    );
    expect(qualityStatement({ status: 'timeLimit', objective: 50, bound: 0 })).toMatch(
      /not yet proved how close/,
    );
    expect(qualityStatement({ status: 'infeasible', objective: null, bound: null })).toMatch(
      /No roster can meet all the hard rules/,
    );
  });

  it('rounds shares up to tenths of a percent', () => {
    expect(formatPercentUp(0.012)).toBe('1.2%');
    expect(formatPercentUp(0.01201)).toBe('1.3%');
    expect(formatPercentUp(0.25)).toBe('25%');
    expect(formatPercentUp(0.00001)).toBe('0.1%');
    expect(improvementLimit(100, 100)).toBe(0);
    expect(improvementLimit(100, 90)).toBeCloseTo(0.1, 12);
  });
});
