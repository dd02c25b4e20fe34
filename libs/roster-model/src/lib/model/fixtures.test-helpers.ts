/**
 * Small hand-made problems for unit tests (invented data, each test works out its expected values
 * in a comment), and a helper that solves a problem with HiGHS directly and checks the result with
 * the independent checker.
 */
import type { Contract, CoverNeed, Person, Roster, RosterProblem, ShiftType } from '../problem';
import type { CheckResult } from '../result';
import { checkRoster } from '../check/checker';
import { buildModel } from './build-model';
import { solveDirect, STATUS_INFEASIBLE, STATUS_OPTIMAL } from './highs.test-helpers';
import { ProblemIndex, type Grid } from './context';

export const EARLY: ShiftType = { id: 'E', name: 'Early', start: '07:00', end: '15:00', paidMinutes: 480 };
export const LATE: ShiftType = { id: 'L', name: 'Late', start: '14:00', end: '22:00', paidMinutes: 480 };
export const NIGHT: ShiftType = { id: 'N', name: 'Night', start: '22:00', end: '07:00', paidMinutes: 540 };

export function person(id: string, contract: Contract = {}, extra: Partial<Person> = {}): Person {
  return { id, name: id.toUpperCase(), skills: [], contract, ...extra };
}

/** A problem starting Monday 2 March 2026 in UTC with the three shift types above. */
export function problem(
  over: Partial<RosterProblem> & Pick<RosterProblem, 'days' | 'people'>,
): RosterProblem {
  return {
    startDate: '2026-03-02',
    timeZone: 'UTC',
    shiftTypes: [EARLY, LATE, NIGHT],
    coverNeeds: [],
    requests: [],
    absences: [],
    forbiddenSuccessions: [],
    pins: [],
    ...over,
  };
}

/** One need per listed day: `target` people on `shiftTypeId`, min 0, default weights (100 under, 1 over). */
export function needs(
  shiftTypeId: string,
  days: number[],
  target = 1,
  extra: Partial<CoverNeed> = {},
): CoverNeed[] {
  return days.map((day) => ({ day, shiftTypeId, skillId: null, min: 0, target, ...extra }));
}

/** Roster from strings, one character per day ('.' = day off), e.g. { a: 'EE.N' }. */
export function roster(rows: Record<string, string>): Roster {
  const out: Roster = {};
  for (const [id, cells] of Object.entries(rows)) out[id] = [...cells].map((c) => (c === '.' ? null : c));
  return out;
}

export function grid(p: RosterProblem, rows: Record<string, string>): { index: ProblemIndex; grid: Grid } {
  const index = new ProblemIndex(p);
  return { index, grid: index.toGrid(roster(rows)).grid };
}

export interface Solved {
  objective: number;
  roster: Roster;
  check: CheckResult;
}

/**
 * Builds the model, solves it to optimality with HiGHS, decodes the roster and checks it.
 * Fails the test if the solver does not prove optimality, if the checker finds a hard violation,
 * or if checker and solver disagree on the objective.
 */
export async function solveAndCheck(p: RosterProblem): Promise<Solved> {
  const model = buildModel(p);
  const r = await solveDirect(model.arrays);
  if (r.status !== STATUS_OPTIMAL) throw new Error(`HiGHS status ${r.status}, expected optimal`);
  const solved = model.decode(r.values);
  const check = checkRoster(p, solved);
  if (check.violations.length)
    throw new Error(`checker found: ${check.violations.map((v) => v.message).join('; ')}`);
  if (Math.abs(check.objective - r.objective) > 1e-6) {
    throw new Error(`checker objective ${check.objective} differs from solver objective ${r.objective}`);
  }
  // The roster encoded back must give the same objective through the model's own arrays.
  const enc = model.encode(solved);
  if (Math.abs(model.objectiveOf(enc) - check.objective) > 1e-6) {
    throw new Error(`encoded objective ${model.objectiveOf(enc)} differs from checker ${check.objective}`);
  }
  return { objective: check.objective, roster: solved, check };
}

/** Whether HiGHS finds the model infeasible. */
export async function isInfeasible(p: RosterProblem): Promise<boolean> {
  const r = await solveDirect(buildModel(p).arrays);
  return r.status === STATUS_INFEASIBLE;
}
