/**
 * Hard rule: no shift on a day (or shift type) blocked by leave, unavailability or a fixed day off.
 * Model: blocked cells get no column at all; only when a pin forces a blocked cell does the
 * column exist, and then a row x ≤ 0 states the absence (so a conflict can be explained).
 */
import type { Violation } from '../result';
import { defineRule, type RuleModule } from '../model/context';

const WORDS = { leave: 'on leave', unavailable: 'unavailable', fixedDayOff: 'on a fixed day off' } as const;

export const absence: RuleModule = defineRule({
  name: 'absence',
  build(ctx) {
    const { P, D, S } = ctx.index;
    for (let p = 0; p < P; p++) {
      for (let d = 0; d < D; d++) {
        for (let s = 0; s < S; s++) {
          const c = ctx.x(p, d, s);
          if (c < 0 || !ctx.index.isAbsent(p, d, s)) continue;
          ctx.addRow(`abs_${p}_${d}_${s}`, -Infinity, 0, [[c, 1]], {
            rule: 'absence',
            personId: ctx.index.personId(p),
            day: d,
            shiftTypeId: ctx.index.shiftId(s),
          });
        }
      }
    }
  },
  checkPerson(index, p, row) {
    const out: Violation[] = [];
    for (let d = 0; d < index.D; d++) {
      const s = row[d];
      if (s < 0 || !index.isAbsent(p, d, s)) continue;
      const personId = index.personId(p);
      const shiftId = index.shiftId(s);
      const a = index.problem.absences.find(
        (x) =>
          x.personId === personId && x.day === d && (!x.shiftTypeIds || x.shiftTypeIds.includes(shiftId)),
      );
      out.push({
        rule: 'absence',
        personId,
        days: [d],
        message: `${index.personName(p)} is ${a ? WORDS[a.kind] : 'absent'} on day ${d} but has shift ${shiftId}`,
      });
    }
    return out;
  },
});
