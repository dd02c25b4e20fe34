/**
 * Staffing safety: how far a roster falls below the minimum cover, worst first, and the fewest
 * people short of minimum that any roster can have with the same people, leave and rules.
 *
 * The fewest is proved by a second, small integer program: the same model with every goal weighed
 * 0 except one point per person short of a need's minimum. HiGHS starts it from the roster found,
 * so it is never worse than that roster, and its bound (rounded up: the count is a whole number
 * for every 0/1 roster) is a proven floor. When the floor meets the best count found, the count is
 * proved to be the fewest possible.
 *
 * Minimum cover is the trade's safety floor (PRODUCT.md, "Cautions"): the words below name the
 * shortfall, say whether it is avoidable, and leave the decision with the manager and local policy.
 */
import type { CoverNeed, Roster, RosterProblem } from '../problem';
import type { StaffingSafety } from '../result';
import { coverCount } from '../goals/cover';
import { buildModel } from '../model/build-model';
import type { ProblemIndex } from '../model/context';
import type { HighsSession } from '../solve/highs-session';
import { runMip, solverArrays, type MipRunOptions } from '../solve/run-mip';

/** The shortfall below minimum of a roster, counted from the problem alone. */
export function staffingShortfall(
  index: ProblemIndex,
  roster: Roster,
): Omit<StaffingSafety, 'fewestPossible' | 'proven'> {
  const { grid } = index.toGrid(roster);
  let peopleShort = 0;
  let noneOfSkill = 0;
  const shifts = new Set<string>();
  for (const need of index.problem.coverNeeds) {
    const short = Math.max(0, need.min - coverCount(index, need, grid));
    if (short === 0) continue;
    peopleShort += short;
    shifts.add(`${need.day}:${need.shiftTypeId}`);
    if (need.skillId !== null && short === need.min) noneOfSkill++;
  }
  return { peopleShort, shiftsShort: shifts.size, noneOfSkill };
}

/** The problem with one point per person short of a minimum as its only goal. */
export function shortfallOnlyProblem(problem: RosterProblem): RosterProblem {
  return {
    ...problem,
    weights: {
      coverUnderMin: 1,
      coverUnderTarget: 0,
      coverOver: 0,
      requests: 0,
      fairNights: 0,
      fairWeekends: 0,
      hoursDeviation: 0,
      labourCost: 0,
      changes: 0,
    },
    coverNeeds: problem.coverNeeds.map((n): CoverNeed => ({
      ...n,
      weightUnderMin: 1,
      weightUnderTarget: 0,
      weightOver: 0,
    })),
  };
}

/**
 * The staffing safety of `roster` (which meets every hard rule), with the fewest people short any
 * roster can have, proved within `timeLimitSeconds` where HiGHS manages.
 */
export function staffingSafety(
  session: HighsSession,
  index: ProblemIndex,
  roster: Roster,
  timeLimitSeconds: number,
  controls: Pick<MipRunOptions, 'signal' | 'cancelFlag'> = {},
): StaffingSafety {
  const counted = staffingShortfall(index, roster);
  if (counted.peopleShort === 0) return { ...counted, fewestPossible: 0, proven: true };
  if (timeLimitSeconds <= 0) return { ...counted, fewestPossible: null, proven: false };
  const built = buildModel(shortfallOnlyProblem(index.problem));
  const run = runMip(session, solverArrays(built), {
    timeLimitSeconds,
    startValues: built.encode(roster),
    signal: controls.signal,
    cancelFlag: controls.cancelFlag,
  });
  if (run.bound === null) return { ...counted, fewestPossible: null, proven: false };
  const floor = Math.max(0, Math.ceil(run.bound - 1e-6));
  const bestFound = Math.min(counted.peopleShort, run.objective ?? Infinity);
  return { ...counted, fewestPossible: Math.min(floor, bestFound), proven: floor >= bestFound - 1e-9 };
}

/**
 * The staffing safety of `roster` when several solves of the same problem ran side by side (the
 * portfolio): its own shortfall, and the fewest possible from whichever solve proved most. Every
 * solve's floor holds for any roster of the problem, so the highest floor is the best one known; a
 * solve that proved its count gives the fewest exactly.
 */
export function mergedStaffingSafety(
  index: ProblemIndex,
  roster: Roster,
  proofs: (StaffingSafety | null | undefined)[],
): StaffingSafety {
  const counted = staffingShortfall(index, roster);
  if (counted.peopleShort === 0) return { ...counted, fewestPossible: 0, proven: true };
  const known = proofs.filter((s): s is StaffingSafety => !!s && s.fewestPossible !== null);
  const proven = known.find((s) => s.proven);
  if (proven) return { ...counted, fewestPossible: proven.fewestPossible, proven: true };
  if (known.length === 0) return { ...counted, fewestPossible: null, proven: false };
  const floor = Math.max(...known.map((s) => s.fewestPossible as number));
  return {
    ...counted,
    fewestPossible: Math.min(floor, counted.peopleShort),
    proven: floor >= counted.peopleShort,
  };
}

const plural = (n: number, one: string, many: string): string => `${n} ${n === 1 ? one : many}`;

/** The safety in plain words for the manager, with the usual advice; '' when nothing is short. */
export function staffingStatement(safety: StaffingSafety): string {
  if (safety.peopleShort === 0) return '';
  const skill =
    safety.noneOfSkill > 0
      ? `, ${plural(safety.noneOfSkill, 'need has', 'needs have')} nobody with the required skill`
      : '';
  const head =
    `${plural(safety.shiftsShort, 'shift is', 'shifts are')} below minimum staffing ` +
    `(${plural(safety.peopleShort, 'person', 'people')} short${skill}).`;
  const advice = ' Ask for bank or agency staff, or escalate as your local policy says, before publishing.';
  const fewest = safety.fewestPossible;
  if (fewest === null) return head + advice;
  if (safety.proven && fewest === safety.peopleShort) {
    return (
      `${head} With the people, leave and rules you have, no roster can do better than ` +
      `${plural(fewest, 'person', 'people')} short.${advice}`
    );
  }
  if (safety.proven) {
    return (
      `${head} A roster with only ${plural(fewest, 'person', 'people')} short is possible: ` +
      `generate again with more time.${advice}`
    );
  }
  return (
    `${head} With the people, leave and rules you have, at least ` +
    `${plural(fewest, 'person', 'people')} short cannot be avoided.${advice}`
  );
}
