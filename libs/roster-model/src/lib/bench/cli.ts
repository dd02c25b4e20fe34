/**
 * Benchmark command line:
 *   npm run bench -- <instances> [--time-limit S] [--out DIR] [--gap G] [--seed N] [--no-warm-start]
 *                    [--model product|textbook] [--strategy auto|mip|fixAndOptimise|mipThenFixAndOptimise]
 *                    [--cores 1|2] [--beside-textbook]
 *                    [--line-share X] [--line-bound-share X] [--no-column-rosters]
 * Instances are numbers 1-24 (InstanceN.txt in $ROTAPLEX_BENCHMARKS_DIR, default
 * ../shared/benchmarks/curtois-qu beside the repository), ranges such as 1-12, or paths to files
 * in the same format. Each instance is solved in turn by the product's solve path; a table is
 * printed and `<file name without .txt>.json` is written per instance into DIR. `--model textbook`
 * solves the plain SOURCES.md §4 formulation instead (a baseline; see textbook-model.ts).
 */
import type { SolveRosterOptions } from '../solve/solve';
import {
  formatTable,
  progressPrinter,
  runInstance,
  TABLE_HEADER,
  tableRow,
  TEXTBOOK_HEADER,
  textbookCells,
  writeBenchJson,
  type BenchRun,
} from './runner';

interface CliOptions {
  instances: string[];
  timeLimitSeconds: number;
  outDir: string | null;
  mipRelGap?: number;
  randomSeed?: number;
  warmStart: boolean;
  model: 'product' | 'textbook';
  strategy?: SolveRosterOptions['strategy'];
  cores: number;
  /** Solve the plain model beside the product and add its column (one core each). */
  besideTextbook?: boolean;
  lineShare?: number;
  lineBoundShare?: number;
  columnRosters?: boolean;
}

const STRATEGIES = ['auto', 'mip', 'fixAndOptimise', 'mipThenFixAndOptimise'];

const USAGE =
  'Usage: npm run bench -- <instances> [--time-limit S] [--out DIR] [--gap G] [--seed N] [--no-warm-start]\n' +
  '       [--model product|textbook] [--strategy auto|mip|fixAndOptimise|mipThenFixAndOptimise] [--cores 1|2]\n' +
  '       [--beside-textbook] [--line-share X (share of the search for best-line moves, 0 off)]\n' +
  '       [--line-bound-share X (share of the time after the search for the column-generation bound, 0 off)]\n' +
  '       [--no-column-rosters (no dive or line MIP after the column-generation bound)]\n' +
  '  instances: numbers 1-24, ranges like 1-12, or paths to instance files';

export function parseArgs(argv: string[]): CliOptions {
  const options: CliOptions = {
    instances: [],
    timeLimitSeconds: 60,
    outDir: null,
    warmStart: true,
    model: 'product',
    cores: 1,
  };
  const value = (i: number, flag: string): string => {
    const v = argv[i + 1];
    if (v === undefined || v.startsWith('--')) throw new Error(`${flag} needs a value.\n${USAGE}`);
    return v;
  };
  const positive = (v: string, flag: string): number => {
    const n = Number(v);
    if (!Number.isFinite(n) || n <= 0) throw new Error(`${flag} must be a positive number, got "${v}".`);
    return n;
  };
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    if (arg === '--time-limit') options.timeLimitSeconds = positive(value(i++, arg), arg);
    else if (arg === '--out') options.outDir = value(i++, arg);
    else if (arg === '--gap') options.mipRelGap = Number(value(i++, arg));
    else if (arg === '--seed') options.randomSeed = Number(value(i++, arg));
    else if (arg === '--no-warm-start') options.warmStart = false;
    else if (arg === '--beside-textbook') options.besideTextbook = true;
    else if (arg === '--line-share') options.lineShare = Math.min(1, Math.max(0, Number(value(i++, arg))));
    else if (arg === '--no-column-rosters') options.columnRosters = false;
    else if (arg === '--line-bound-share')
      options.lineBoundShare = Math.min(1, Math.max(0, Number(value(i++, arg))));
    else if (arg === '--cores') {
      const v = value(i++, arg);
      if (v !== '1' && v !== '2') throw new Error(`--cores is 1 or 2, got "${v}".`);
      options.cores = Number(v);
    } else if (arg === '--strategy') {
      const st = value(i++, arg);
      if (!STRATEGIES.includes(st))
        throw new Error(`--strategy is one of ${STRATEGIES.join(', ')}, got "${st}".`);
      options.strategy = st as SolveRosterOptions['strategy'];
    } else if (arg === '--model') {
      const m = value(i++, arg);
      if (m !== 'product' && m !== 'textbook') throw new Error(`--model is product or textbook, got "${m}".`);
      options.model = m;
    } else if (arg === '--help' || arg === '-h') throw new Error(USAGE);
    else if (arg.startsWith('--')) throw new Error(`Unknown option ${arg}.\n${USAGE}`);
    else {
      const range = /^(\d+)-(\d+)$/.exec(arg);
      if (range) {
        for (let n = Number(range[1]); n <= Number(range[2]); n++) options.instances.push(String(n));
      } else options.instances.push(arg);
    }
  }
  if (options.instances.length === 0) throw new Error(`No instance given.\n${USAGE}`);
  return options;
}

export async function main(argv: string[]): Promise<number> {
  let options: CliOptions;
  try {
    options = parseArgs(argv);
  } catch (err) {
    console.error((err as Error).message);
    return 2;
  }
  const rows: string[][] = [];
  let failures = 0;
  for (const ref of options.instances) {
    process.stderr.write(`${ref}: solving (limit ${options.timeLimitSeconds} s)…\n`);
    let run: BenchRun;
    try {
      run = await runInstance(ref, {
        timeLimitSeconds: options.timeLimitSeconds,
        mipRelGap: options.mipRelGap,
        randomSeed: options.randomSeed,
        warmStart: options.warmStart,
        model: options.model,
        strategy: options.strategy,
        cores: options.cores,
        besideTextbook: options.besideTextbook,
        lineShare: options.lineShare,
        lineBoundShare: options.lineBoundShare,
        columnRosters: options.columnRosters,
        onProgress: progressPrinter(ref),
      });
    } catch (err) {
      failures++;
      console.error(`${ref}: ${(err as Error).message}`);
      rows.push([String(ref), ...TABLE_HEADER.slice(1, -1).map(() => ''), 'error']);
      continue;
    }
    const row = options.besideTextbook ? [...tableRow(run), ...textbookCells(run)] : tableRow(run);
    if (row[row.length - 1].includes('MISMATCH')) failures++;
    rows.push(row);
    if (options.outDir) {
      const file = writeBenchJson(run, options.outDir);
      process.stderr.write(`${ref}: ${run.status}, objective ${run.objective ?? '–'}; wrote ${file}\n`);
    }
  }
  console.log(
    formatTable(rows, options.besideTextbook ? [...TABLE_HEADER, ...TEXTBOOK_HEADER] : TABLE_HEADER),
  );
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
