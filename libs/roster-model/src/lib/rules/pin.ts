/**
 * Hard rule: pinned cells keep their pinned value.
 * Model: a pin to a shift keeps only that column for the day and adds the row x ≥ 1; a pin to a
 * day off removes every column of the day.
 */
import type { Violation } from '../result';
import { defineRule, NO_PIN, PIN_OFF, type RuleModule } from '../model/context';

export const pin: RuleModule = defineRule({
  name: 'pin',
  build(ctx) {
    const { P, D } = ctx.index;
    for (let p = 0; p < P; p++) {
      for (let d = 0; d < D; d++) {
        const s = ctx.index.pinOf(p, d);
        if (s < 0) continue;
        ctx.addRow(`pin_${p}_${d}`, 1, Infinity, [[ctx.x(p, d, s), 1]], {
          rule: 'pin',
          personId: ctx.index.personId(p),
          day: d,
          shiftTypeId: ctx.index.shiftId(s),
        });
      }
    }
  },
  checkPerson(index, p, row) {
    const out: Violation[] = [];
    for (let d = 0; d < index.D; d++) {
      const want = index.pinOf(p, d);
      if (want === NO_PIN || row[d] === want) continue;
      const wantWords = want === PIN_OFF ? 'a day off' : `shift ${index.shiftId(want)}`;
      const got = row[d] < 0 ? 'a day off' : `shift ${index.shiftId(row[d])}`;
      out.push({
        rule: 'pin',
        personId: index.personId(p),
        days: [d],
        message: `${index.personName(p)}: day ${d} is pinned to ${wantWords} but has ${got}`,
      });
    }
    return out;
  },
});
