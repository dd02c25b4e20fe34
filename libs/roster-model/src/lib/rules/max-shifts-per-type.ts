/**
 * Hard rule: at most maxShiftsPerType[s] shifts of type s per person in the period.
 * Model: Σ_d x[p,d,s] ≤ limit (a limit of 0 removes the columns instead; the row is written only
 * when the remaining columns could exceed the limit).
 */
import type { Violation } from '../result';
import { defineRule, type RuleModule } from '../model/context';

export const maxShiftsPerType: RuleModule = defineRule({
  name: 'maxShiftsPerType',
  build(ctx) {
    const { P, D, S } = ctx.index;
    for (let p = 0; p < P; p++) {
      for (let s = 0; s < S; s++) {
        const limit = ctx.index.maxShifts(p, s);
        if (!Number.isFinite(limit)) continue;
        const terms: [number, number][] = [];
        for (let d = 0; d < D; d++) {
          const c = ctx.x(p, d, s);
          if (c >= 0) terms.push([c, 1]);
        }
        if (terms.length <= limit) continue;
        ctx.addRow(`maxType_${p}_${s}`, -Infinity, limit, terms, {
          rule: 'maxShiftsPerType',
          personId: ctx.index.personId(p),
          shiftTypeId: ctx.index.shiftId(s),
        });
      }
    }
  },
  checkPerson(index, p, row) {
    const out: Violation[] = [];
    const counts = new Array<number>(index.S).fill(0);
    for (const s of row) if (s >= 0) counts[s]++;
    for (let s = 0; s < index.S; s++) {
      const limit = index.maxShifts(p, s);
      if (counts[s] <= limit) continue;
      const days = row.flatMap((v, d) => (v === s ? [d] : []));
      out.push({
        rule: 'maxShiftsPerType',
        personId: index.personId(p),
        days,
        amount: days.length - limit,
        message: `${index.personName(p)}: ${days.length} ${index.shiftId(s)} shifts (at most ${limit})`,
      });
    }
    return out;
  },
});
