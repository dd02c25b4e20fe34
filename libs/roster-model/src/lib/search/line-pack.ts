/**
 * The best roster made of given lines: the master problem over people's lines (bound/line-master.ts)
 * with whole lines, solved by HiGHS as a MIP (one 0/1 column per person and line, the cover and
 * fairness rows coupling them). Fed with the lines the column-generation bound generated
 * (bound/line-bound.ts), this is the construction known as price-and-branch: the master's lines are
 * those a near-optimal roster is made of, and choosing one per person is a small set-partitioning
 * problem that HiGHS solves far faster than the full model.
 *
 * Every line keeps every rule of its person (the pricing returns only such lines, and the start's
 * lines are checked), and every hard rule of the product is a rule of one person, so any roster it
 * returns keeps every hard rule; its objective is the master's, the roster's objective exactly.
 */
import type { ProblemIndex } from '../model/context';
import type { HighsSession } from '../solve/highs-session';
import { isCancelled, runMip } from '../solve/run-mip';
import { LineMaster, type PersonLine } from '../bound/line-master';
import { LineCost } from './line-cost';

export interface LinePackOptions {
  /** Wall-clock limit of the MIP in seconds. */
  timeLimitSeconds: number;
  /** A roster to start from (person-major, D days each, -1 off): its lines join the pool. */
  start?: Int16Array | null;
  randomSeed?: number;
  signal?: AbortSignal;
  cancelFlag?: Int32Array;
  /** The LineCost to score lines with (default: a new one). */
  cost?: LineCost;
}

export interface LinePackResult {
  /** The roster (person-major, -1 off), or null when the MIP found none in time. */
  grid: Int16Array | null;
  objective: number | null;
  /** The MIP's proven bound over these lines (not a bound on every roster). */
  bound: number | null;
  optimal: boolean;
  /** Distinct lines the MIP chose among. */
  lines: number;
  seconds: number;
}

export function linePack(
  index: ProblemIndex,
  session: HighsSession,
  pool: readonly PersonLine[],
  options: LinePackOptions,
): LinePackResult {
  const t0 = performance.now();
  const { P, D } = index;
  const master = new LineMaster(index, options.cost ?? new LineCost(index));
  // Distinct lines only (the pricing can return a line twice across rounds).
  const lines: PersonLine[] = [];
  const seen = new Map<string, number>();
  const add = (person: number, line: Int16Array): number => {
    const key = `${person}:${line.join(',')}`;
    let k = seen.get(key);
    if (k === undefined) {
      k = lines.push({ person, line }) - 1;
      seen.set(key, k);
    }
    return k;
  };
  let chosen: number[] | null = null;
  if (options.start) {
    chosen = [];
    for (let p = 0; p < P && chosen; p++) {
      const line = options.start.slice(p * D, p * D + D);
      if (master.scoreLine(p, line).hard === 0) chosen.push(add(p, line));
      else chosen = null;
    }
  }
  for (const { person, line } of pool) add(person, line);
  const result: LinePackResult = {
    grid: null,
    objective: null,
    bound: null,
    optimal: false,
    lines: lines.length,
    seconds: 0,
  };
  const covered = new Uint8Array(P);
  for (const { person } of lines) covered[person] = 1;
  if (covered.some((c) => c === 0) || isCancelled(options)) return result;

  const model = master.model(lines, true);
  const run = runMip(session, model, {
    timeLimitSeconds: options.timeLimitSeconds,
    startValues: chosen ? master.values(lines, chosen) : undefined,
    randomSeed: options.randomSeed,
    signal: options.signal,
    cancelFlag: options.cancelFlag,
    clockStart: t0,
  });
  result.seconds = (performance.now() - t0) / 1000;
  result.bound = run.bound;
  result.optimal = run.status === 'optimal';
  if (!run.values) return result;
  const grid = new Int16Array(P * D).fill(-1);
  const taken: number[] = [];
  lines.forEach(({ person, line }, k) => {
    if (run.values![master.slackColumns + k] < 0.5) return;
    grid.set(line, person * D);
    taken.push(k);
  });
  if (taken.length !== P) return result;
  result.grid = grid;
  // The roster's own objective: an incumbent that is not optimal may hold slack columns above their
  // cheapest values for its lines.
  const values = master.values(lines, taken);
  let objective = 0;
  for (let j = 0; j < values.length; j++) objective += model.colCost[j] * values[j];
  result.objective = objective;
  return result;
}
