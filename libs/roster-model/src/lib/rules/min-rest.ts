/**
 * Hard rule: minimum rest (contract.minRestMinutes) between the end of one shift and the start of
 * the next, measured in real time in the unit's time zone (so across midnight and clock changes).
 * Every pair of days is considered whose rest can fall below the limit, not only neighbours.
 * Model, per person, first assignment (d, s) and later day d2: x[p,d,s] + Σ_t x[p,d2,t] ≤ 1 over
 * the shift types t on d2 that start too soon (valid because d2 holds at most one shift).
 */
import type { Violation } from '../result';
import { defineRule, type RuleModule } from '../model/context';

export const minRest: RuleModule = defineRule({
  name: 'minRest',
  build(ctx) {
    const { P } = ctx.index;
    for (let p = 0; p < P; p++) {
      const limit = ctx.problem.people[p].contract.minRestMinutes;
      if (!limit || limit <= 0) continue;
      const groups = new Map<string, { d: number; s: number; d2: number; ts: number[] }>();
      for (const c of ctx.index.restConflicts(limit)) {
        if (ctx.x(p, c.d, c.s) < 0 || ctx.x(p, c.d2, c.t) < 0) continue;
        const key = `${c.d}_${c.s}_${c.d2}`;
        const g = groups.get(key) ?? { d: c.d, s: c.s, d2: c.d2, ts: [] };
        g.ts.push(c.t);
        groups.set(key, g);
      }
      for (const [key, g] of groups) {
        const terms: [number, number][] = [
          [ctx.x(p, g.d, g.s), 1],
          ...g.ts.map((t) => [ctx.x(p, g.d2, t), 1] as [number, number]),
        ];
        ctx.addRow(`rest_${p}_${key}`, -Infinity, 1, terms, {
          rule: 'minRest',
          personId: ctx.index.personId(p),
          day: g.d,
          lastDay: g.d2,
          shiftTypeId: ctx.index.shiftId(g.s),
        });
      }
    }
  },
  checkPerson(index, p, row) {
    const out: Violation[] = [];
    const limit = index.problem.people[p].contract.minRestMinutes;
    if (!limit || limit <= 0) return out;
    for (const c of index.restConflicts(limit)) {
      if (row[c.d] !== c.s || row[c.d2] !== c.t) continue;
      out.push({
        rule: 'minRest',
        personId: index.personId(p),
        days: [c.d, c.d2],
        amount: limit - c.rest,
        message:
          `${index.personName(p)}: only ${fmtMinutes(c.rest)} rest between ${index.shiftId(c.s)} on day ${c.d} ` +
          `and ${index.shiftId(c.t)} on day ${c.d2} (at least ${fmtMinutes(limit)})`,
      });
    }
    return out;
  },
});

function fmtMinutes(m: number): string {
  const h = Math.floor(Math.abs(m) / 60);
  const r = Math.abs(m) % 60;
  return `${m < 0 ? '-' : ''}${h} h${r ? ` ${r} min` : ''}`;
}
