/**
 * Hard rule: at most contract.maxConsecutiveNights night shifts on consecutive days.
 * Days outside the period count as non-nights: Σ_{j=d}^{d+N} n[p,j] ≤ N for windows inside the period,
 * where n[p,d] is the sum of x over night shift types (time.ts isNightShift).
 */
import type { Violation } from '../result';
import { defineRule, type RuleModule } from '../model/context';
import { runsOf } from './runs';

export const maxConsecutiveNights: RuleModule = defineRule({
  name: 'maxConsecutiveNights',
  build(ctx) {
    const { P, D } = ctx.index;
    for (let p = 0; p < P; p++) {
      const N = ctx.problem.people[p].contract.maxConsecutiveNights;
      if (N === undefined || N >= D) continue;
      for (let d = 0; d + N < D; d++) {
        const terms: [number, number][] = [];
        for (let j = d; j <= d + N; j++) terms.push(...ctx.nightTerms(p, j));
        if (terms.length <= N) continue;
        ctx.addRow(`maxNights_${p}_${d}`, -Infinity, N, terms, {
          rule: 'maxConsecutiveNights',
          personId: ctx.index.personId(p),
          day: d,
          lastDay: d + N,
        });
      }
    }
  },
  checkPerson(index, p, row) {
    const out: Violation[] = [];
    const N = index.problem.people[p].contract.maxConsecutiveNights;
    if (N === undefined) return out;
    for (const [a, b] of runsOf(index.D, (d) => row[d] >= 0 && index.night[row[d]])) {
      if (b - a + 1 <= N) continue;
      out.push({
        rule: 'maxConsecutiveNights',
        personId: index.personId(p),
        days: [a, b],
        amount: b - a + 1 - N,
        message: `${index.personName(p)}: ${b - a + 1} nights in a row from day ${a} (at most ${N})`,
      });
    }
    return out;
  },
});
