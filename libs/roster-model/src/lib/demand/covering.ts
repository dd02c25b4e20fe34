/**
 * The shift-scheduling covering model (Dantzig's set-covering form of the staffing problem):
 *
 *   minimise   sum_j cost_j x_j + w sum_t s_t
 *   subject to sum_{j covers t} x_j + s_t >= r_t     for every interval t with r_t > 0
 *              sum_{j in group g} x_j <= cap_g       for every capped group (e.g. people per day)
 *              x_j >= 0 integer (people starting candidate j), 0 <= s_t <= r_t (people short)
 *
 * Each person short in one interval costs w, far above any candidate's cost (1,000 times the
 * dearest by default), so the plan is short only where a cap forces it or where no candidate covers
 * the interval at all (a forecast outside every shift's hours); the model is always feasible.
 *
 * `coverShifts` builds the candidates from shift types and days: a shift on day d starting at
 * minute m covers the intervals that lie wholly inside it; one that crosses midnight covers the
 * next morning; with `wrap` the horizon is a cycle (the last night covers the first morning), as
 * for a week pattern repeated.
 */
import type { ModelData } from 'highs';
import { type MipRunResult, solveMip } from '../solve/run-mip';

/**
 * Solves one covering model: by default on this thread's HiGHS session (`solveMip`); a server
 * passes its worker pool's `solveMip` so the request thread stays free.
 */
export type CoveringSolver = (
  data: ModelData,
  options: { timeLimitSeconds: number },
) => Promise<MipRunResult>;

const onThisThread: CoveringSolver = (data, options) => solveMip(data, options);

export interface CoverCandidate {
  /** Interval indices this candidate puts one person on. */
  intervals: readonly number[];
  cost: number;
  /** Index into `groupCaps` (e.g. the day it starts), or undefined for no group. */
  group?: number;
  /** At most this many people start it (default no limit). */
  upper?: number;
}

export interface CoveringProblem {
  /** People required per interval (whole numbers >= 0). */
  requirement: readonly number[];
  candidates: readonly CoverCandidate[];
  /** Most people per group; null or Infinity = no cap. */
  groupCaps?: readonly (number | null)[];
  /** Cost of one person short in one interval. Default 1000 x the dearest candidate. */
  shortCost?: number;
  timeLimitSeconds?: number;
  solver?: CoveringSolver;
}

export interface CoveringResult {
  /** 'optimal', or 'time-limit' etc. with the best plan found (see solve status). */
  status: string;
  /** People starting each candidate. */
  counts: number[];
  /** People on duty per interval. */
  cover: number[];
  /** People short per interval. */
  short: number[];
  /** sum cost x (without the short penalty). */
  cost: number;
  /** Objective including the short penalty. */
  objective: number;
  seconds: number;
}

/** Solves the covering model on HiGHS (the thread's warm session). */
export async function solveCovering(problem: CoveringProblem): Promise<CoveringResult> {
  const started = performance.now();
  const { requirement, candidates } = problem;
  const T = requirement.length;
  requirement.forEach((r, t) => {
    if (!Number.isInteger(r) || r < 0)
      throw new RangeError(`requirement[${t}] must be a whole number >= 0, got ${r}`);
  });
  const caps = problem.groupCaps ?? [];
  // Rows: one per interval that needs someone, then one per capped group.
  const rowOf = new Int32Array(T).fill(-1);
  const rowLower: number[] = [];
  const rowUpper: number[] = [];
  for (let t = 0; t < T; t++) {
    if (requirement[t] > 0) {
      rowOf[t] = rowLower.length;
      rowLower.push(requirement[t]);
      rowUpper.push(Infinity);
    }
  }
  const capRowOf = new Map<number, number>();
  caps.forEach((c, g) => {
    if (c !== null && Number.isFinite(c)) {
      capRowOf.set(g, rowLower.length);
      rowLower.push(-Infinity);
      rowUpper.push(c);
    }
  });
  const rowTerms: number[][] = Array.from({ length: rowLower.length }, () => []);
  const colCost: number[] = [];
  const colUpper: number[] = [];
  const colLower: number[] = [];
  const integrality: (0 | 1)[] = [];
  let dearest = 1;
  candidates.forEach((c, j) => {
    colCost.push(c.cost);
    colLower.push(0);
    colUpper.push(c.upper ?? Infinity);
    integrality.push(1);
    dearest = Math.max(dearest, Math.abs(c.cost));
    for (const t of c.intervals) {
      if (t < 0 || t >= T) throw new RangeError(`candidate ${j} covers interval ${t} outside 0…${T - 1}`);
      if (rowOf[t] >= 0) rowTerms[rowOf[t]].push(j);
    }
    if (c.group !== undefined && capRowOf.has(c.group)) rowTerms[capRowOf.get(c.group)!].push(j);
  });
  const shortCost = problem.shortCost ?? 1000 * dearest;
  const shortCol = new Int32Array(T).fill(-1);
  for (let t = 0; t < T; t++) {
    if (rowOf[t] < 0) continue;
    shortCol[t] = colCost.length;
    colCost.push(shortCost);
    colLower.push(0);
    colUpper.push(requirement[t]);
    integrality.push(0);
    rowTerms[rowOf[t]].push(shortCol[t]);
  }
  const numCols = colCost.length;
  const numRows = rowLower.length;
  const counts = new Array<number>(candidates.length).fill(0);
  const cover = new Array<number>(T).fill(0);
  const short = new Array<number>(T).fill(0);
  if (numRows === 0) {
    return {
      status: 'optimal',
      counts,
      cover,
      short,
      cost: 0,
      objective: 0,
      seconds: (performance.now() - started) / 1000,
    };
  }
  const starts: number[] = [0];
  const indices: number[] = [];
  const values: number[] = [];
  for (const terms of rowTerms) {
    for (const j of terms) {
      indices.push(j);
      values.push(1);
    }
    starts.push(indices.length);
  }
  const data: ModelData = {
    numCols,
    numRows,
    colCost,
    colLower,
    colUpper,
    rowLower,
    rowUpper,
    matrix: { format: 'csr', numRows, numCols, starts, indices, values },
    integrality,
  } as unknown as ModelData;
  const solve = problem.solver ?? onThisThread;
  const run = await solve(data, { timeLimitSeconds: problem.timeLimitSeconds ?? 30 });
  if (!run.values) throw new Error(`The covering model has no solution (${run.modelStatusText})`);
  const x = run.values;
  let cost = 0;
  candidates.forEach((c, j) => {
    const n = Math.round(x[j]);
    counts[j] = n;
    cost += n * c.cost;
    for (const t of c.intervals) cover[t] += n;
  });
  for (let t = 0; t < T; t++) short[t] = Math.max(0, requirement[t] - cover[t]);
  const objective = cost + shortCost * short.reduce((a, b) => a + b, 0);
  return {
    status: run.status === 'optimal' ? 'optimal' : run.status,
    counts,
    cover,
    short,
    cost,
    objective,
    seconds: (performance.now() - started) / 1000,
  };
}

// ---------------------------------------------------------------- shifts over days

export interface CoverShift {
  id: string;
  /** Minutes after midnight the shift starts. */
  startMinute: number;
  /** Length in minutes (up to 24 hours; may run past midnight). */
  lengthMinutes: number;
  /** Cost of one person on the shift (e.g. paid hours). */
  cost: number;
}

export interface ShiftCoverProblem {
  days: number;
  intervalMinutes: number;
  /** People required per interval, days x (1440 / intervalMinutes) long, day-major. */
  requirement: readonly number[];
  shifts: readonly CoverShift[];
  /** Most people starting a shift on any one day; null = no cap. */
  maxPeoplePerDay?: number | null;
  /** upperBounds[day][shift]: at most this many people start that shift that day (default none). */
  upperBounds?: readonly (readonly number[])[];
  /** The horizon is a cycle (the last night covers the first morning). Default true. */
  wrap?: boolean;
  shortCost?: number;
  timeLimitSeconds?: number;
  solver?: CoveringSolver;
}

export interface ShiftCoverResult extends CoveringResult {
  /** people[day][shift index]: people starting that shift that day. */
  people: number[][];
}

/** Intervals (indices within the horizon) a shift starting on `day` covers wholly. */
export function shiftIntervals(
  day: number,
  shift: Pick<CoverShift, 'startMinute' | 'lengthMinutes'>,
  intervalMinutes: number,
  days: number,
  wrap: boolean,
): number[] {
  const perDay = 1440 / intervalMinutes;
  const total = days * perDay;
  const from = day * perDay + Math.ceil(shift.startMinute / intervalMinutes);
  const to = day * perDay + Math.floor((shift.startMinute + shift.lengthMinutes) / intervalMinutes);
  const out: number[] = [];
  for (let t = from; t < to; t++) {
    if (t < total) out.push(t);
    else if (wrap) out.push(t % total);
  }
  return out;
}

/** How many people start each shift each day so every interval is covered at least cost. */
export async function coverShifts(problem: ShiftCoverProblem): Promise<ShiftCoverResult> {
  const { days, intervalMinutes, shifts } = problem;
  if (!Number.isInteger(1440 / intervalMinutes)) throw new RangeError('intervalMinutes must divide a day');
  const perDay = 1440 / intervalMinutes;
  if (problem.requirement.length !== days * perDay)
    throw new RangeError(
      `requirement must have ${days * perDay} intervals, has ${problem.requirement.length}`,
    );
  const wrap = problem.wrap ?? true;
  const candidates: CoverCandidate[] = [];
  for (let d = 0; d < days; d++) {
    for (const [k, s] of shifts.entries()) {
      candidates.push({
        intervals: shiftIntervals(d, s, intervalMinutes, days, wrap),
        cost: s.cost,
        group: d,
        upper: problem.upperBounds?.[d]?.[k],
      });
    }
  }
  const cap = problem.maxPeoplePerDay ?? null;
  const result = await solveCovering({
    requirement: problem.requirement,
    candidates,
    groupCaps: cap === null ? undefined : new Array<number>(days).fill(cap),
    shortCost: problem.shortCost,
    timeLimitSeconds: problem.timeLimitSeconds,
    solver: problem.solver,
  });
  const people = Array.from({ length: days }, (_, d) =>
    shifts.map((_, k) => result.counts[d * shifts.length + k]),
  );
  return { ...result, people };
}
