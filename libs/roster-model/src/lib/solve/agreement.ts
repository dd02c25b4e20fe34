/**
 * The solve's own safety net: every roster it returns is checked by the independent checker
 * (check/checker.ts), and any disagreement with the solver is a bug that fails loudly.
 */
import type { CheckResult } from '../result';

/** The solver returned a roster that the independent checker rejects: a bug, never a user error. */
export class SolverCheckError extends Error {
  constructor(
    message: string,
    readonly check: CheckResult,
    readonly solverObjective: number,
  ) {
    super(message);
    this.name = 'SolverCheckError';
  }
}

/** Compare the checker's verdict on a solver roster with the solver's own objective; throw on any disagreement. */
export function assertCheckerAgrees(check: CheckResult, solverObjective: number, tolerance?: number): void {
  if (check.violations.length > 0) {
    const shown = check.violations
      .slice(0, 5)
      .map((v) => v.message)
      .join('; ');
    throw new SolverCheckError(
      `Solver/checker disagreement: the solver's roster breaks ${check.violations.length} hard rule(s): ${shown}`,
      check,
      solverObjective,
    );
  }
  const allowed = tolerance ?? 1e-6 * Math.max(1, Math.abs(solverObjective));
  if (!(Math.abs(check.objective - solverObjective) <= allowed)) {
    throw new SolverCheckError(
      `Solver/checker disagreement: the solver reports objective ${solverObjective} but the checker computes ${check.objective} (terms ${JSON.stringify(check.terms)})`,
      check,
      solverObjective,
    );
  }
}
