import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { main, parseArgs } from './cli';
import { parseCurtoisQu } from './curtois-qu';
import { evaluateBenchmarkRoster } from './evaluate';
import { rosterFromBenchJson } from './runner';

// A made-up instance in the benchmark's file format (SOURCES.md §3), small enough to solve in a
// moment; it exercises the command end to end with a path instead of an instance number.
const SMALL = `SECTION_HORIZON
7

SECTION_SHIFTS
E,480,
L,480,E

SECTION_STAFF
A,E=7|L=7,2880,960,5,2,2,1
B,E=7|L=0,2880,960,5,2,2,1
C,E=0|L=7,2880,960,5,1,1,1

SECTION_DAYS_OFF
A,3

SECTION_SHIFT_ON_REQUESTS
A,0,E,2
C,6,L,1

SECTION_SHIFT_OFF_REQUESTS
B,1,E,3

SECTION_COVER
0,E,1,100,1
1,E,1,100,1
2,L,2,100,1
5,L,1,100,1
6,E,1,100,1
`;

describe('bench command', () => {
  let dir: string;
  beforeEach(() => {
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'rotaplex-cli-'));
  });
  afterEach(() => {
    fs.rmSync(dir, { recursive: true, force: true });
    jest.restoreAllMocks();
  });

  it('reads instances, ranges and options', () => {
    expect(parseArgs(['1', '3-5', 'x/Instance9.txt', '--time-limit', '60', '--out', '/tmp/o'])).toEqual({
      instances: ['1', '3', '4', '5', 'x/Instance9.txt'],
      timeLimitSeconds: 60,
      outDir: '/tmp/o',
      warmStart: true,
      model: 'product',
      cores: 1,
    });
    expect(parseArgs(['2', '--model', 'textbook', '--no-warm-start'])).toMatchObject({
      model: 'textbook',
      warmStart: false,
    });
    expect(() => parseArgs(['1', '--model', 'fancy'])).toThrow(/--model is product or textbook/);
    expect(parseArgs(['1', '--strategy', 'mip']).strategy).toBe('mip');
    expect(() => parseArgs(['1', '--strategy', 'guess'])).toThrow(/--strategy is one of auto, mip/);
    expect(parseArgs(['1']).cores).toBe(1);
    expect(parseArgs(['1', '--cores', '2']).cores).toBe(2);
    expect(() => parseArgs(['1', '--cores', '3'])).toThrow(/--cores is 1 or 2/);
    expect(() => parseArgs([])).toThrow(/No instance given/);
    expect(() => parseArgs(['1', '--time-limit'])).toThrow(/--time-limit needs a value/);
    expect(() => parseArgs(['1', '--time-limit', '-3'])).toThrow(/positive number/);
    expect(() => parseArgs(['1', '--fast'])).toThrow(/Unknown option --fast/);
  });

  it('solves a file, prints the table and writes <name>.json with the roster', async () => {
    const file = path.join(dir, 'Small.txt');
    fs.writeFileSync(file, SMALL);
    const printed: string[] = [];
    jest.spyOn(console, 'log').mockImplementation((s: string) => void printed.push(s));
    jest.spyOn(process.stderr, 'write').mockImplementation(() => true);

    const code = await main([file, '--time-limit', '20', '--out', path.join(dir, 'out')]);

    expect(code).toBe(0);
    const table = printed.join('\n');
    expect(table).toMatch(/\| instance +\| size \(staff×days×types\) \| vars/);
    expect(table).toMatch(/\| Small +\| 3×7×2 /);
    const json = JSON.parse(fs.readFileSync(path.join(dir, 'out', 'Small.json'), 'utf8'));
    expect(json).toMatchObject({ instance: 'Small', status: 'optimal' });
    expect(Object.keys(json.roster).sort()).toEqual(['A', 'B', 'C']);
    expect(json.roster.A).toHaveLength(7);
    expect(json.roster.A.every((s: string) => ['', 'E', 'L'].includes(s))).toBe(true);
    // the written roster meets the benchmark rules and scores the reported objective (SOURCES.md §4)
    const ev = evaluateBenchmarkRoster(parseCurtoisQu(SMALL), rosterFromBenchJson(json));
    expect(ev.violations).toEqual([]);
    expect(ev.penalty).toBe(json.objective);
    expect(json.bound).toBeLessThanOrEqual(json.objective);
  });

  it('the textbook baseline (SOURCES.md §4 formulation) reaches the same optimum as the product model', async () => {
    const file = path.join(dir, 'Small.txt');
    fs.writeFileSync(file, SMALL);
    jest.spyOn(console, 'log').mockImplementation(() => undefined);
    jest.spyOn(process.stderr, 'write').mockImplementation(() => true);
    const results: { objective: number; status: string; roster: Record<string, string[]> }[] = [];
    for (const model of ['product', 'textbook']) {
      const outDir = path.join(dir, model);
      expect(await main([file, '--time-limit', '20', '--out', outDir, '--model', model])).toBe(0);
      results.push(JSON.parse(fs.readFileSync(path.join(outDir, 'Small.json'), 'utf8')));
    }
    expect(results.map((r) => r.status)).toEqual(['optimal', 'optimal']);
    expect(results[1].objective).toBe(results[0].objective);
    const ev = evaluateBenchmarkRoster(parseCurtoisQu(SMALL), rosterFromBenchJson(results[1]));
    expect(ev.violations).toEqual([]);
    expect(ev.penalty).toBe(results[1].objective);
  });

  it('adds the textbook column beside the product: both solve the small file to the same optimum', async () => {
    const file = path.join(dir, 'Small.txt');
    fs.writeFileSync(file, SMALL);
    const printed: string[] = [];
    jest.spyOn(console, 'log').mockImplementation((s: string) => void printed.push(s));
    jest.spyOn(process.stderr, 'write').mockImplementation(() => true);
    expect(parseArgs(['1', '--beside-textbook']).besideTextbook).toBe(true);
    const outDir = path.join(dir, 'beside');
    expect(await main([file, '--time-limit', '20', '--out', outDir, '--beside-textbook'])).toBe(0);
    const json = JSON.parse(fs.readFileSync(path.join(outDir, 'Small.json'), 'utf8'));
    const table = printed.join('\n');
    expect(table).toMatch(/\| textbook beside \| product ≤ textbook \|/);
    const row = table.split('\n').find((l) => l.startsWith('| Small'))!;
    const cells = row.split('|').map((c) => c.trim());
    expect(cells.slice(-3, -1)).toEqual([String(json.objective), 'yes']);
    const errors: string[] = [];
    jest.spyOn(console, 'error').mockImplementation((e: string) => void errors.push(e));
    expect(await main([file, '--beside-textbook', '--cores', '2'])).toBe(1);
    expect(errors.join('\n')).toMatch(/one core each: use it with --cores 1/);
  });

  it('reports a missing or broken file and exits non-zero', async () => {
    const broken = path.join(dir, 'Broken.txt');
    fs.writeFileSync(broken, SMALL.replace('E,480,', 'E,eight hours,'));
    const errors: string[] = [];
    jest.spyOn(console, 'error').mockImplementation((s: string) => void errors.push(s));
    jest.spyOn(console, 'log').mockImplementation(() => undefined);
    jest.spyOn(process.stderr, 'write').mockImplementation(() => true);

    expect(await main([path.join(dir, 'Nope.txt'), broken])).toBe(1);
    expect(errors.join('\n')).toMatch(/Benchmark file not found: .*Nope\.txt/);
    expect(errors.join('\n')).toMatch(/Broken\.txt line 5: length of shift E must be a whole number/);
    expect(await main(['--time-limit', '5'])).toBe(2);
  });
});
