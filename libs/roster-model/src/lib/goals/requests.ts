/**
 * Soft goal: shift-on, shift-off and day-off requests, each costing its weight (times
 * weights.requests) when not honoured.
 * Model: shiftOn adds w·(1 − x[p,d,s]) (a constant and a negative cost), shiftOff adds w·x[p,d,s],
 * dayOff adds w·Σ_s x[p,d,s]. No auxiliary columns.
 */
import type { ShiftRequest } from '../problem';
import type { GoalModule, Grid, ProblemIndex } from '../model/context';

/** Whether a request is honoured by a roster (unknown people or shift types count as honoured). */
export function requestHonoured(index: ProblemIndex, r: ShiftRequest, grid: Grid): boolean {
  const p = index.personIndex.get(r.personId);
  if (p === undefined || r.day < 0 || r.day >= index.D) return true;
  const got = grid[p][r.day];
  if (r.kind === 'dayOff') return got < 0;
  const s = r.shiftTypeId === undefined ? undefined : index.shiftIndex.get(r.shiftTypeId);
  if (s === undefined) return true;
  return r.kind === 'shiftOn' ? got === s : got !== s;
}

export const requests: GoalModule = {
  name: 'requests',
  build(ctx) {
    const mult = ctx.weights.requests;
    if (mult === 0) return;
    for (const r of ctx.problem.requests) {
      const p = ctx.index.personIndex.get(r.personId);
      if (p === undefined || r.day < 0 || r.day >= ctx.index.D) continue;
      const w = r.weight * mult;
      if (r.kind === 'dayOff') {
        for (const [c] of ctx.workTerms(p, r.day)) ctx.builder.addCost(c, w);
        continue;
      }
      const s = r.shiftTypeId === undefined ? undefined : ctx.index.shiftIndex.get(r.shiftTypeId);
      if (s === undefined) continue;
      const c = ctx.x(p, r.day, s);
      if (r.kind === 'shiftOn') {
        ctx.builder.offset += w;
        if (c >= 0) ctx.builder.addCost(c, -w);
      } else if (c >= 0) ctx.builder.addCost(c, w);
    }
  },
  check(index, grid) {
    let total = 0;
    for (const r of index.problem.requests) if (!requestHonoured(index, r, grid)) total += r.weight;
    return total * index.weights.requests;
  },
};
