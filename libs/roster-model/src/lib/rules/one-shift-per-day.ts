/**
 * Hard rule: at most one shift per person per day.
 * Model: Σ_s x[p,d,s] − w[p,d] = 0 with the work column w[p,d] ∈ [0,1], for each person and day with
 * two or more possible shifts (see ModelContext.workColumn; the other rules use w).
 * Check: a Roster holds one entry per person and day, so a roster cannot break this rule; the
 * check has nothing to find (it exists so every rule has the same shape).
 */
import { defineRule, type RuleModule } from '../model/context';

export const oneShiftPerDay: RuleModule = defineRule({
  name: 'oneShiftPerDay',
  build(ctx) {
    const { P, D } = ctx.index;
    for (let p = 0; p < P; p++) for (let d = 0; d < D; d++) ctx.workColumn(p, d);
  },
  checkPerson() {
    return [];
  },
});
