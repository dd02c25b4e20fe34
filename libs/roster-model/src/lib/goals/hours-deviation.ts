/**
 * Soft goal: distance from contracted hours, weights.hoursDeviation per hour of |paid − target|
 * for every person with contract.targetPaidMinutes.
 * Model: Σ paid·x − above + below = target, above, below ≥ 0, cost weight/60 each.
 */
import type { GoalModule } from '../model/context';
import { paidMinutesOf } from '../rules/min-paid-minutes';

export const hoursDeviation: GoalModule = {
  name: 'hoursDeviation',
  build(ctx) {
    const weight = ctx.weights.hoursDeviation;
    if (weight === 0) return;
    for (let p = 0; p < ctx.index.P; p++) {
      const target = ctx.problem.people[p].contract.targetPaidMinutes;
      if (target === undefined) continue;
      const personId = ctx.index.personId(p);
      const above = ctx.addAux(
        `hAbove_${p}`,
        0,
        Infinity,
        weight / 60,
        { rule: 'hoursDeviation', personId },
        (g) => Math.max(0, paidMinutesOf(ctx.index.paid, g[p]) - target),
      );
      const below = ctx.addAux(
        `hBelow_${p}`,
        0,
        Infinity,
        weight / 60,
        { rule: 'hoursDeviation', personId },
        (g) => Math.max(0, target - paidMinutesOf(ctx.index.paid, g[p])),
      );
      ctx.addRow(`hours_${p}`, target, target, [...ctx.paidTerms(p), [above, -1], [below, 1]], {
        rule: 'hoursDeviation',
        personId,
      });
    }
  },
  check(index, grid) {
    let total = 0;
    for (let p = 0; p < index.P; p++) {
      const target = index.problem.people[p].contract.targetPaidMinutes;
      if (target === undefined) continue;
      total += Math.abs(paidMinutesOf(index.paid, grid[p]) - target) / 60;
    }
    return total * index.weights.hoursDeviation;
  },
};
