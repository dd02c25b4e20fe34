/**
 * The Post Office days-off problem: W. L. Winston, Operations Research: Applications and Algorithms,
 * 4th ed. (Thomson/Brooks-Cole, 2004), work-scheduling example of the LP-modelling chapter, as
 * summarised in ../shared/benchmarks/curtois-qu/SOURCES.md §7.
 *
 * Each full-time employee works five consecutive days, then has two days off (a cyclic week);
 * x_j = employees starting their five-day block on day j (Mon = 0 … Sun = 6); day i is covered by
 * starts on days i-4 … i (mod 7); minimise the number of employees.
 *
 * It runs through the generic `solveMip` path (the product's HiGHS session) and, as a second
 * opinion, through GLPK. A roster-model formulation does not map naturally: the week is cyclic
 * (a block may wrap from Sunday to Monday) and each person works either 0 or exactly 5 days, while
 * the product's period has open borders (border runs are exempt from the minimum-run rules) and no
 * "0 or exactly n shifts" rule — so it is not forced here.
 */
import { MipBuilder } from '../lib/model/builder';
import { solveMip } from '../lib/solve/run-mip';
import { arraysToGlpk, solveWithGlpk } from './glpk.test-helpers';

// Minimum staff per day, Mon … Sun (Winston; SOURCES.md §7)
const NEEDS = [17, 13, 15, 19, 14, 16, 11];
// Cost variant: cost per employee by start day, Mon … Sun (published extension; SOURCES.md §7)
const COST_BY_START = [500, 600, 800, 800, 800, 800, 700];

function postOffice(costs: number[]): MipBuilder {
  const b = new MipBuilder();
  const x = costs.map((c, j) =>
    b.addColumn(`start_${j}`, 0, Infinity, c, true, { kind: 'aux', rule: 'labourCost' }),
  );
  NEEDS.forEach((need, i) => {
    const starts = [0, 1, 2, 3, 4].map((back) => x[(i - back + 7) % 7]);
    b.addRow(
      `cover_${i}`,
      need,
      Infinity,
      starts.map((c) => [c, 1] as const),
      { rule: 'cover', day: i },
    );
  });
  return b;
}

/** Staff on duty each day for a start vector (day i: starts on days i-4 … i, mod 7). */
function onDuty(starts: number[]): number[] {
  return NEEDS.map((_, i) => [0, 1, 2, 3, 4].reduce((s, back) => s + starts[(i - back + 7) % 7], 0));
}

describe('Post Office days-off problem (Winston, OR: Applications and Algorithms, 4th ed.)', () => {
  const unitCost = postOffice([1, 1, 1, 1, 1, 1, 1]);

  it('LP relaxation is 67/3 (SOURCES.md §7, own check)', async () => {
    const lp = await solveMip(unitCost.toHighsArrays(), { relaxIntegrality: true, timeLimitSeconds: 30 });
    expect(lp.status).toBe('optimal');
    expect(lp.objective).toBeCloseTo(67 / 3, 6);
  });

  it('integer optimum is 23 employees and the start vector covers every day (Winston)', async () => {
    const ip = await solveMip(unitCost.toHighsArrays(), { timeLimitSeconds: 30 });
    expect(ip.status).toBe('optimal');
    expect(ip.objective).toBeCloseTo(23, 6);
    const starts = Array.from(ip.values ?? [], (v) => Math.round(v));
    expect(starts.reduce((a, b) => a + b, 0)).toBe(23);
    onDuty(starts).forEach((n, i) => expect(n).toBeGreaterThanOrEqual(NEEDS[i]));
    // the proven bound closes the gap
    expect(ip.bound).toBeCloseTo(23, 6);
  });

  it('cost variant: optimum 15,300 with 23 employees (published extension; SOURCES.md §7)', async () => {
    const ip = await solveMip(postOffice(COST_BY_START).toHighsArrays(), { timeLimitSeconds: 30 });
    expect(ip.status).toBe('optimal');
    expect(ip.objective).toBeCloseTo(15300, 4);
    const starts = Array.from(ip.values ?? [], (v) => Math.round(v));
    expect(starts.reduce((s, n, j) => s + n * COST_BY_START[j], 0)).toBe(15300);
    onDuty(starts).forEach((n, i) => expect(n).toBeGreaterThanOrEqual(NEEDS[i]));
    // LP relaxation of the cost variant: 14,966.67 (SOURCES.md §7, own check)
    const lp = await solveMip(postOffice(COST_BY_START).toHighsArrays(), { relaxIntegrality: true });
    expect(lp.objective).toBeCloseTo(14966.67, 1);
  });

  it('GLPK, a second solver, agrees on the same arrays: 23 and 15,300', () => {
    // GLPK 5.0 through glpk.js, fed the very arrays the HiGHS path gets
    expect(solveWithGlpk(arraysToGlpk(unitCost.toHighsArrays())).z).toBeCloseTo(23, 6);
    expect(solveWithGlpk(arraysToGlpk(postOffice(COST_BY_START).toHighsArrays())).z).toBeCloseTo(15300, 4);
  });
});
