/**
 * The solver pool with real worker threads and the real HiGHS build.
 */
import type { SolveProgress } from '../result';
import { busyUnit, smallWard } from '../solve/fixtures.test-helpers';
import { checkRoster } from '../check/checker';
import type { Roster } from '../problem';
import { SolverError, SolverPool, TWO_CORE_PORTFOLIO } from './solver-pool';

// The production-planning example of the highs package README (node_modules/highs/README.md,
// "Quick start"): chairs earn 30 and tables 50; carpentry c + 2t ≤ 40, finishing 2c + t ≤ 50.
// Published optimum: 20 chairs and 10 tables, profit 1100.
const README_EXAMPLE = `Maximize
 profit: 30 chairs + 50 tables
Subject To
 carpentry: chairs + 2 tables <= 40
 finishing: 2 chairs + tables <= 50
Bounds
 chairs >= 0
 tables >= 0
Generals
 chairs tables
End`;

describe('SolverPool', () => {
  let pool: SolverPool;
  beforeAll(() => {
    pool = new SolverPool({ size: 2 });
  });
  afterAll(async () => {
    await pool.close();
  });

  async function expectPoolStillSolves(): Promise<void> {
    const after = await pool.solveMip({ format: 'lp', data: README_EXAMPLE });
    expect(after.status).toBe('optimal');
    expect(after.objective).toBe(1100);
    expect(Array.from(after.values ?? [])).toEqual([20, 10]);
  }

  it('closes cleanly while its first worker is still starting', async () => {
    // A fresh pool spawns its worker on the first solve; closing at once finds a slot with no worker yet.
    const fresh = new SolverPool({ size: 1 });
    const solve = fresh.solveRoster(smallWard(), { timeLimitSeconds: 10, explain: false });
    await expect(fresh.close()).resolves.toBeUndefined();
    await expect(solve).rejects.toMatchObject({ kind: 'closed' });
  });

  it('solves in a worker: the highs README example reaches its published optimum 1100', async () => {
    await expectPoolStillSolves();
  });

  it('reports a WebAssembly abort as a clear error and the next solve in the same pool succeeds', async () => {
    // LP text with a broken constraint aborts inside WebAssembly (SOLVER-NOTES.md: parse errors abort).
    const broken = { format: 'lp' as const, data: 'Minimize\n obj: x\nSubject To\n c: x >= 1 +\nEnd' };
    const failure = pool.solveMip(broken);
    await expect(failure).rejects.toBeInstanceOf(SolverError);
    await expect(failure).rejects.toMatchObject({
      kind: 'wasm',
      message: expect.stringMatching(/WebAssembly/),
    });
    await expectPoolStillSolves();
  });

  it('reports a worker that dies mid-solve as an error and starts a new worker', async () => {
    let signalled!: () => void;
    const started = new Promise<void>((resolve) => (signalled = resolve));
    const handle = pool.start(
      { kind: 'roster', problem: busyUnit(), options: { timeLimitSeconds: 60, explain: false } },
      { onProgress: () => signalled() },
    );
    await started;
    // A crash from outside the solve (as an out-of-memory exit would be): terminate the worker
    // behind the pool's back. The pool must fail this solve, not hang, and stay usable.
    const slots = (pool as unknown as { slots: { job: unknown; worker: { terminate(): Promise<number> } }[] })
      .slots;
    const busy = slots.find((s) => s.job !== null);
    expect(busy).toBeDefined();
    await busy!.worker.terminate();
    await expect(handle.result).rejects.toMatchObject({
      kind: 'crashed',
      message: expect.stringMatching(/stopped unexpectedly/),
    });
    await expectPoolStillSolves();
  });

  it('kills a running solve at once on request and stays usable', async () => {
    const killer = new AbortController();
    const solve = pool.solveRoster(busyUnit(), {
      timeLimitSeconds: 60,
      explain: false,
      killSignal: killer.signal,
      onProgress: () => killer.abort(),
    });
    await expect(solve).rejects.toMatchObject({ kind: 'killed' });
    await expectPoolStillSolves();
  });

  it('cancels through shared memory, keeps the incumbent, and never blocks the caller', async () => {
    const controller = new AbortController();
    let ticks = 0;
    const timer = setInterval(() => (ticks += 1), 20);
    const seen: SolveProgress[] = [];
    try {
      const result = await pool.solveRoster(busyUnit(), {
        timeLimitSeconds: 60,
        signal: controller.signal,
        onProgress: (p) => {
          seen.push(p);
          if (p.objective !== null) setTimeout(() => controller.abort(), 300);
        },
      });
      expect(result.status).toBe('interrupted');
      expect(result.roster).not.toBeNull();
      expect(result.check?.violations).toEqual([]);
      const firstObjective = seen.find((p) => p.objective !== null)?.objective as number;
      expect(result.objective as number).toBeLessThanOrEqual(firstObjective + 1e-6);
    } finally {
      clearInterval(timer);
    }
    // The main thread kept running its timers while HiGHS worked in the worker.
    expect(ticks).toBeGreaterThan(5);
  });

  it('runs two independent seeds and keeps the better roster with the better bound', async () => {
    const result = await pool.solveRoster(smallWard(), { timeLimitSeconds: 60, portfolio: 2 });
    // Hand-worked in solve.spec.ts: the small ward's optimum is 0.
    expect(result.status).toBe('optimal');
    expect(result.objective).toBe(0);
    expect(result.quality).toBe('Proven best possible roster.');
    expect(result.check?.violations).toEqual([]);
  });
  it('hands better rosters between the two members and keeps the best one', async () => {
    // busyUnit is not solved to optimality in 8 s, so both members report rosters while they run.
    const problem = busyUnit();
    const seen: { roster: Roster; objective: number }[] = [];
    const result = await pool.solveRoster(problem, {
      timeLimitSeconds: 8,
      explain: false,
      portfolio: 2,
      portfolioOptions: TWO_CORE_PORTFOLIO,
      onRoster: (roster, objective) => seen.push({ roster, objective }),
    });
    expect(seen.length).toBeGreaterThan(0);
    // Every roster handed on meets every hard rule and costs what the checker computes.
    for (const { roster, objective } of seen) {
      const check = checkRoster(problem, roster);
      expect(check.violations).toEqual([]);
      expect(check.objective).toBeCloseTo(objective, 6);
    }
    const bestSeen = Math.min(...seen.map((s) => s.objective));
    expect(result.objective).not.toBeNull();
    expect(result.objective as number).toBeLessThanOrEqual(bestSeen + 1e-6);
    expect(result.check?.violations).toEqual([]);
  });
  it('runs a portfolio with a different strategy on each worker', async () => {
    const result = await pool.solveRoster(smallWard(), {
      timeLimitSeconds: 60,
      explain: false,
      portfolio: 2,
      portfolioStrategies: ['mip', 'fixAndOptimise'],
    });
    // Hand-worked in solve.spec.ts: the small ward's optimum is 0; either strategy proves it.
    expect(result.status).toBe('optimal');
    expect(result.objective).toBe(0);
    expect(result.check?.violations).toEqual([]);
  });
  it('lends an idle core to a solve and takes it back as soon as another solve waits', async () => {
    const controller = new AbortController();
    let firstProgress!: () => void;
    const progressing = new Promise<void>((ok) => (firstProgress = ok));
    let settled = false;
    const first = pool
      .solveRoster(busyUnit(), {
        timeLimitSeconds: 120,
        explain: false,
        spareCores: true,
        signal: controller.signal,
        onProgress: () => firstProgress(),
      })
      .finally(() => (settled = true));
    await progressing;
    // Both workers of the pool now work on the first solve.
    expect(pool.freeWorkers()).toBe(0);
    // A second solve does not wait for the first one's two minutes: the lent core is given back.
    const second = await pool.solveRoster(smallWard(), { timeLimitSeconds: 60, explain: false });
    expect(second.status).toBe('optimal');
    expect(second.objective).toBe(0);
    expect(settled).toBe(false);
    controller.abort();
    const result = await first;
    expect(result.status).toBe('interrupted');
    expect(result.roster).not.toBeNull();
    expect(result.check?.violations).toEqual([]);
  });
});
