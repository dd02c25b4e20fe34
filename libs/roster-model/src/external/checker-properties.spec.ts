/**
 * Property tests (fast-check, fixed seeds so a failure can be replayed):
 * - every roster the solver returns passes the independent checker (no hard-rule violation, the
 *   same objective), on random problems that use every rule and goal of the product;
 * - every violation planted by hand (random rule, random person, random day) is caught by the
 *   checker, which agrees rule by rule and person by person with a second evaluator written from
 *   the benchmark's own definition (../shared/benchmarks/curtois-qu/SOURCES.md §4).
 */
import fc from 'fast-check';
import { checkRoster } from '../lib/check/checker';
import { toRosterProblem } from '../lib/bench/curtois-qu';
import { evaluateBenchmarkRoster } from '../lib/bench/evaluate';
import { solveRoster } from '../lib/solve/solve';
import {
  benchInstanceArb,
  PLANTABLE_RULES,
  plantViolation,
  productProblemArb,
  rosterArb,
} from './random-instances.test-helpers';

function ruleSet(violations: { rule: string; personId?: string; staffId?: string }[]): string[] {
  return [...new Set(violations.map((v) => `${v.rule} ${v.personId ?? v.staffId}`))].sort();
}

describe('checker properties', () => {
  it('every solver roster passes the checker (random problems with every rule and goal)', async () => {
    let withRoster = 0;
    await fc.assert(
      fc.asyncProperty(
        productProblemArb({ horizons: [7, 14], maxStaff: 4, maxShiftTypes: 3 }),
        async (problem) => {
          // solveRoster itself throws when checker and solver disagree; the checks below repeat it
          // from outside so that a silently skipped comparison would also be caught.
          const result = await solveRoster(problem, { timeLimitSeconds: 10, explain: false });
          if (result.roster === null) {
            expect(['infeasible', 'timeLimit']).toContain(result.status);
            return;
          }
          withRoster++;
          const check = checkRoster(problem, result.roster);
          expect(check.violations).toEqual([]);
          expect(check.objective).toBeCloseTo(result.objective as number, 6);
          if (result.bound !== null) expect(result.bound).toBeLessThanOrEqual(check.objective + 1e-6);
        },
      ),
      { seed: 20260301, numRuns: 25 },
    );
    // the generator must produce mostly solvable problems, or the property says little
    expect(withRoster).toBeGreaterThanOrEqual(10);
  });

  it('every violation planted by hand is caught, and the checker agrees with the benchmark definition', () => {
    const caseArb = benchInstanceArb({ horizons: [7, 14, 21], maxStaff: 4 }).chain((inst) =>
      fc.record({
        inst: fc.constant(inst),
        roster: rosterArb(inst),
        rule: fc.constantFrom(...PLANTABLE_RULES),
        person: fc.integer({ min: 0, max: inst.staff.length - 1 }),
        day: fc.integer({ min: 0, max: inst.horizon - 1 }),
      }),
    );
    let planted = 0;
    fc.assert(
      fc.property(caseArb, ({ inst, roster, rule, person, day }) => {
        const problem = toRosterProblem(inst);
        // on any random roster, both checkers see the same broken rules and the same penalty
        expect(ruleSet(checkRoster(problem, roster).violations)).toEqual(
          ruleSet(evaluateBenchmarkRoster(inst, roster).violations),
        );
        const staffId = inst.staff[person].id;
        const edited = plantViolation(inst, roster, rule, staffId, day);
        if (edited === null) return; // this person's rules make the violation impossible
        planted++;
        const check = checkRoster(problem, edited);
        const ev = evaluateBenchmarkRoster(inst, edited);
        expect(ruleSet(check.violations)).toContain(`${rule} ${staffId}`);
        expect(ruleSet(check.violations)).toEqual(ruleSet(ev.violations));
        expect(check.objective).toBe(ev.penalty);
      }),
      { seed: 4242, numRuns: 400 },
    );
    expect(planted).toBeGreaterThanOrEqual(200);
  });
});
