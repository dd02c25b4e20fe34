/**
 * Runs benchmark instances through the product's own solve path (solveRoster: buildModel → HiGHS →
 * checkRoster) and reports each run as a table row and as a JSON file.
 */
import * as fs from 'node:fs';
import * as path from 'node:path';
import type { Roster } from '../problem';
import type { SolveProgress } from '../result';
import type { ModelData } from 'highs';
import { checkRoster } from '../check/checker';
import { solveMip } from '../solve/run-mip';
import { solveRoster, type SolveRosterOptions } from '../solve/solve';
import { sharedSolverPool, TWO_CORE_PORTFOLIO } from '../pool/solver-pool';
import { bestKnownFor, type BestKnown } from './best-known';
import { loadInstance, type LoadedInstance } from './curtois-qu';
import { evaluateBenchmarkRoster } from './evaluate';
import { linearProgramToHighs, textbookModel } from './textbook-model';

export interface BenchRunOptions {
  timeLimitSeconds: number;
  mipRelGap?: number;
  randomSeed?: number;
  /** Start HiGHS from the construction heuristic (the product default) or from nothing. */
  warmStart?: boolean;
  onProgress?: (progress: SolveProgress) => void;
  /**
   * 'product' (default): the product's solve path (buildModel, warm start, HiGHS, checker).
   * 'textbook': the plain SOURCES.md §4 formulation (textbook-model.ts) on the same HiGHS build, as a
   * baseline for what the product's modelling gains.
   */
  model?: 'product' | 'textbook';
  /**
   * Also solve the plain SOURCES.md §4 model with the same time limit at the same time, on the
   * second core (a solver-pool worker), and report it as a column beside the product (one core each).
   */
  besideTextbook?: boolean;
  /** The product path's strategy (default: solveRoster's own default, 'auto'). */
  strategy?: SolveRosterOptions['strategy'];
  /**
   * 1 (default): one solve on this thread. 2: the two-core portfolio in the solver pool
   * (TWO_CORE_PORTFOLIO: the solve as asked on one core, fix-and-optimise on the other, handing each
   * other every better roster).
   */
  cores?: number;
  /** Share of the local search for best-line moves (SolveRosterOptions.lineShare; 0 off). */
  lineShare?: number;
  /** Share of the time after the search for the column-generation bound (SolveRosterOptions.lineBoundShare; 0 off). */
  lineBoundShare?: number;
  /** Rosters from the column-generation bound's lines (SolveRosterOptions.columnRosters). */
  columnRosters?: boolean;
}

interface SolvedRoster {
  status: string;
  roster: Roster | null;
  objective: number | null;
  bound: number | null;
  gap: number | null;
  seconds: number;
  secondsToBest: number | null;
  columns: number;
  rows: number;
}

async function solveTextbook(loaded: LoadedInstance, options: BenchRunOptions): Promise<SolvedRoster> {
  const clockStart = performance.now();
  const model = textbookModel(loaded.instance);
  const arrays = linearProgramToHighs(model.lp);
  const run = await solveMip(arrays as unknown as ModelData, {
    timeLimitSeconds: options.timeLimitSeconds,
    mipRelGap: options.mipRelGap,
    randomSeed: options.randomSeed,
    onProgress: options.onProgress,
    clockStart,
  });
  let roster: Roster | null = null;
  if (run.values) {
    const values: Record<string, number> = {};
    model.lp.columns.forEach((c, j) => (values[c.name] = (run.values as Float64Array)[j]));
    roster = model.decode(values);
  }
  return { ...run, roster, columns: arrays.numCols, rows: arrays.numRows };
}

/** The plain model on a solver-pool worker (the other core), with the benchmark's own evaluation. */
async function solveTextbookBeside(
  loaded: LoadedInstance,
  options: BenchRunOptions,
): Promise<{ objective: number | null; valid: boolean }> {
  const model = textbookModel(loaded.instance);
  const arrays = linearProgramToHighs(model.lp);
  const run = await sharedSolverPool().solveMip(arrays as unknown as ModelData, {
    timeLimitSeconds: options.timeLimitSeconds,
    randomSeed: options.randomSeed,
  });
  if (!run.values) return { objective: null, valid: true };
  const values: Record<string, number> = {};
  model.lp.columns.forEach((c, j) => (values[c.name] = (run.values as Float64Array)[j]));
  const evaluation = evaluateBenchmarkRoster(loaded.instance, model.decode(values));
  return { objective: evaluation.penalty, valid: evaluation.violations.length === 0 };
}

async function solveProduct(loaded: LoadedInstance, options: BenchRunOptions): Promise<SolvedRoster> {
  const common = {
    timeLimitSeconds: options.timeLimitSeconds,
    mipRelGap: options.mipRelGap,
    randomSeed: options.randomSeed,
    warmStart: options.warmStart === false ? null : ('heuristic' as const),
    onProgress: options.onProgress,
    explain: false,
    strategy: options.strategy,
    lineShare: options.lineShare,
    lineBoundShare: options.lineBoundShare,
    columnRosters: options.columnRosters,
  };
  const cores = Math.max(1, Math.floor(options.cores ?? 1));
  const result =
    cores === 1
      ? await solveRoster(loaded.problem, common)
      : await sharedSolverPool().solveRoster(loaded.problem, {
          ...common,
          portfolio: cores,
          portfolioOptions: TWO_CORE_PORTFOLIO,
        });
  return { ...result, columns: result.model.columns, rows: result.model.rows };
}

export interface BenchRun {
  /** File name without .txt, e.g. "Instance3". */
  instance: string;
  file: string;
  staff: number;
  days: number;
  shiftTypes: number;
  columns: number;
  rows: number;
  status: string;
  objective: number | null;
  bound: number | null;
  gap: number | null;
  bestKnown: BestKnown | null;
  /** Seconds until the final objective was first reached. */
  secondsToBest: number | null;
  /** Total seconds, model building included. */
  seconds: number;
  roster: Roster | null;
  /** The product checker's objective and hard-rule violations for the roster. */
  checkerObjective: number | null;
  checkerViolations: number;
  /** The benchmark's own penalty (evaluate.ts, SOURCES.md §4) and violations for the roster. */
  benchmarkPenalty: number | null;
  benchmarkViolations: number;
  /** With `besideTextbook`: the plain model's penalty in the same time (benchmark evaluator), and whether its roster is valid. */
  textbook?: { objective: number | null; valid: boolean };
}

export async function runInstance(ref: string | number, options: BenchRunOptions): Promise<BenchRun> {
  const loaded = loadInstance(ref);
  const { name, file, instance, problem } = loaded;
  if (options.besideTextbook && (options.model === 'textbook' || (options.cores ?? 1) > 1))
    throw new Error('The textbook column runs beside the product on one core each: use it with --cores 1.');
  const beside = options.besideTextbook ? solveTextbookBeside(loaded, options) : null;
  const result =
    options.model === 'textbook' ? await solveTextbook(loaded, options) : await solveProduct(loaded, options);
  const textbook = beside ? await beside : undefined;
  const roster = result.roster;
  const check = roster ? checkRoster(problem, roster) : null;
  const evaluation = roster ? evaluateBenchmarkRoster(instance, roster) : null;
  // Report the checker's exact objective when it agrees with the solver's (which carries rounding noise).
  const objective =
    result.objective !== null &&
    check &&
    Math.abs(check.objective - result.objective) <= 1e-6 * Math.max(1, check.objective)
      ? check.objective
      : result.objective;
  return {
    instance: name,
    file,
    staff: instance.staff.length,
    days: instance.horizon,
    shiftTypes: instance.shifts.length,
    columns: result.columns,
    rows: result.rows,
    status: result.status,
    objective,
    bound: result.bound,
    gap: result.gap,
    bestKnown: bestKnownFor(name),
    secondsToBest: result.secondsToBest,
    seconds: result.seconds,
    roster,
    checkerObjective: check?.objective ?? null,
    checkerViolations: check?.violations.length ?? 0,
    benchmarkPenalty: evaluation?.penalty ?? null,
    benchmarkViolations: evaluation?.violations.length ?? 0,
    textbook,
  };
}

/** The JSON written per instance: `{instance, objective, bound, status, seconds, roster}` plus a few extras. */
export interface BenchJson {
  instance: string;
  objective: number | null;
  bound: number | null;
  status: string;
  seconds: number;
  /** personId → one entry per day: the shift id, or "" for a day off. */
  roster: Record<string, string[]>;
  secondsToBest: number | null;
  gap: number | null;
  bestKnown: number | null;
  model: { columns: number; rows: number };
}

export function toBenchJson(run: BenchRun): BenchJson {
  const roster: Record<string, string[]> = {};
  for (const [personId, days] of Object.entries(run.roster ?? {}))
    roster[personId] = days.map((s) => s ?? '');
  return {
    instance: run.instance,
    objective: run.objective,
    bound: run.bound,
    status: run.status,
    seconds: round(run.seconds, 2),
    roster,
    secondsToBest: run.secondsToBest === null ? null : round(run.secondsToBest, 2),
    gap: run.gap,
    bestKnown: run.bestKnown?.best ?? null,
    model: { columns: run.columns, rows: run.rows },
  };
}

/** Reads the roster back from a JSON file written by `writeBenchJson` ("" → day off). */
export function rosterFromBenchJson(json: Pick<BenchJson, 'roster'>): Roster {
  const roster: Roster = {};
  for (const [personId, days] of Object.entries(json.roster)) {
    if (!Array.isArray(days)) throw new Error(`Roster of ${personId} is not a list of days.`);
    roster[personId] = days.map((s) => (s === '' ? null : String(s)));
  }
  return roster;
}

/** Writes `<instance>.json` into `dir` (created if missing) and returns its path. */
export function writeBenchJson(run: BenchRun, dir: string): string {
  fs.mkdirSync(dir, { recursive: true });
  const file = path.join(dir, `${run.instance}.json`);
  fs.writeFileSync(file, JSON.stringify(toBenchJson(run), null, 2) + '\n');
  return file;
}

function round(n: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(n * f) / f;
}

const num = (n: number | null, digits = 0): string => (n === null ? '–' : n.toFixed(digits));

export const TABLE_HEADER = [
  'instance',
  'size (staff×days×types)',
  'vars',
  'rows',
  'objective',
  'bound',
  'gap',
  'best known',
  'above best',
  's to final',
  's total',
  'status',
];

export function tableRow(run: BenchRun): string[] {
  const best = run.bestKnown?.best ?? null;
  const above =
    best !== null && run.objective !== null ? `${(((run.objective - best) / best) * 100).toFixed(1)}%` : '–';
  const agree =
    run.objective !== null &&
    (run.checkerObjective !== run.objective ||
      run.benchmarkPenalty !== run.objective ||
      run.checkerViolations + run.benchmarkViolations > 0)
      ? ' (CHECK MISMATCH)'
      : '';
  return [
    run.instance,
    `${run.staff}×${run.days}×${run.shiftTypes}`,
    String(run.columns),
    String(run.rows),
    num(run.objective),
    num(run.bound, 1),
    run.gap === null ? '–' : `${(run.gap * 100).toFixed(2)}%`,
    num(best),
    above,
    num(run.secondsToBest, 1),
    num(run.seconds, 1),
    run.status + agree,
  ];
}

/** Columns added by `besideTextbook`. */
export const TEXTBOOK_HEADER = ['textbook beside', 'product ≤ textbook'];

/** The textbook columns of a run: the plain model's penalty, and whether the product did at least as well. */
export function textbookCells(run: BenchRun): string[] {
  const t = run.textbook;
  if (!t) return ['–', '–'];
  const value = t.objective === null ? '–' : `${t.objective}${t.valid ? '' : ' (INVALID)'}`;
  const atLeastAsGood =
    run.objective === null
      ? 'no'
      : t.objective === null || !t.valid || run.objective <= t.objective
        ? 'yes'
        : 'no';
  return [value, atLeastAsGood];
}

/** A Markdown table (also readable in a terminal); `header` defaults to TABLE_HEADER. */
export function formatTable(rows: string[][], header: string[] = TABLE_HEADER): string {
  const all = [header, ...rows];
  const widths = header.map((_, i) => Math.max(...all.map((r) => (r[i] ?? '').length)));
  const line = (r: string[]): string => `| ${r.map((c, i) => (c ?? '').padEnd(widths[i])).join(' | ')} |`;
  return [line(header), `| ${widths.map((w) => '-'.repeat(w)).join(' | ')} |`, ...rows.map(line)].join('\n');
}

/** Prints a progress line to stderr at most every 10 seconds (long runs show they are alive). */
export function progressPrinter(ref: string): (p: SolveProgress) => void {
  let last = 0;
  return (p) => {
    if (p.elapsedSeconds - last < 10) return;
    last = p.elapsedSeconds;
    const gap = p.gap === null ? '–' : `${(p.gap * 100).toFixed(2)}%`;
    process.stderr.write(
      `${ref}: ${p.elapsedSeconds.toFixed(0)} s, best ${p.objective ?? '–'}, bound ${p.bound?.toFixed(1) ?? '–'}, gap ${gap}\n`,
    );
  };
}
