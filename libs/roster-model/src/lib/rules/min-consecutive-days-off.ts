/**
 * Hard rule: every run of days off lasts at least contract.minConsecutiveDaysOff (l) days, except
 * runs touching the first or last day of the period (border runs; problem.ts).
 * Strong form, the days-off counterpart of min-consecutive-work-days.ts:
 *   u[p,t] ≥ w[p,t−1] − w[p,t]                   (an off run starts on day t ≥ 1)
 *   Σ_{i=max(1,d−l+1)}^{d} u[p,i] + w[p,d] ≤ 1   (an off run that started in the last l days is still off on d)
 */
import type { Violation } from '../result';
import { defineRule, type RuleModule } from '../model/context';
import { changeColumns } from './min-consecutive-work-days';
import { runsOf } from './runs';

export const minConsecutiveDaysOff: RuleModule = defineRule({
  name: 'minConsecutiveDaysOff',
  build(ctx) {
    const { P, D } = ctx.index;
    for (let p = 0; p < P; p++) {
      const l = ctx.problem.people[p].contract.minConsecutiveDaysOff;
      if (l === undefined || l < 2 || D < 3) continue;
      const u = changeColumns(ctx, p, 'stop');
      for (let d = 2; d < D; d++) {
        const terms: [number, number][] = [];
        for (let i = Math.max(1, d - l + 1); i <= d; i++) terms.push([u[i], 1]);
        if (terms.length < 2) continue;
        terms.push(...ctx.workTerms(p, d, 1));
        ctx.addRow(`minOff_${p}_${d}`, -Infinity, 1, terms, {
          rule: 'minConsecutiveDaysOff',
          personId: ctx.index.personId(p),
          day: Math.max(1, d - l + 1),
          lastDay: d,
        });
      }
    }
  },
  checkPerson(index, p, row) {
    const out: Violation[] = [];
    const l = index.problem.people[p].contract.minConsecutiveDaysOff;
    if (l === undefined) return out;
    for (const [a, b] of runsOf(index.D, (d) => row[d] < 0)) {
      if (a === 0 || b === index.D - 1 || b - a + 1 >= l) continue;
      out.push({
        rule: 'minConsecutiveDaysOff',
        personId: index.personId(p),
        days: [a, b],
        amount: l - (b - a + 1),
        message: `${index.personName(p)}: only ${b - a + 1} day(s) off in a row from day ${a} (at least ${l})`,
      });
    }
    return out;
  },
});
