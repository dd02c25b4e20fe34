/**
 * The generated ward (ward.ts) through the product's solve path, one seed after another:
 *   npm run bench:ward -- [--people 40] [--days 28] [--seeds 1-5] [--time-limit 30] [--cores 1|2] [--out DIR]
 * Prints one row per seed: size, x columns, objective, bound, gap, seconds to the final roster and
 * the checker's objective terms. With --out, writes `ward-<people>-seed<N>.problem.json` (the
 * problem) and `ward-<people>-seed<N>.json` (the run and its roster) per seed into DIR.
 */
import * as fs from 'node:fs';
import * as path from 'node:path';
import type { RosterProblem } from '../problem';
import type { ObjectiveTermName } from '../result';
import { checkRoster } from '../check/checker';
import { buildModel } from '../model/build-model';
import { sharedSolverPool, TWO_CORE_PORTFOLIO } from '../pool/solver-pool';
import { solveRoster, type RosterSolveResult } from '../solve/solve';
import { formatTable, progressPrinter } from './runner';
import { generateWard } from './ward';

export interface WardCliOptions {
  people: number;
  days: number;
  seeds: number[];
  timeLimitSeconds: number;
  cores: 1 | 2;
  outDir: string | null;
}

const USAGE =
  'Usage: npm run bench:ward -- [--people 40] [--days 28] [--seeds 1-5] [--time-limit 30] [--cores 1|2] [--out DIR]\n' +
  '  seeds: a number, a range like 1-5, or a list like 1,4,7';

/** The objective's terms shown as columns (labourCost and changes are 0 with the default weights). */
export const WARD_TERMS: ObjectiveTermName[] = [
  'coverUnderMin',
  'coverUnderTarget',
  'coverOver',
  'requests',
  'fairNights',
  'fairWeekends',
  'hoursDeviation',
];

export const WARD_HEADER = [
  'seed',
  'size (people×days×types)',
  'x columns',
  'objective',
  'bound',
  'gap',
  's to final',
  's total',
  'status',
  ...WARD_TERMS,
  'hard violations',
];

function parseSeeds(v: string): number[] {
  const seeds: number[] = [];
  for (const part of v.split(',')) {
    const range = /^(\d+)-(\d+)$/.exec(part.trim());
    if (range) for (let n = Number(range[1]); n <= Number(range[2]); n++) seeds.push(n);
    else if (/^\d+$/.test(part.trim())) seeds.push(Number(part.trim()));
    else throw new Error(`--seeds takes numbers and ranges such as 1-5 or 1,4,7, got "${v}".`);
  }
  return seeds;
}

export function parseWardArgs(argv: string[]): WardCliOptions {
  const options: WardCliOptions = {
    people: 40,
    days: 28,
    seeds: [1, 2, 3, 4, 5],
    timeLimitSeconds: 30,
    cores: 1,
    outDir: null,
  };
  const value = (i: number, flag: string): string => {
    const v = argv[i + 1];
    if (v === undefined || v.startsWith('--')) throw new Error(`${flag} needs a value.\n${USAGE}`);
    return v;
  };
  const whole = (v: string, flag: string, least: number): number => {
    const n = Number(v);
    if (!Number.isInteger(n) || n < least)
      throw new Error(`${flag} must be a whole number ≥ ${least}, got "${v}".`);
    return n;
  };
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    if (arg === '--people') options.people = whole(value(i++, arg), arg, 2);
    else if (arg === '--days') options.days = whole(value(i++, arg), arg, 7);
    else if (arg === '--seeds') options.seeds = parseSeeds(value(i++, arg));
    else if (arg === '--out') options.outDir = value(i++, arg);
    else if (arg === '--time-limit') {
      const n = Number(value(i++, arg));
      if (!Number.isFinite(n) || n <= 0)
        throw new Error(`--time-limit must be a positive number, got "${argv[i]}".`);
      options.timeLimitSeconds = n;
    } else if (arg === '--cores') {
      const v = value(i++, arg);
      if (v !== '1' && v !== '2') throw new Error(`--cores is 1 or 2, got "${v}".`);
      options.cores = v === '1' ? 1 : 2;
    } else if (arg === '--help' || arg === '-h') throw new Error(USAGE);
    else throw new Error(`Unknown argument ${arg}.\n${USAGE}`);
  }
  if (options.seeds.length === 0) throw new Error(`No seed given.\n${USAGE}`);
  return options;
}

async function solveWard(
  problem: RosterProblem,
  options: WardCliOptions,
  label: string,
): Promise<RosterSolveResult> {
  const common = {
    timeLimitSeconds: options.timeLimitSeconds,
    explain: false,
    onProgress: progressPrinter(label),
  };
  return options.cores === 1
    ? solveRoster(problem, common)
    : sharedSolverPool().solveRoster(problem, {
        ...common,
        portfolio: options.cores,
        portfolioOptions: TWO_CORE_PORTFOLIO,
      });
}

const num = (n: number | null, digits = 0): string => (n === null ? '–' : n.toFixed(digits));
const term = (n: number): string => String(Math.round(n * 100) / 100);

/** One table row for a seed's run; the terms and violations come from the independent checker. */
export function wardRow(
  seed: number,
  problem: RosterProblem,
  numX: number,
  result: Pick<
    RosterSolveResult,
    'roster' | 'objective' | 'bound' | 'gap' | 'secondsToBest' | 'seconds' | 'status'
  >,
): string[] {
  const check = result.roster ? checkRoster(problem, result.roster) : null;
  return [
    String(seed),
    `${problem.people.length}×${problem.days}×${problem.shiftTypes.length}`,
    String(numX),
    num(check?.objective ?? result.objective, 1),
    num(result.bound, 1),
    result.gap === null ? '–' : `${(result.gap * 100).toFixed(2)}%`,
    num(result.secondsToBest, 1),
    num(result.seconds, 1),
    result.status,
    ...WARD_TERMS.map((t) => (check ? term(check.terms[t]) : '–')),
    check ? String(check.violations.length) : '–',
  ];
}

export async function main(argv: string[]): Promise<number> {
  let options: WardCliOptions;
  try {
    options = parseWardArgs(argv);
  } catch (err) {
    console.error((err as Error).message);
    return 2;
  }
  const rows: string[][] = [];
  let failures = 0;
  for (const seed of options.seeds) {
    const label = `ward ${options.people} seed ${seed}`;
    const problem = generateWard({ people: options.people, days: options.days, seed });
    const numX = buildModel(problem).numX;
    process.stderr.write(
      `${label}: solving (limit ${options.timeLimitSeconds} s, ${options.cores} core(s))…\n`,
    );
    let result: RosterSolveResult;
    try {
      result = await solveWard(problem, options, label);
    } catch (err) {
      failures++;
      console.error(`${label}: ${(err as Error).message}`);
      rows.push([String(seed), ...WARD_HEADER.slice(1, -1).map(() => ''), 'error']);
      continue;
    }
    const row = wardRow(seed, problem, numX, result);
    if (row[row.length - 1] !== '0') failures++;
    rows.push(row);
    if (options.outDir) {
      fs.mkdirSync(options.outDir, { recursive: true });
      const name = `ward-${options.people}-seed${seed}`;
      fs.writeFileSync(
        path.join(options.outDir, `${name}.problem.json`),
        JSON.stringify(problem, null, 2) + '\n',
      );
      const roster: Record<string, string[]> = {};
      for (const [personId, days] of Object.entries(result.roster ?? {}))
        roster[personId] = days.map((s) => s ?? '');
      const json = {
        instance: name,
        objective: result.objective,
        bound: result.bound,
        gap: result.gap,
        status: result.status,
        seconds: result.seconds,
        secondsToBest: result.secondsToBest,
        terms: result.check?.terms ?? null,
        model: result.model,
        roster,
      };
      const file = path.join(options.outDir, `${name}.json`);
      fs.writeFileSync(file, JSON.stringify(json, null, 2) + '\n');
      process.stderr.write(
        `${label}: ${result.status}, objective ${result.objective ?? '–'}; wrote ${file}\n`,
      );
    }
  }
  console.log(formatTable(rows, WARD_HEADER));
  return failures > 0 ? 1 : 0;
}

if (require.main === module) {
  main(process.argv.slice(2)).then(
    (code) => process.exit(code),
    (err: unknown) => {
      console.error(err);
      process.exit(1);
    },
  );
}
