/** Soft goal: labour cost, weights.labourCost × Σ hourlyCost × paid hours. Model: a cost on each x. */
import type { GoalModule } from '../model/context';

export const labourCost: GoalModule = {
  name: 'labourCost',
  build(ctx) {
    const weight = ctx.weights.labourCost;
    if (weight === 0) return;
    for (let p = 0; p < ctx.index.P; p++) {
      const rate = ctx.problem.people[p].hourlyCost ?? 0;
      if (rate === 0) continue;
      for (let d = 0; d < ctx.index.D; d++) {
        for (let s = 0; s < ctx.index.S; s++) {
          const c = ctx.x(p, d, s);
          if (c >= 0) ctx.builder.addCost(c, (weight * rate * ctx.index.paid[s]) / 60);
        }
      }
    }
  },
  check(index, grid) {
    let total = 0;
    for (let p = 0; p < index.P; p++) {
      const rate = index.problem.people[p].hourlyCost ?? 0;
      for (const s of grid[p]) if (s >= 0) total += (rate * index.paid[s]) / 60;
    }
    return total * index.weights.labourCost;
  },
};
