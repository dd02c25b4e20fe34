/**
 * Best-known objective values of the Curtois & Qu shift scheduling benchmark.
 * Source: the benchmark site's results table (schedulingbenchmarks.org/nrp), as transcribed in
 * ../shared/benchmarks/curtois-qu/SOURCES.md §5a ("Source A"): lower bound equals the best solution
 * for Instances 1-23; Instance24 has lower bound 40438 and best solution 40439.
 */
export interface BestKnown {
  lowerBound: number;
  best: number;
}

export const BEST_KNOWN: Readonly<Record<number, BestKnown>> = {
  1: { lowerBound: 607, best: 607 },
  2: { lowerBound: 828, best: 828 },
  3: { lowerBound: 1001, best: 1001 },
  4: { lowerBound: 1716, best: 1716 },
  5: { lowerBound: 1143, best: 1143 },
  6: { lowerBound: 1950, best: 1950 },
  7: { lowerBound: 1056, best: 1056 },
  8: { lowerBound: 1300, best: 1300 },
  9: { lowerBound: 439, best: 439 },
  10: { lowerBound: 4631, best: 4631 },
  11: { lowerBound: 3443, best: 3443 },
  12: { lowerBound: 4040, best: 4040 },
  13: { lowerBound: 1348, best: 1348 },
  14: { lowerBound: 1278, best: 1278 },
  15: { lowerBound: 3828, best: 3828 },
  16: { lowerBound: 3225, best: 3225 },
  17: { lowerBound: 5746, best: 5746 },
  18: { lowerBound: 4459, best: 4459 },
  19: { lowerBound: 3149, best: 3149 },
  20: { lowerBound: 4769, best: 4769 },
  21: { lowerBound: 21133, best: 21133 },
  22: { lowerBound: 30241, best: 30241 },
  23: { lowerBound: 17285, best: 17285 },
  24: { lowerBound: 40438, best: 40439 },
};

/** Best-known value for an instance file name such as "Instance7" (null for other files). */
export function bestKnownFor(name: string): BestKnown | null {
  const m = /^Instance(\d+)$/.exec(name);
  return m ? (BEST_KNOWN[Number(m[1])] ?? null) : null;
}
