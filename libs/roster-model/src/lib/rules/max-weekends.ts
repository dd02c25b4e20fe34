/**
 * Hard rule: at most contract.maxWeekends worked weekends (a weekend is worked when any of its
 * days is worked; a weekend cut by the period's border counts with its days inside).
 * Model: y[p,k] ∈ [0,1] continuous with y ≥ w[p,d] for each day of weekend k (and y ≤ Σ w, which
 * makes y exactly "worked" for 0/1 x); Σ_k y[p,k] ≤ maxWeekends.
 */
import type { Violation } from '../result';
import { defineRule, type RuleModule } from '../model/context';

export const maxWeekends: RuleModule = defineRule({
  name: 'maxWeekends',
  build(ctx) {
    const { P } = ctx.index;
    const K = ctx.index.weekends.length;
    for (let p = 0; p < P; p++) {
      const max = ctx.problem.people[p].contract.maxWeekends;
      if (max === undefined || max >= K) continue;
      const terms: [number, number][] = [];
      for (let k = 0; k < K; k++) {
        if (ctx.index.weekends[k].every((d) => ctx.workTerms(p, d).length === 0)) continue;
        terms.push([ctx.weekendVar(p, k), 1]);
      }
      if (terms.length <= max) continue;
      ctx.addRow(`maxWk_${p}`, -Infinity, max, terms, {
        rule: 'maxWeekends',
        personId: ctx.index.personId(p),
      });
    }
  },
  checkPerson(index, p, row) {
    const out: Violation[] = [];
    const max = index.problem.people[p].contract.maxWeekends;
    if (max === undefined) return out;
    const worked = index.weekends.filter((days) => days.some((d) => row[d] >= 0));
    if (worked.length <= max) return out;
    out.push({
      rule: 'maxWeekends',
      personId: index.personId(p),
      days: worked.map((days) => days[0]),
      amount: worked.length - max,
      message: `${index.personName(p)}: ${worked.length} weekends worked (at most ${max})`,
    });
    return out;
  },
});
