/**
 * Hard rule: at most contract.maxPaidMinutes paid minutes in the period.
 * Model: Σ_{d,s} paid[s]·x[p,d,s] ≤ max (skipped when even the longest shift every day stays within it).
 */
import type { Violation } from '../result';
import { defineRule, type RuleModule } from '../model/context';
import { paidMinutesOf } from './min-paid-minutes';
import { hours } from '../explain/words';

export const maxPaidMinutes: RuleModule = defineRule({
  name: 'maxPaidMinutes',
  build(ctx) {
    for (let p = 0; p < ctx.index.P; p++) {
      const max = ctx.problem.people[p].contract.maxPaidMinutes;
      if (max === undefined) continue;
      const terms = ctx.paidTerms(p);
      // Upper estimate of the total: the longest possible shift on each day.
      const longest = new Map<number, number>();
      for (const [c, v] of terms) {
        const meta = ctx.builder.columnMeta[c];
        if (meta.kind === 'x') longest.set(meta.day, Math.max(longest.get(meta.day) ?? 0, v));
      }
      let bound = 0;
      for (const v of longest.values()) bound += v;
      if (bound <= max) continue;
      ctx.addRow(`maxPaid_${p}`, -Infinity, max, terms, {
        rule: 'maxPaidMinutes',
        personId: ctx.index.personId(p),
      });
    }
  },
  checkPerson(index, p, row) {
    const out: Violation[] = [];
    const max = index.problem.people[p].contract.maxPaidMinutes;
    if (max === undefined) return out;
    const total = paidMinutesOf(index.paid, row);
    if (total <= max) return out;
    out.push({
      rule: 'maxPaidMinutes',
      personId: index.personId(p),
      days: [],
      amount: total - max,
      message: `${index.personName(p)}: ${hours(total)} paid (the contract allows at most ${hours(max)})`,
    });
    return out;
  },
});
