/**
 * The covering model against textbook staffing examples with known optima, solved on HiGHS.
 */
import { SolverPool } from '../pool/solver-pool';
import { coverShifts, shiftIntervals, solveCovering } from './covering';

describe('Post Office days-off problem as a covering problem (Winston, OR: Applications and Algorithms)', () => {
  // Same data and source as src/external/post-office.spec.ts: W. L. Winston, Operations Research:
  // Applications and Algorithms, 4th ed. (2004), work-scheduling example of the LP-modelling
  // chapter, as summarised in ../shared/benchmarks/curtois-qu/SOURCES.md §7. Each employee works
  // five consecutive days of a cyclic week; minimum staff per day Mon … Sun below; optimum 23.
  const NEEDS = [17, 13, 15, 19, 14, 16, 11];
  const block = (start: number) => [0, 1, 2, 3, 4].map((k) => (start + k) % 7);

  it('needs 23 employees and the starts cover every day', async () => {
    const r = await solveCovering({
      requirement: NEEDS,
      candidates: NEEDS.map((_, j) => ({ intervals: block(j), cost: 1 })),
    });
    expect(r.status).toBe('optimal');
    expect(r.cost).toBe(23);
    expect(r.counts.reduce((a, b) => a + b, 0)).toBe(23);
    r.cover.forEach((n, i) => expect(n).toBeGreaterThanOrEqual(NEEDS[i]));
    expect(r.short).toEqual([0, 0, 0, 0, 0, 0, 0]);
  });

  it('the same through coverShifts: days as one 1440-minute interval, a 5-day "shift", wrapping', async () => {
    // a five-day block is a shift of 5 x 1440 minutes starting at midnight; the week wraps
    const r = await coverShifts({
      days: 7,
      intervalMinutes: 1440,
      requirement: NEEDS,
      shifts: [{ id: 'five-days', startMinute: 0, lengthMinutes: 5 * 1440, cost: 1 }],
    });
    expect(r.cost).toBe(23);
  });

  it('cost variant: 15,300 (published extension; SOURCES.md §7)', async () => {
    const COST_BY_START = [500, 600, 800, 800, 800, 800, 700];
    const r = await solveCovering({
      requirement: NEEDS,
      candidates: NEEDS.map((_, j) => ({ intervals: block(j), cost: COST_BY_START[j] })),
    });
    expect(r.cost).toBe(15300);
  });
});

describe('Union Airways personnel scheduling (Hillier & Lieberman, Introduction to Operations Research)', () => {
  // F. S. Hillier and G. J. Lieberman, Introduction to Operations Research (McGraw-Hill),
  // section 3.4, "Personnel scheduling" (from memory: 7th-10th editions). Five 8-hour shifts with
  // a daily cost per agent, ten time periods with a minimum number of agents; a shift covers the
  // periods it spans and the 22:00 shift runs past midnight to 06:00. Published optimum:
  // x = (48, 31, 39, 43, 15), total cost $30,610 per day.
  // Hourly requirement (00:00 … 23:00) from the source's two-hour periods and 00:00-06:00 period.
  const byPeriod: [from: number, to: number, agents: number][] = [
    [0, 6, 15],
    [6, 8, 48],
    [8, 10, 79],
    [10, 12, 65],
    [12, 14, 87],
    [14, 16, 64],
    [16, 18, 73],
    [18, 20, 82],
    [20, 22, 43],
    [22, 24, 52],
  ];
  const requirement = new Array<number>(24).fill(0);
  for (const [from, to, agents] of byPeriod) for (let h = from; h < to; h++) requirement[h] = agents;
  const shifts = [
    { id: '1', startMinute: 6 * 60, lengthMinutes: 480, cost: 170 },
    { id: '2', startMinute: 8 * 60, lengthMinutes: 480, cost: 160 },
    { id: '3', startMinute: 12 * 60, lengthMinutes: 480, cost: 175 },
    { id: '4', startMinute: 16 * 60, lengthMinutes: 480, cost: 180 },
    { id: '5', startMinute: 22 * 60, lengthMinutes: 480, cost: 195 },
  ];

  it('optimum $30,610 with 48, 31, 39, 43 and 15 agents on shifts 1-5', async () => {
    const r = await coverShifts({ days: 1, intervalMinutes: 60, requirement, shifts });
    expect(r.status).toBe('optimal');
    expect(r.cost).toBe(30610);
    expect(r.people[0]).toEqual([48, 31, 39, 43, 15]);
    r.cover.forEach((n, h) => expect(n).toBeGreaterThanOrEqual(requirement[h]));
  });

  it('the same at 15-minute intervals (the answer does not depend on the grid)', async () => {
    const quarter = requirement.flatMap((r) => [r, r, r, r]);
    const r = await coverShifts({ days: 1, intervalMinutes: 15, requirement: quarter, shifts });
    expect(r.cost).toBe(30610);
  });
});

describe('shift intervals and the cap on people', () => {
  it('a night shift 22:00-06:00 on the last day covers the first morning only when wrapping', () => {
    const night = { startMinute: 22 * 60, lengthMinutes: 480 };
    expect(shiftIntervals(1, night, 60, 2, true)).toEqual([46, 47, 0, 1, 2, 3, 4, 5]);
    expect(shiftIntervals(1, night, 60, 2, false)).toEqual([46, 47]);
  });

  it('a shift starting off the grid covers only the intervals wholly inside it', () => {
    // 07:10-09:10 on a 30-minute grid: 07:30, 08:00, 08:30 (three intervals)
    expect(shiftIntervals(0, { startMinute: 430, lengthMinutes: 120 }, 30, 1, true)).toEqual([15, 16, 17]);
  });

  it('with a cap the plan is short exactly where the cap forces it, and nowhere else', async () => {
    // one 8-hour shift at 08:00; 5 needed from 08:00 to 16:00, cap 3 people: 2 short in each of 8 hours
    const requirement = new Array<number>(24).fill(0);
    for (let h = 8; h < 16; h++) requirement[h] = 5;
    const r = await coverShifts({
      days: 1,
      intervalMinutes: 60,
      requirement,
      shifts: [{ id: 'D', startMinute: 480, lengthMinutes: 480, cost: 8 }],
      maxPeoplePerDay: 3,
    });
    expect(r.people[0]).toEqual([3]);
    expect(r.short.reduce((a, b) => a + b, 0)).toBe(16);
    expect(r.short.slice(8, 16)).toEqual(new Array<number>(8).fill(2));
  });

  it('without a cap nothing is short', async () => {
    const requirement = new Array<number>(24).fill(2);
    const r = await coverShifts({
      days: 1,
      intervalMinutes: 60,
      requirement,
      shifts: [
        { id: 'E', startMinute: 360, lengthMinutes: 480, cost: 8 },
        { id: 'L', startMinute: 840, lengthMinutes: 480, cost: 8 },
        { id: 'N', startMinute: 1320, lengthMinutes: 480, cost: 8 },
      ],
    });
    expect(r.short.every((s) => s === 0)).toBe(true);
    // three 8-hour shifts tile the day: 2 of each, 48 paid hours (common practice, no source)
    expect(r.cost).toBe(48);
  });
});

describe('the covering model in a worker thread of the solver pool', () => {
  it('gives the Union Airways optimum too (Hillier & Lieberman, as above)', async () => {
    const pool = new SolverPool({ size: 1 });
    try {
      const requirement = new Array<number>(24).fill(0);
      // the source's ten periods: 00-06 15, 06-08 48, 08-10 79, 10-12 65, 12-14 87, 14-16 64,
      // 16-18 73, 18-20 82, 20-22 43, 22-24 52
      const periods = [
        15, 15, 15, 15, 15, 15, 48, 48, 79, 79, 65, 65, 87, 87, 64, 64, 73, 73, 82, 82, 43, 43, 52, 52,
      ];
      periods.forEach((r, h) => (requirement[h] = r));
      const r = await coverShifts({
        days: 1,
        intervalMinutes: 60,
        requirement,
        shifts: [6, 8, 12, 16, 22].map((h, k) => ({
          id: String(k + 1),
          startMinute: h * 60,
          lengthMinutes: 480,
          cost: [170, 160, 175, 180, 195][k],
        })),
        solver: (data, options) => pool.solveMip(data, options),
      });
      expect(r.cost).toBe(30610);
    } finally {
      await pool.close();
    }
  });
});
