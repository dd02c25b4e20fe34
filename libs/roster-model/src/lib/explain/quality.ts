/**
 * The quality statement: one sentence for a manager, from the roster's objective (its total
 * penalty, lower is better), the solver's proven lower bound on any roster's penalty, and the
 * outcome of the solve.
 *
 * "No roster can be more than X% better" is exactly what the bound proves: every roster has a
 * penalty of at least `bound`, so none can improve on `objective` by more than
 * (objective - bound) / objective. X is rounded UP to one decimal so the sentence never claims
 * more than is proved.
 */
import type { SolveStatus } from '../result';

export interface QualityInput {
  status: SolveStatus;
  /** Penalty of the roster returned, null when there is none. */
  objective: number | null;
  /** Proven lower bound on the penalty of every roster, null when unknown. */
  bound: number | null;
}

/** Gaps at or below this (relative) count as proved optimal. */
const PROVEN_TOLERANCE = 1e-6;

/** The share (0.012 = 1.2%) by which a better roster could at most improve on this one, or null. */
export function improvementLimit(objective: number | null, bound: number | null): number | null {
  if (objective === null || bound === null || !Number.isFinite(objective) || !Number.isFinite(bound))
    return null;
  const diff = objective - bound;
  if (diff <= PROVEN_TOLERANCE * Math.max(1, Math.abs(objective))) return 0;
  if (objective <= 0) return null;
  return Math.min(1, diff / objective);
}

/** Percentage rounded up to one decimal ("1.2%"); below 0.1% says "0.1%". */
export function formatPercentUp(share: number): string {
  const tenths = Math.max(1, Math.ceil(share * 1000 - 1e-9));
  const text = (tenths / 10).toFixed(1).replace(/\.0$/, '');
  return `${text}%`;
}

export function qualityStatement({ status, objective, bound }: QualityInput): string {
  if (status === 'infeasible') {
    return 'No roster can meet all the hard rules as they stand; see the conflicting rules below.';
  }
  if (status === 'error') return 'The solve failed before a roster was found.';
  if (objective === null) {
    if (status === 'interrupted') return 'Stopped before a roster was found.';
    if (status === 'timeLimit') return 'Stopped at the time limit before a roster was found.';
    return 'Stopped before a roster was found.';
  }
  const limit = improvementLimit(objective, bound);
  if (limit === 0) return 'Proven best possible roster.';
  const stopped =
    status === 'interrupted'
      ? ' (stopped early)'
      : status === 'timeLimit'
        ? ' (stopped at the time limit)'
        : '';
  if (limit === null) {
    if (objective <= 0 && bound !== null) return `A roster with no penalties at all${stopped}.`;
    return `A roster was found${stopped}, but the solver has not yet proved how close it is to the best possible.`;
  }
  if (limit >= 0.995) {
    return `A roster was found${stopped}, but the solver has not yet proved how close it is to the best possible.`;
  }
  return `No roster can be more than ${formatPercentUp(limit)} better than this one${stopped}.`;
}
