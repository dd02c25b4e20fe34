/**
 * Hard rule: at most contract.maxConsecutiveWorkDays (K) working days in a row.
 * Days outside the period count as days off (problem.ts border convention), so only windows
 * inside the period are written: Σ_{j=d}^{d+K} w[p,j] ≤ K for d = 0 … days-K-1.
 *
 * Stronger windows when the same person also has minConsecutiveDaysOff = l ≥ 2: every window of
 * K + l days (cut at the end of the period, but at least K + 1 days) holds at most K working days.
 * Proof: an off run lying strictly inside the window touches neither window edge, so it is not a
 * border run and has at least l days; if there is none, the window is an off part, one work run
 * (≤ K days) and an off part, so it has at least (window length − K) ≥ … days off; either way at
 * most K working days (for a window cut to length L < K + l: at most max(K, L − l) = K).
 * This is the model of both rules together and is much tighter in the LP relaxation
 * (work at most K/(K+l) of the days instead of K/(K+1)).
 */
import type { Violation } from '../result';
import { defineRule, type RuleModule } from '../model/context';
import { runsOf } from './runs';

export const maxConsecutiveWorkDays: RuleModule = defineRule({
  name: 'maxConsecutiveWorkDays',
  build(ctx) {
    const { P, D } = ctx.index;
    for (let p = 0; p < P; p++) {
      const contract = ctx.problem.people[p].contract;
      const K = contract.maxConsecutiveWorkDays;
      if (K === undefined || K >= D) continue;
      // Longer windows when days off come in runs of at least l ≥ 2 (see the header): K + l days.
      const l = contract.minConsecutiveDaysOff ?? 1;
      const len = K + Math.max(1, l);
      for (let d = 0; d + K < D; d++) {
        const last = Math.min(D - 1, d + len - 1);
        // A window ending on the last day that a window starting earlier already contains adds nothing.
        if (last === D - 1 && d > 0 && Math.min(D - 1, d - 1 + len - 1) === D - 1) continue;
        const terms: [number, number][] = [];
        for (let j = d; j <= last; j++) terms.push(...ctx.workTerms(p, j));
        if (terms.length <= K) continue;
        ctx.addRow(`maxCons_${p}_${d}`, -Infinity, K, terms, {
          rule: 'maxConsecutiveWorkDays',
          personId: ctx.index.personId(p),
          day: d,
          lastDay: last,
        });
      }
    }
  },
  checkPerson(index, p, row) {
    const out: Violation[] = [];
    const K = index.problem.people[p].contract.maxConsecutiveWorkDays;
    if (K === undefined) return out;
    for (const [a, b] of runsOf(index.D, (d) => row[d] >= 0)) {
      if (b - a + 1 <= K) continue;
      out.push({
        rule: 'maxConsecutiveWorkDays',
        personId: index.personId(p),
        days: [a, b],
        amount: b - a + 1 - K,
        message: `${index.personName(p)}: ${b - a + 1} working days in a row from day ${a} (at most ${K})`,
      });
    }
    return out;
  },
});
