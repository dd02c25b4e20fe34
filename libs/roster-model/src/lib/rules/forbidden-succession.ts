/**
 * Hard rule: explicit forbidden successions (shift type `to` may not follow `from` on the next day).
 * Only pairs of days inside the period are checked (the benchmark convention).
 * Model, per person, day d and type s: x[p,d,s] + Σ_{t forbidden after s} x[p,d+1,t] ≤ 1.
 */
import type { Violation } from '../result';
import { defineRule, type RuleModule } from '../model/context';

export const forbiddenSuccession: RuleModule = defineRule({
  name: 'forbiddenSuccession',
  build(ctx) {
    const { P, D, S } = ctx.index;
    const next = ctx.index.successors;
    for (let p = 0; p < P; p++) {
      for (let d = 0; d + 1 < D; d++) {
        for (let s = 0; s < S; s++) {
          const a = ctx.x(p, d, s);
          if (a < 0 || next[s].length === 0) continue;
          const terms: [number, number][] = [[a, 1]];
          for (const t of next[s]) {
            const b = ctx.x(p, d + 1, t);
            if (b >= 0) terms.push([b, 1]);
          }
          if (terms.length < 2) continue;
          ctx.addRow(`succ_${p}_${d}_${s}`, -Infinity, 1, terms, {
            rule: 'forbiddenSuccession',
            personId: ctx.index.personId(p),
            day: d,
            lastDay: d + 1,
            shiftTypeId: ctx.index.shiftId(s),
          });
        }
      }
    }
  },
  checkPerson(index, p, row) {
    const next = index.successors;
    const out: Violation[] = [];
    for (let d = 0; d + 1 < index.D; d++) {
      const s = row[d];
      const t = row[d + 1];
      if (s < 0 || t < 0 || !next[s].includes(t)) continue;
      out.push({
        rule: 'forbiddenSuccession',
        personId: index.personId(p),
        days: [d, d + 1],
        message: `${index.personName(p)}: ${index.shiftId(t)} on day ${d + 1} may not follow ${index.shiftId(s)} on day ${d}`,
      });
    }
    return out;
  },
});
