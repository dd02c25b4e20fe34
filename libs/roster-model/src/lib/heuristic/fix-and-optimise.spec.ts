import type { ModelData } from 'highs';
import { fixAndOptimise, type SubMipSolver } from './fix-and-optimise';
import { construct } from './construct';
import { checkRoster } from '../check/checker';
import { buildModel } from '../model/build-model';
import { loadHighs } from '../model/highs.test-helpers';
import { solveAndCheck } from '../model/fixtures.test-helpers';
import { randomProblem } from '../model/random.test-helpers';

const subSolver: SubMipSolver = async (arrays, o) => {
  const highs = await loadHighs();
  const model = highs.createModel(arrays as unknown as ModelData);
  try {
    model.options.set({
      output_flag: false,
      time_limit: o.timeLimitSeconds,
      mip_rel_gap: 0,
      random_seed: o.randomSeed,
    });
    model.setSolution({ colValue: o.startValues });
    const run = model.run();
    const ok = Number(model.info.get('primal_solution_status')) === 2;
    return { values: ok ? model.getSolution().colValue : null, optimal: run.modelStatus === 7 };
  } finally {
    model.dispose();
  }
};

describe('fixAndOptimise', () => {
  const p = randomProblem(7, 5, 10);

  it('with every column free, one round reaches the optimum of the whole model', async () => {
    // The neighbourhood is the whole model, so the sub-MIP is the full MIP: its optimum must equal
    // the optimum found by solving the model directly.
    const optimum = (await solveAndCheck(p)).objective;
    const built = buildModel(p);
    const start = construct(p, { seed: 1, timeLimitMs: 300 });
    expect(checkRoster(p, start).violations).toEqual([]);
    const r = await fixAndOptimise(built, start, subSolver, {
      timeLimitSeconds: 60,
      // The one round may take longer than the default 3 s sub-MIP limit on a loaded machine.
      subTimeLimitSeconds: 60,
      freeColumns: Infinity,
      targetObjective: optimum,
    });
    expect(r.objective).toBeCloseTo(optimum, 6);
    expect(r.rounds).toBe(1);
  });

  it('small neighbourhoods never make the roster worse and keep it valid', async () => {
    const built = buildModel(p);
    const start = construct(p, { seed: 2, timeLimitMs: 100 });
    const before = checkRoster(p, start).objective;
    const r = await fixAndOptimise(built, start, subSolver, {
      timeLimitSeconds: 3,
      freeColumns: 40,
      seed: 5,
    });
    const after = checkRoster(p, r.roster);
    expect(after.violations).toEqual([]);
    expect(after.objective).toBeCloseTo(r.objective, 6);
    expect(r.objective).toBeLessThanOrEqual(before);
    expect(r.rounds).toBeGreaterThan(0);
  });

  it('in an elastic model it starts from a roster that breaks rules and repairs it', async () => {
    // With every column free, the sub-MIP is the whole elastic model; a violation costs 10,000, far
    // more than any roster of this problem, so the result breaks no rule and matches the optimum.
    const optimum = (await solveAndCheck(p)).objective;
    const built = buildModel(p, { elastic: 10_000 });
    const bad = construct(p, { seed: 1, timeLimitMs: 100 });
    bad[p.people[0].id] = bad[p.people[0].id].map(() => 'N');
    expect(checkRoster(p, bad).violations.length).toBeGreaterThan(0);
    const r = await fixAndOptimise(built, bad, subSolver, {
      timeLimitSeconds: 60,
      // The one round may take longer than the default 3 s sub-MIP limit on a loaded machine.
      subTimeLimitSeconds: 60,
      freeColumns: Infinity,
      targetObjective: optimum,
    });
    expect(checkRoster(p, r.roster).violations).toEqual([]);
    expect(r.objective).toBeCloseTo(optimum, 6);
  });

  it('takes over a better roster offered from elsewhere, and ignores worse or broken ones', async () => {
    // The offered roster is the proven optimum of the whole model (HiGHS, checked by the checker in
    // solveAndCheck); the worse offer is the start itself, the broken one the optimum with a rule broken.
    const solved = await solveAndCheck(p);
    const built = buildModel(p);
    const start = construct(p, { seed: 3, timeLimitMs: 50, maxIterations: 0 });
    const startObjective = checkRoster(p, start).objective;
    expect(startObjective).toBeGreaterThan(solved.objective);
    const broken = structuredClone(solved.roster);
    broken[p.people[0].id] = broken[p.people[0].id].map(() => 'N');
    expect(checkRoster(p, broken).violations.length).toBeGreaterThan(0);
    const offers = [broken, start, solved.roster];
    const r = await fixAndOptimise(built, start, subSolver, {
      timeLimitSeconds: 30,
      // Neighbourhoods of a single column cannot reach the optimum by themselves in a few rounds.
      freeColumns: 1,
      incoming: () => offers.shift() ?? null,
      targetObjective: solved.objective,
    });
    expect(r.adopted).toBe(1);
    expect(r.objective).toBeCloseTo(solved.objective, 6);
    expect(checkRoster(p, r.roster).violations).toEqual([]);
  });

  it('refuses a start roster that breaks a hard rule', async () => {
    const built = buildModel(p);
    const bad = construct(p, { seed: 1, timeLimitMs: 100 });
    bad[p.people[0].id] = bad[p.people[0].id].map(() => 'N');
    await expect(fixAndOptimise(built, bad, subSolver, { timeLimitSeconds: 1 })).rejects.toThrow(
      /without hard violations/,
    );
  });
});
