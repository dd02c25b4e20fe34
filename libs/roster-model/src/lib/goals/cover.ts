/**
 * Shared parts of the three cover goals. Each need (day, shift type, skill) has one balance row
 *   Σ x (people with the skill on that shift) + uMin + uTarget − over = target
 * with uMin ∈ [0, min] (coverUnderMin), uTarget ∈ [0, target − min] (coverUnderTarget) and
 * over ≥ 0 (coverOver). Because a need's minimum shortfall never costs less than its target
 * shortfall (validateProblem), the cheapest slacks are exactly the shortfalls below.
 */
import type { CoverNeed } from '../problem';
import type { Grid, ProblemIndex } from '../model/context';

/** Number of people counted towards a need in a roster. */
export function coverCount(index: ProblemIndex, need: CoverNeed, grid: Grid): number {
  const s = index.shiftIndex.get(need.shiftTypeId);
  if (s === undefined) return 0;
  let n = 0;
  for (let p = 0; p < index.P; p++) {
    if (grid[p][need.day] !== s) continue;
    if (need.skillId === null || index.skills[p].has(need.skillId)) n++;
  }
  return n;
}

export function needWeights(
  index: ProblemIndex,
  need: CoverNeed,
): { underMin: number; underTarget: number; over: number } {
  return {
    underMin: need.weightUnderMin ?? index.weights.coverUnderMin,
    underTarget: need.weightUnderTarget ?? index.weights.coverUnderTarget,
    over: need.weightOver ?? index.weights.coverOver,
  };
}

/** Shortfall below the minimum, shortfall between minimum and target, and surplus above target. */
export function coverGaps(
  need: CoverNeed,
  count: number,
): { underMin: number; underTarget: number; over: number } {
  const underMin = Math.max(0, need.min - count);
  const underTarget = Math.max(0, need.target - count) - underMin;
  return { underMin, underTarget, over: Math.max(0, count - need.target) };
}
