/**
 * solveMip on plain models, against published worked examples and an independent enumeration.
 */
import type { ModelData } from 'highs';
import { relativeGap, solveMip } from './run-mip';

// 0/1 knapsack, the five-item example illustrating the knapsack problem on Wikipedia
// ("Knapsack problem", figure: capacity 15 kg; items 12 kg/$4, 2 kg/$2, 1 kg/$1, 1 kg/$2,
// 4 kg/$10), from memory. Its optimum, $15 (every item but the 12 kg one), is re-derived below by
// enumerating all 32 subsets, so the check does not rest on memory alone.
const WEIGHTS = [12, 2, 1, 1, 4];
const VALUES = [4, 2, 1, 2, 10];
const CAPACITY = 15;

function knapsack(): ModelData {
  const n = WEIGHTS.length;
  return {
    numCols: n,
    numRows: 1,
    // maximise: highs.constants.objectiveSense.maximize is -1
    sense: -1 as unknown as ModelData['sense'],
    colCost: VALUES,
    colLower: new Array<number>(n).fill(0),
    colUpper: new Array<number>(n).fill(1),
    rowLower: [-Infinity],
    rowUpper: [CAPACITY],
    matrix: {
      format: 'csr',
      numRows: 1,
      numCols: n,
      starts: [0, n],
      indices: [0, 1, 2, 3, 4],
      values: WEIGHTS,
    },
    integrality: new Array<0 | 1>(n).fill(1),
  };
}

function bruteForceOptimum(): number {
  let best = 0;
  for (let mask = 0; mask < 1 << WEIGHTS.length; mask++) {
    let w = 0;
    let v = 0;
    for (let i = 0; i < WEIGHTS.length; i++) {
      if (mask & (1 << i)) {
        w += WEIGHTS[i];
        v += VALUES[i];
      }
    }
    if (w <= CAPACITY && v > best) best = v;
  }
  return best;
}

describe('solveMip', () => {
  it('finds the knapsack optimum and proves it', async () => {
    expect(bruteForceOptimum()).toBe(15);
    const result = await solveMip(knapsack());
    expect(result.status).toBe('optimal');
    expect(result.objective).toBe(15);
    expect(result.bound).toBeCloseTo(15, 6);
    expect(Array.from(result.values ?? [])).toEqual([0, 1, 1, 1, 1]);
  });

  it('solves the LP relaxation: Dantzig’s greedy bound 15 + 7/12 × 4 = 17⅓', async () => {
    // LP relaxation of a knapsack = take items by value per kg (10/4, 2/1, 2/2, 1/1), then the
    // fraction of the next that fits (Dantzig, Operations Research 5(2), 1957): the four small
    // items weigh 8 kg and earn 15; 7/12 of the 12 kg item adds 7/12 × 4.
    const result = await solveMip(knapsack(), { relaxIntegrality: true });
    expect(result.status).toBe('optimal');
    expect(result.objective).toBeCloseTo(15 + (7 / 12) * 4, 9);
    expect(result.values?.[0]).toBeCloseTo(7 / 12, 9);
  });

  it('refuses the threads option (this HiGHS build is single-threaded)', async () => {
    await expect(solveMip(knapsack(), { highsOptions: { threads: 2 } })).rejects.toThrow(/threads/);
  });

  it('computes the relative gap the way the quality statement reads it', () => {
    expect(relativeGap(100, 98.8)).toBeCloseTo(0.012, 12);
    expect(relativeGap(100, 100)).toBe(0);
    expect(relativeGap(null, 5)).toBeNull();
    expect(relativeGap(100, null)).toBeNull();
  });
});
