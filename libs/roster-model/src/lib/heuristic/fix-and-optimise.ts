/**
 * Fix-and-optimise (a large-neighbourhood search with the MIP itself): starting from a roster that
 * breaks no hard rule (or any roster, with a model built in elastic mode), repeatedly free the x columns of a neighbourhood (a few people, a window of
 * days, or a few people over a longer window), fix every other x column to the current roster, and
 * let HiGHS solve that much smaller MIP from the current roster. Improvements are kept (after the
 * independent checker agrees), and the neighbourhood size adapts: it grows while sub-problems
 * solve to optimality quickly and shrinks when they hit their time limit.
 *
 * The sub-MIP solver is passed in (solve/ owns the HiGHS instances), so this file stays free of
 * solver plumbing: `solveSub(arrays, { timeLimitSeconds, startValues, randomSeed })`.
 */
import type { Roster } from '../problem';
import { checkRoster } from '../check/checker';
import type { BuiltModel } from '../model/build-model';
import { subModel, type SubModel } from './sub-model';
import { mulberry32 } from '../random';

export interface SubMipResult {
  /** Column values of the best solution found, or null when none. */
  values: ArrayLike<number> | null;
  /** Whether the sub-MIP was solved to proven optimality. */
  optimal: boolean;
}

export type SubMipSolver = (
  arrays: SubModel['arrays'],
  options: { timeLimitSeconds: number; startValues: Float64Array; randomSeed: number },
) => Promise<SubMipResult>;

export interface FixAndOptimiseOptions {
  timeLimitSeconds: number;
  seed?: number;
  /** Time limit of each sub-MIP (default 3 s). */
  subTimeLimitSeconds?: number;
  /** Initial number of free x columns per neighbourhood (default 300). */
  freeColumns?: number;
  /** Stop as soon as this objective is reached (e.g. a proven lower bound). */
  targetObjective?: number;
  signal?: AbortSignal;
  onImprovement?: (roster: Roster, objective: number) => void;
  /**
   * A roster found elsewhere (another solve of the same problem on the other core), asked for before
   * each round. One that meets every hard rule and costs less than the current roster replaces it.
   */
  incoming?: () => Roster | null;
}

export interface FixAndOptimiseResult {
  roster: Roster;
  /** The model's objective of the roster (in an elastic model including the priced violations). */
  objective: number;
  rounds: number;
  improvements: number;
  /** Rosters taken over from `incoming` because they were better. */
  adopted: number;
}

/** x columns of each (person, day). */
function cellColumns(built: BuiltModel): number[][][] {
  const { P, D, S } = built.index;
  const out: number[][][] = [];
  for (let p = 0; p < P; p++) {
    const row: number[][] = [];
    for (let d = 0; d < D; d++) {
      const cols: number[] = [];
      for (let s = 0; s < S; s++) {
        const c = built.x(p, d, s);
        if (c >= 0) cols.push(c);
      }
      row.push(cols);
    }
    out.push(row);
  }
  return out;
}

/** Picks the cells (person, day) to free: a mix of people, day windows and people × windows. */
function neighbourhood(cells: number[][][], target: number, random: () => number): boolean[][] {
  const P = cells.length;
  const D = P ? cells[0].length : 0;
  const free = cells.map((row) => row.map(() => false));
  let count = 0;
  const take = (p: number, d: number) => {
    if (!free[p][d]) {
      free[p][d] = true;
      count += cells[p][d].length;
    }
  };
  const kind = random();
  const all = cells.reduce((n, row) => n + row.reduce((m, c) => m + c.length, 0), 0);
  if (target >= all) {
    for (let p = 0; p < P; p++) for (let d = 0; d < D; d++) take(p, d);
  } else if (kind < 0.4) {
    // whole rows of random people
    const order = [...Array(P).keys()].sort(() => random() - 0.5);
    for (const p of order) {
      if (count >= target) break;
      for (let d = 0; d < D; d++) take(p, d);
    }
  } else if (kind < 0.7) {
    // a window of days for everybody
    const perDay = all / Math.max(1, D);
    const len = Math.max(1, Math.min(D, Math.round(target / Math.max(1, perDay))));
    const d0 = Math.floor(random() * (D - len + 1));
    for (let p = 0; p < P; p++) for (let d = d0; d < d0 + len; d++) take(p, d);
  } else {
    // random people over a window of half the period or more
    const len = Math.max(1, Math.ceil(D * (0.5 + 0.5 * random())));
    const d0 = Math.floor(random() * (D - len + 1));
    const order = [...Array(P).keys()].sort(() => random() - 0.5);
    for (const p of order) {
      if (count >= target) break;
      for (let d = d0; d < d0 + len; d++) take(p, d);
    }
  }
  return free;
}

/**
 * A neighbourhood around people who break hard rules (elastic model): their whole rows, plus a
 * window of days for everybody else, so they can trade shifts with colleagues. Random neighbourhoods
 * rarely pick the one person short of minimum hours among 50 (benchmark instance 11).
 */
function focusedNeighbourhood(
  cells: number[][][],
  target: number,
  random: () => number,
  people: number[],
): boolean[][] {
  const P = cells.length;
  const D = P ? cells[0].length : 0;
  const free = cells.map((row) => row.map(() => false));
  let count = 0;
  const take = (p: number, d: number) => {
    if (!free[p][d]) {
      free[p][d] = true;
      count += cells[p][d].length;
    }
  };
  // One or two of them at a time: all of them at once can make too large a sub-MIP (instance 8:
  // nine people breaking rules after construction, over 1,000 free columns).
  const chosen = [...people].sort(() => random() - 0.5).slice(0, 1 + Math.floor(random() * 2));
  for (const p of chosen) for (let d = 0; d < D; d++) take(p, d);
  // Others over a random window, person by person in random order, until the target is reached.
  const len = Math.max(1, Math.ceil(D * (0.25 + 0.75 * random())));
  const d0 = Math.floor(random() * (D - len + 1));
  const order = [...Array(P).keys()].sort(() => random() - 0.5);
  for (const p of order) {
    if (count >= target) break;
    for (let d = d0; d < d0 + len; d++) take(p, d);
  }
  return free;
}

function violatorsOf(built: BuiltModel, violations: { personId: string }[]): number[] {
  const out = new Set<number>();
  for (const v of violations) {
    const p = built.index.personIndex.get(v.personId);
    if (p !== undefined) out.add(p);
  }
  return [...out];
}

export async function fixAndOptimise(
  built: BuiltModel,
  start: Roster,
  solveSub: SubMipSolver,
  options: FixAndOptimiseOptions,
): Promise<FixAndOptimiseResult> {
  const deadline = Date.now() + options.timeLimitSeconds * 1000;
  const random = mulberry32(options.seed ?? 1);
  const startCheck = checkRoster(built.problem, start, built.index);
  if (startCheck.violations.length && !built.elastic) {
    throw new Error(
      `fix-and-optimise needs a roster without hard violations (found ${startCheck.violations.length}), or an elastic model`,
    );
  }
  let roster = start;
  let violators = violatorsOf(built, startCheck.violations);
  let values = built.encode(start);
  // The model's own objective: the checker's objective plus, in an elastic model, the priced violations.
  let objective = built.objectiveOf(values);
  const cells = cellColumns(built);
  const totalX = built.numX;
  let target = Math.min(options.freeColumns ?? 300, totalX);
  let rounds = 0;
  let improvements = 0;
  let adopted = 0;
  const base = built.arrays;
  while (Date.now() < deadline && !options.signal?.aborted) {
    if (options.incoming) {
      // Let messages from other threads in (a sub-MIP blocks this thread while it runs).
      await new Promise<void>((resolve) => setImmediate(resolve));
      const other = options.incoming();
      if (other) {
        const otherValues = built.encode(other);
        const otherObjective = built.objectiveOf(otherValues);
        if (
          otherObjective < objective - 1e-9 &&
          checkRoster(built.problem, other, built.index).violations.length === 0
        ) {
          roster = other;
          values = otherValues;
          objective = otherObjective;
          violators = [];
          adopted++;
        }
      }
    }
    if (options.targetObjective !== undefined && objective <= options.targetObjective + 1e-9) break;
    rounds++;
    const free =
      violators.length > 0 && random() < 0.6
        ? focusedNeighbourhood(cells, target, random, violators)
        : neighbourhood(cells, target, random);
    const colLower = base.colLower.slice();
    const colUpper = base.colUpper.slice();
    for (let p = 0; p < cells.length; p++) {
      for (let d = 0; d < cells[p].length; d++) {
        if (free[p][d]) continue;
        for (const c of cells[p][d]) {
          colLower[c] = values[c] > 0.5 ? 1 : 0;
          colUpper[c] = colLower[c];
        }
      }
    }
    const left = (deadline - Date.now()) / 1000;
    if (left < 0.2) break;
    // Only the part the free columns can change goes to HiGHS (sub-model.ts).
    const part = subModel({ ...base, colLower, colUpper }, values);
    const sub = await solveSub(part.arrays, {
      timeLimitSeconds: Math.min(options.subTimeLimitSeconds ?? 3, left),
      startValues: part.restrict(values),
      randomSeed: Math.floor(random() * 1e6),
    });
    if (sub.optimal) target = Math.min(totalX, Math.ceil(target * 1.15));
    else target = Math.max(20, Math.floor(target * 0.85));
    if (!sub.values) continue;
    const candidate = built.decode(part.expand(sub.values));
    const candidateValues = built.encode(candidate);
    const candidateObjective = built.objectiveOf(candidateValues);
    if (candidateObjective >= objective - 1e-9) continue;
    const check = checkRoster(built.problem, candidate, built.index);
    if (check.violations.length && !built.elastic) continue;
    roster = candidate;
    violators = violatorsOf(built, check.violations);
    objective = candidateObjective;
    values = candidateValues;
    improvements++;
    options.onImprovement?.(roster, objective);
  }
  return { roster, objective, rounds, improvements, adopted };
}
