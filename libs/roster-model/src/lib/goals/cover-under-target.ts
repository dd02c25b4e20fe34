/** Soft goal: each person short of a need's target (above its minimum) costs weightUnderTarget (see cover.ts). */
import type { GoalModule } from '../model/context';
import { coverCount, coverGaps, needWeights } from './cover';

export const coverUnderTarget: GoalModule = {
  name: 'coverUnderTarget',
  build(ctx) {
    ctx.problem.coverNeeds.forEach((need, i) => {
      const row = ctx.coverRow(i);
      if (need.target <= need.min) return;
      const col = ctx.addAux(
        `uTgt_${i}`,
        0,
        need.target - need.min,
        needWeights(ctx.index, need).underTarget,
        { rule: 'coverUnderTarget', day: need.day, shiftTypeId: need.shiftTypeId, needIndex: i },
        (g) => coverGaps(need, coverCount(ctx.index, need, g)).underTarget,
      );
      ctx.builder.addToRow(row, col, 1);
    });
  },
  check(index, grid) {
    let total = 0;
    for (const need of index.problem.coverNeeds) {
      total +=
        needWeights(index, need).underTarget * coverGaps(need, coverCount(index, need, grid)).underTarget;
    }
    return total;
  },
};
