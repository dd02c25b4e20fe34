/**
 * Hard rule: at least contract.minPaidMinutes paid minutes in the period.
 * Model: Σ_{d,s} paid[s]·x[p,d,s] ≥ min.
 */
import type { Violation } from '../result';
import { defineRule, type RuleModule } from '../model/context';
import { hours } from '../explain/words';

export function paidMinutesOf(paid: readonly number[], row: readonly number[]): number {
  let total = 0;
  for (const s of row) if (s >= 0) total += paid[s];
  return total;
}

export const minPaidMinutes: RuleModule = defineRule({
  name: 'minPaidMinutes',
  build(ctx) {
    for (let p = 0; p < ctx.index.P; p++) {
      const min = ctx.problem.people[p].contract.minPaidMinutes;
      if (min === undefined || min <= 0) continue;
      ctx.addRow(`minPaid_${p}`, min, Infinity, ctx.paidTerms(p), {
        rule: 'minPaidMinutes',
        personId: ctx.index.personId(p),
      });
    }
  },
  checkPerson(index, p, row) {
    const out: Violation[] = [];
    const min = index.problem.people[p].contract.minPaidMinutes;
    if (min === undefined) return out;
    const total = paidMinutesOf(index.paid, row);
    if (total >= min) return out;
    out.push({
      rule: 'minPaidMinutes',
      personId: index.personId(p),
      days: [],
      amount: min - total,
      message: `${index.personName(p)}: ${hours(total)} paid (the contract asks for at least ${hours(min)})`,
    });
    return out;
  },
});
