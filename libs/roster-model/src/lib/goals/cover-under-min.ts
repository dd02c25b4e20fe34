/** Soft goal: each person short of a need's minimum costs the need's weightUnderMin (see cover.ts). */
import type { GoalModule } from '../model/context';
import { coverCount, coverGaps, needWeights } from './cover';

export const coverUnderMin: GoalModule = {
  name: 'coverUnderMin',
  build(ctx) {
    ctx.problem.coverNeeds.forEach((need, i) => {
      const row = ctx.coverRow(i);
      if (need.min <= 0) return;
      const col = ctx.addAux(
        `uMin_${i}`,
        0,
        need.min,
        needWeights(ctx.index, need).underMin,
        { rule: 'coverUnderMin', day: need.day, shiftTypeId: need.shiftTypeId, needIndex: i },
        (g) => coverGaps(need, coverCount(ctx.index, need, g)).underMin,
      );
      ctx.builder.addToRow(row, col, 1);
    });
  },
  check(index, grid) {
    let total = 0;
    for (const need of index.problem.coverNeeds) {
      total += needWeights(index, need).underMin * coverGaps(need, coverCount(index, need, grid)).underMin;
    }
    return total;
  },
};
