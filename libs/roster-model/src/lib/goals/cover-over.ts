/** Soft goal: each person above a need's target costs the need's weightOver (see cover.ts). */
import type { GoalModule } from '../model/context';
import { coverCount, coverGaps, needWeights } from './cover';

export const coverOver: GoalModule = {
  name: 'coverOver',
  build(ctx) {
    ctx.problem.coverNeeds.forEach((need, i) => {
      const row = ctx.coverRow(i);
      const col = ctx.addAux(
        `over_${i}`,
        0,
        Infinity,
        needWeights(ctx.index, need).over,
        { rule: 'coverOver', day: need.day, shiftTypeId: need.shiftTypeId, needIndex: i },
        (g) => coverGaps(need, coverCount(ctx.index, need, g)).over,
      );
      ctx.builder.addToRow(row, col, -1);
    });
  },
  check(index, grid) {
    let total = 0;
    for (const need of index.problem.coverNeeds) {
      total += needWeights(index, need).over * coverGaps(need, coverCount(index, need, grid)).over;
    }
    return total;
  },
};
