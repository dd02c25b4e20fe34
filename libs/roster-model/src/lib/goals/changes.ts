/**
 * Soft goal (repair mode): weights.changes per cell that differs from the published roster.
 * Only people and days present in `published` are compared.
 * Model: a published shift s adds w·(1 − x[p,d,s]); a published day off adds w·Σ_s x[p,d,s].
 */
import type { GoalModule, Grid, ProblemIndex } from '../model/context';

function publishedCells(index: ProblemIndex): { p: number; d: number; s: number }[] {
  const out: { p: number; d: number; s: number }[] = [];
  const published = index.problem.published;
  if (!published) return out;
  for (let p = 0; p < index.P; p++) {
    const cells = published[index.personId(p)];
    if (!cells) continue;
    for (let d = 0; d < Math.min(cells.length, index.D); d++) {
      const id = cells[d];
      if (id === undefined) continue;
      const s = id === null || id === '' ? -1 : (index.shiftIndex.get(id) ?? -3);
      if (s === -3) continue; // unknown id: reported by validateProblem
      out.push({ p, d, s });
    }
  }
  return out;
}

export function changedCells(index: ProblemIndex, grid: Grid): number {
  return publishedCells(index).filter(({ p, d, s }) => grid[p][d] !== s).length;
}

export const changes: GoalModule = {
  name: 'changes',
  build(ctx) {
    const w = ctx.weights.changes;
    if (w === 0) return;
    for (const { p, d, s } of publishedCells(ctx.index)) {
      if (s < 0) {
        for (const [c] of ctx.workTerms(p, d)) ctx.builder.addCost(c, w);
      } else {
        ctx.builder.offset += w;
        const c = ctx.x(p, d, s);
        if (c >= 0) ctx.builder.addCost(c, -w);
      }
    }
  },
  check(index, grid) {
    return index.weights.changes * changedCells(index, grid);
  },
};
