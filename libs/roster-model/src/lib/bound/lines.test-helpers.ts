/**
 * Shared by the specs of the column-generation bound and the rosters made of its lines: small random
 * problems that use every rule and goal of the product, and their optimum as HiGHS proves it for the
 * full MIP of the product's model (build-model.ts).
 */
import { productProblemArb } from '../../external/random-instances.test-helpers';
import type { RosterProblem } from '../problem';
import type { HighsSession } from '../solve/highs-session';
import { type RosterSolveResult, solveRoster } from '../solve/solve';

/** Up to 4 people, 7 or 14 days, up to 3 shift types: the full MIP proves most of them in seconds. */
export const smallProblems = () => productProblemArb({ horizons: [7, 14], maxStaff: 4, maxShiftTypes: 3 });

/** The full MIP from no start for at most 30 s (status 'optimal' when proven). */
export function fullMip(problem: RosterProblem, session: HighsSession): Promise<RosterSolveResult> {
  return solveRoster(problem, {
    strategy: 'mip',
    warmStart: null,
    explain: false,
    staffingCheck: false,
    timeLimitSeconds: 30,
    session,
  });
}
