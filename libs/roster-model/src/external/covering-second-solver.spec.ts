/**
 * The covering model (lib/demand/covering.ts) against an independent formulation on a second
 * solver: GLPK 5.0 through glpk.js (test-only devDependency, see glpk.test-helpers.ts). The GLPK
 * model is written here from the mathematics, not from the product's arrays: which intervals a
 * shift covers is decided minute by minute on the cyclic horizon, a different path from
 * shiftIntervals(). Random small instances (seeded), with and without a cap on people per day;
 * both solvers must reach the same optimum.
 */
import { coverShifts, type CoverShift } from '../lib/demand/covering';
import { mulberry32 } from '../lib/random';
import { glpkBounds, GLP_MIN, solveWithGlpk, type GlpkLp, type GlpkTerm } from './glpk.test-helpers';

/** Whole numbers 0 … n-1 from the project's one seeded generator. */
function generator(seed: number) {
  const random = mulberry32(seed);
  return (n: number) => Math.floor(random() * n);
}

interface Instance {
  days: number;
  intervalMinutes: number;
  requirement: number[];
  shifts: CoverShift[];
  cap: number | null;
}

function instance(seed: number): Instance {
  const next = generator(seed);
  const intervalMinutes = [60, 120][next(2)];
  const days = 1 + next(3);
  const perDay = 1440 / intervalMinutes;
  const requirement = Array.from({ length: days * perDay }, () => (next(4) === 0 ? 0 : next(9)));
  const shifts: CoverShift[] = Array.from({ length: 2 + next(3) }, (_, k) => ({
    id: `S${k}`,
    startMinute: next(24) * 60,
    lengthMinutes: (4 + next(9)) * 60,
    cost: 4 + next(9),
  }));
  // Half the instances also have three 8-hour shifts that tile the day, so every interval can be covered.
  if (next(2) === 0) {
    for (const start of [0, 8, 16])
      shifts.push({ id: `T${start}`, startMinute: start * 60, lengthMinutes: 480, cost: 9 });
  }
  return { days, intervalMinutes, requirement, shifts, cap: next(2) === 0 ? null : 3 + next(10) };
}

const SHORT_COST = 1000;

/** The covering model written straight from its definition for GLPK. */
function glpkModel(p: Instance): GlpkLp {
  const horizon = p.days * 1440;
  const covers = (day: number, s: CoverShift, t: number): boolean => {
    // every minute of interval t lies inside the shift, on a horizon that wraps around
    for (let m = t * p.intervalMinutes; m < (t + 1) * p.intervalMinutes; m++) {
      const offset = (((m - (day * 1440 + s.startMinute)) % horizon) + horizon) % horizon;
      if (offset >= s.lengthMinutes) return false;
    }
    return true;
  };
  const objective: GlpkTerm[] = [];
  const bounds: GlpkLp['bounds'] = [];
  const generals: string[] = [];
  const rows: GlpkLp['subjectTo'] = [];
  for (let d = 0; d < p.days; d++) {
    p.shifts.forEach((s, k) => {
      const name = `x_${d}_${k}`;
      objective.push({ name, coef: s.cost });
      bounds.push({ name, ...glpkBounds(0, Infinity) });
      generals.push(name);
    });
    if (p.cap !== null) {
      rows.push({
        name: `cap_${d}`,
        vars: p.shifts.map((_, k) => ({ name: `x_${d}_${k}`, coef: 1 })),
        bnds: glpkBounds(-Infinity, p.cap),
      });
    }
  }
  p.requirement.forEach((r, t) => {
    if (r === 0) return;
    const vars: GlpkTerm[] = [{ name: `s_${t}`, coef: 1 }];
    objective.push({ name: `s_${t}`, coef: SHORT_COST });
    bounds.push({ name: `s_${t}`, ...glpkBounds(0, r) });
    for (let d = 0; d < p.days; d++) {
      p.shifts.forEach((s, k) => {
        if (covers(d, s, t)) vars.push({ name: `x_${d}_${k}`, coef: 1 });
      });
    }
    rows.push({ name: `cover_${t}`, vars, bnds: glpkBounds(r, Infinity) });
  });
  return {
    name: 'covering',
    objective: { direction: GLP_MIN, name: 'obj', vars: objective },
    subjectTo: rows,
    bounds,
    generals,
  };
}

describe('covering model: HiGHS (product path) and GLPK (independent formulation) agree', () => {
  const seen: { short: number; capped: boolean; people: number }[] = [];
  for (const seed of [1, 2, 3, 5, 8, 13, 21, 34, 55, 89]) {
    it(`random instance ${seed}`, async () => {
      const p = instance(seed);
      const ours = await coverShifts({
        days: p.days,
        intervalMinutes: p.intervalMinutes,
        requirement: p.requirement,
        shifts: p.shifts,
        maxPeoplePerDay: p.cap,
        shortCost: SHORT_COST,
      });
      const glpk = solveWithGlpk(glpkModel(p));
      expect(ours.status).toBe('optimal');
      expect(ours.objective).toBeCloseTo(glpk.z, 6);
      // the plan itself is feasible: cover + short meets every requirement, caps hold
      p.requirement.forEach((r, t) => expect(ours.cover[t] + ours.short[t]).toBeGreaterThanOrEqual(r));
      seen.push({
        short: ours.short.reduce((a, b) => a + b, 0),
        capped: p.cap !== null,
        people: ours.counts.reduce((a, b) => a + b, 0),
      });
      if (p.cap !== null)
        ours.people.forEach((row) => expect(row.reduce((a, b) => a + b, 0)).toBeLessThanOrEqual(p.cap!));
    });
  }

  it('the instances are not trivial: some plans are short under a cap, some cover everything', () => {
    expect(seen).toHaveLength(10);
    expect(seen.some((r) => r.capped && r.short > 0)).toBe(true);
    expect(seen.some((r) => r.short === 0 && r.people > 0)).toBe(true);
  });
});
