/**
 * The independent checker: recomputes every hard-rule violation and every objective term of a
 * roster from the problem alone, with each rule's and goal's own check() (never the solver).
 */
import type { Roster, RosterProblem } from '../problem';
import type { CheckResult, ObjectiveBreakdown, Violation } from '../result';
import { GOALS } from '../goals';
import { ProblemIndex } from '../model/context';
import { RULES } from '../rules';

export function checkRoster(
  problem: RosterProblem,
  roster: Roster,
  index = new ProblemIndex(problem),
): CheckResult {
  const { grid, unknown } = index.toGrid(roster);
  const violations: Violation[] = [...unknown];
  for (const rule of RULES) violations.push(...rule.check(index, grid));
  const terms = {} as ObjectiveBreakdown;
  let objective = 0;
  for (const goal of GOALS) {
    const v = goal.check(index, grid);
    terms[goal.name] = v;
    objective += v;
  }
  return { violations, terms, objective };
}
