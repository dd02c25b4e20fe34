/**
 * Published shift scheduling benchmark (T. Curtois and R. Qu, Computational results on new staff
 * scheduling benchmark instances, University of Nottingham, 2014; schedulingbenchmarks.org/nrp),
 * run through the product's own solve path. Best-known values: SOURCES.md §5a of
 * ../shared/benchmarks/curtois-qu (Instances 1-3 are proven optima: 607, 828, 1001).
 *
 * These tests need the benchmark folder. When it is missing they FAIL (never skip) with a message
 * naming ROTAPLEX_BENCHMARKS_DIR and the default path; CI has the folder.
 */
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import type { Roster } from '../lib/problem';
import { checkRoster } from '../lib/check/checker';
import { BEST_KNOWN } from '../lib/bench/best-known';
import { loadInstance, type LoadedInstance } from '../lib/bench/curtois-qu';
import { evaluateBenchmarkRoster, type BenchRule } from '../lib/bench/evaluate';
import { rosterFromBenchJson, runInstance, writeBenchJson, type BenchRun } from '../lib/bench/runner';
import { PLANTABLE_RULES, plantViolation } from './random-instances.test-helpers';

/** Each solve may use up to this long; instance 3 needs about 45 s on a busy 2-core machine. */
const TIME_LIMIT_SECONDS = 150;

const runs = new Map<number, Promise<BenchRun>>();
function solved(n: number): Promise<BenchRun> {
  if (!runs.has(n)) runs.set(n, runInstance(n, { timeLimitSeconds: TIME_LIMIT_SECONDS }));
  return runs.get(n) as Promise<BenchRun>;
}

/** The set of "rule person" pairs a checker reports, for comparing two checkers. */
function ruleSet(violations: { rule: string; personId?: string; staffId?: string }[]): string[] {
  return [...new Set(violations.map((v) => `${v.rule} ${v.personId ?? v.staffId}`))].sort();
}

describe.each([1, 2, 3])('Instance%i reaches its published optimum', (n) => {
  it(`objective ${BEST_KNOWN[n].best} (SOURCES.md §5a), proven, and both checkers agree`, async () => {
    const run = await solved(n);
    // published optimum: lower bound = best known solution (SOURCES.md §5a, Source A; own check §6)
    expect(run.objective).toBe(BEST_KNOWN[n].best);
    expect(run.status).toBe('optimal');
    // the product checker: no hard-rule violation, same objective
    expect(run.checkerViolations).toBe(0);
    expect(run.checkerObjective).toBe(BEST_KNOWN[n].best);
    // the benchmark's own definition (SOURCES.md §4) evaluated independently of the product
    expect(run.benchmarkViolations).toBe(0);
    expect(run.benchmarkPenalty).toBe(BEST_KNOWN[n].best);
  });
});

describe('checker on benchmark rosters', () => {
  let inst2: LoadedInstance;
  let solvedRoster: Roster;

  beforeAll(async () => {
    inst2 = loadInstance(2);
    const run = await solved(2);
    if (!run.roster) throw new Error(`Instance2 gave no roster (status ${run.status})`);
    // read the roster back from the JSON the bench command writes
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'rotaplex-bench-'));
    try {
      const file = writeBenchJson(run, dir);
      expect(path.basename(file)).toBe('Instance2.json');
      const json = JSON.parse(fs.readFileSync(file, 'utf8'));
      expect(Object.keys(json).slice(0, 6)).toEqual([
        'instance',
        'objective',
        'bound',
        'status',
        'seconds',
        'roster',
      ]);
      solvedRoster = rosterFromBenchJson(json);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });

  it('finds no violation and the published optimum 828 on the roster read back from JSON (SOURCES.md §5a)', () => {
    const check = checkRoster(inst2.problem, solvedRoster);
    expect(check.violations).toEqual([]);
    expect(check.objective).toBe(828);
    // term by term against the benchmark definition (SOURCES.md §4): cover, on and off requests
    const ev = evaluateBenchmarkRoster(inst2.instance, solvedRoster);
    expect(check.terms.coverUnderTarget + check.terms.coverOver).toBe(ev.coverPenalty);
    expect(check.terms.requests).toBe(ev.onRequestPenalty + ev.offRequestPenalty);
  });

  // Each benchmark hard rule of SOURCES.md §4 (2-10; rule 1 cannot be broken in a roster that
  // holds one entry per day), planted by hand into the optimal roster for a person who can break it.
  it.each(PLANTABLE_RULES.map((r) => [r]))('catches a planted %s violation', (rule: BenchRule) => {
    const inst = inst2.instance;
    let planted: { roster: Roster; staffId: string } | null = null;
    for (const e of inst.staff) {
      const roster = plantViolation(inst, solvedRoster, rule, e.id, 6);
      if (roster) {
        planted = { roster, staffId: e.id };
        break;
      }
    }
    if (!planted) throw new Error(`Instance2 offers no way to break ${rule}`);
    const check = checkRoster(inst2.problem, planted.roster);
    const ev = evaluateBenchmarkRoster(inst, planted.roster);
    expect(ruleSet(check.violations)).toContain(`${rule} ${planted.staffId}`);
    // the independent evaluator (SOURCES.md §4) sees exactly the same rules broken, person by person
    expect(ruleSet(check.violations)).toEqual(ruleSet(ev.violations));
    // and the soft goals still agree on the edited roster
    expect(check.objective).toBe(ev.penalty);
  });
});
