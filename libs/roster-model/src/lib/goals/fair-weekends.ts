/**
 * Soft goal: spread of worked weekends, weights.fairWeekends × (most − fewest worked weekends)
 * over all people. Nothing with fewer than two people or no weekend in the period.
 */
import type { GoalModule, Grid, ProblemIndex } from '../model/context';
import { buildSpread } from './spread';

function weekendsWorked(index: ProblemIndex, g: Grid, p: number): number {
  return index.weekends.filter((days) => days.some((d) => g[p][d] >= 0)).length;
}

export const fairWeekends: GoalModule = {
  name: 'fairWeekends',
  build(ctx) {
    const weight = ctx.weights.fairWeekends;
    const K = ctx.index.weekends.length;
    if (weight === 0 || ctx.index.P < 2 || K === 0) return;
    const people = [...Array(ctx.index.P).keys()];
    buildSpread(
      ctx,
      'fairWeekends',
      'wkends',
      weight,
      people,
      (p) =>
        [...Array(K).keys()]
          .filter((k) => ctx.index.weekends[k].some((d) => ctx.workTerms(p, d).length > 0))
          .map((k) => [ctx.weekendVar(p, k, true), 1] as [number, number]),
      (g, p) => weekendsWorked(ctx.index, g, p),
    );
  },
  check(index, grid) {
    if (index.weights.fairWeekends === 0 || index.P < 2 || index.weekends.length === 0) return 0;
    const counts = [...Array(index.P).keys()].map((p) => weekendsWorked(index, grid, p));
    return index.weights.fairWeekends * (Math.max(...counts) - Math.min(...counts));
  },
};
