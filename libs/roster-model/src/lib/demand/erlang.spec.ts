/**
 * Erlang B / C and the staffing numbers, checked against worked examples and a second,
 * independent implementation (jstat's Poisson distribution, a general-purpose statistics library
 * from the registry).
 */
import fc from 'fast-check';
import {
  agentsForTarget,
  averageSpeedOfAnswer,
  erlangB,
  erlangC,
  serviceLevel,
  trafficErlangs,
  withShrinkage,
} from './erlang';

// jstat 1.9 ships no type declarations; only the two Poisson functions are used.
// eslint-disable-next-line @typescript-eslint/no-require-imports
const { jStat } = require('jstat') as {
  jStat: { poisson: { pdf(k: number, l: number): number; cdf(k: number, l: number): number } };
};

describe('worked example in PRODUCT.md: 360 contacts per half hour, 4-minute calls', () => {
  // Inputs from a published step-by-step Erlang-C example (360 calls per half hour, 4-minute
  // calls, 55 agents, 15-second target), as quoted in PRODUCT.md "Trade facts". The expected
  // values below are computed from the formula (PRODUCT.md says so), not read in the source.
  const a = trafficErlangs(360, 240, 30);

  it('traffic is 48 Erlangs', () => {
    expect(a).toBeCloseTo(48, 12);
  });

  it('55 agents answer 84.6% within 15 s (computed from the formula)', () => {
    expect(serviceLevel(55, a, 15, 240) * 100).toBeCloseTo(84.6, 1);
  });

  it('54 agents is the fewest for 80% in 20 s (computed from the formula)', () => {
    const r = agentsForTarget(a, 240, { targetPercent: 80, targetSeconds: 20, maxOccupancyPercent: 100 });
    expect(r.agents).toBe(54);
    expect(serviceLevel(53, a, 20, 240)).toBeLessThan(0.8);
    expect(serviceLevel(54, a, 20, 240)).toBeGreaterThanOrEqual(0.8);
    expect(r.occupancyPercent).toBeCloseTo((48 / 54) * 100, 9);
  });
});

describe('Call Centre Helper, "Erlang C Formula - Made Simple With an Easy Worked Example"', () => {
  // Inputs read in the source: 100 calls per 30 minutes, AHT 180 s, 80% in 20 s, occupancy at
  // most 85%, shrinkage 30% (so A = 10 Erlangs). Results from memory of the same article:
  // P(wait) with 11 agents 0.6821, 14 agents needed (service level about 89%, occupancy about
  // 71%), 20 agents to schedule after 30% shrinkage.
  const a = trafficErlangs(100, 180, 30);
  const target = { targetPercent: 80, targetSeconds: 20, maxOccupancyPercent: 85 };

  it('traffic 10 Erlangs (read in the source)', () => {
    expect(a).toBeCloseTo(10, 12);
  });

  it('P(wait) with 11 agents is 0.6821 (from memory)', () => {
    expect(erlangC(11, a)).toBeCloseTo(0.6821, 4);
  });

  it('14 agents, about 89% in 20 s, occupancy about 71% (from memory)', () => {
    const r = agentsForTarget(a, 180, target);
    expect(r.agents).toBe(14);
    expect(Math.round(r.serviceLevelPercent ?? 0)).toBe(89);
    expect(Math.round(r.occupancyPercent ?? 0)).toBe(71);
    // 13 agents fall just short: 79.6% (computed from the formula)
    expect(serviceLevel(13, a, 20, 180)).toBeLessThan(0.8);
  });

  it('20 agents to schedule after 30% shrinkage (from memory)', () => {
    expect(withShrinkage(14, 30)).toBe(20);
  });
});

describe('Erlang B against the Poisson distribution of jstat', () => {
  // Erlang B = Poisson pmf(N; A) / Poisson cdf(N; A): the truncated Poisson distribution of busy
  // servers (Erlang's loss formula; e.g. Kleinrock, Queueing Systems vol. 1, section 3.6, from memory).
  const viaPoisson = (n: number, a: number) => jStat.poisson.pdf(n, a) / jStat.poisson.cdf(n, a);

  it('agrees over a grid of N = 0 … 120 and A = 0.1 … 100 to 1e-9 relative', () => {
    let checked = 0;
    for (let n = 0; n <= 120; n += 3) {
      for (const a of [0.1, 0.5, 1, 2.5, 5, 10, 17.3, 25, 48, 60, 75.5, 100]) {
        const expected = viaPoisson(n, a);
        if (!(expected > 1e-280)) continue; // beyond double range in jstat's pmf
        expect(Math.abs(erlangB(n, a) - expected) / expected).toBeLessThan(1e-9);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(400);
  });

  it('agrees on random N and A (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 150 }),
        fc.double({ min: 0.01, max: 140, noNaN: true }),
        (n, a) => {
          const expected = viaPoisson(n, a);
          fc.pre(expected > 1e-280);
          return Math.abs(erlangB(n, a) - expected) / expected < 1e-9;
        },
      ),
      { seed: 12, numRuns: 500 },
    );
  });

  it('Erlang C from the Poisson terms: C = N B / (N - A (1 - B))', () => {
    // P(wait) written with Poisson terms alone (Erlang's delay formula): the last term of the
    // truncated series weighted by N / (N - A), over the series plus that term (from memory).
    for (const [n, a] of [
      [11, 10],
      [55, 48],
      [30, 20.5],
      [100, 90],
    ]) {
      const pN = jStat.poisson.pdf(n, a);
      const below = jStat.poisson.cdf(n - 1, a);
      const top = (pN * n) / (n - a);
      expect(erlangC(n, a)).toBeCloseTo(top / (below + top), 10);
    }
  });

  it('stays finite and in [0, 1] for large N and A, where factorials overflow', () => {
    const b = erlangB(2000, 1900);
    expect(b).toBeGreaterThan(0);
    expect(b).toBeLessThan(1);
    expect(erlangC(2000, 1900)).toBeGreaterThan(0);
    expect(erlangC(2000, 1900)).toBeLessThan(1);
  });
});

describe('service level, speed of answer, occupancy cap and shrinkage', () => {
  it('SL and ASA move the right way with one more agent', () => {
    for (let n = 49; n < 70; n++) {
      expect(serviceLevel(n + 1, 48, 20, 240)).toBeGreaterThan(serviceLevel(n, 48, 20, 240));
      expect(averageSpeedOfAnswer(n + 1, 48, 240)).toBeLessThan(averageSpeedOfAnswer(n, 48, 240));
    }
  });

  it('with N <= A every contact waits and the queue grows: SL 0, ASA infinite', () => {
    expect(erlangC(48, 48)).toBe(1);
    expect(serviceLevel(40, 48, 20, 240)).toBe(0);
    expect(averageSpeedOfAnswer(48, 48, 240)).toBe(Infinity);
  });

  it('the occupancy cap can decide the answer: A = 48 at 85% needs 57, not 54', () => {
    // 48 / 0.85 = 56.47, so 57 agents (common practice, no source: occupancy = A / N)
    const r = agentsForTarget(48, 240, { targetPercent: 80, targetSeconds: 20, maxOccupancyPercent: 85 });
    expect(r.agents).toBe(57);
    expect(r.occupancyPercent).toBeLessThanOrEqual(85);
  });

  it('the answer is the fewest: one agent fewer misses the target or the cap (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.05, max: 200, noNaN: true }),
        fc.integer({ min: 30, max: 900 }),
        fc.integer({ min: 50, max: 95 }),
        fc.integer({ min: 5, max: 120 }),
        fc.integer({ min: 70, max: 100 }),
        (a, aht, pct, secs, occ) => {
          const target = { targetPercent: pct, targetSeconds: secs, maxOccupancyPercent: occ };
          const { agents } = agentsForTarget(a, aht, target);
          const meets = (n: number) =>
            n > a && a / n <= occ / 100 + 1e-11 && serviceLevel(n, a, secs, aht) + 1e-11 >= pct / 100;
          return meets(agents) && !meets(agents - 1);
        },
      ),
      { seed: 7, numRuns: 300 },
    );
  });

  it('no contacts need no agents', () => {
    expect(
      agentsForTarget(0, 300, { targetPercent: 80, targetSeconds: 20, maxOccupancyPercent: 85 }).agents,
    ).toBe(0);
  });

  it('shrinkage: scheduled = required / (1 - s), rounded up (PRODUCT.md trade facts)', () => {
    expect(withShrinkage(54, 0)).toBe(54);
    expect(withShrinkage(54, 30)).toBe(78); // 77.14 -> 78
    expect(withShrinkage(7, 30)).toBe(10);
    expect(withShrinkage(1, 35)).toBe(2);
    expect(() => withShrinkage(10, 100)).toThrow(RangeError);
  });

  it('rejects nonsense inputs', () => {
    expect(() => erlangB(-1, 3)).toThrow(RangeError);
    expect(() => erlangB(2.5, 3)).toThrow(RangeError);
    expect(() => erlangB(3, Number.NaN)).toThrow(RangeError);
    expect(() =>
      agentsForTarget(5, 0, { targetPercent: 80, targetSeconds: 20, maxOccupancyPercent: 85 }),
    ).toThrow(RangeError);
  });
});
