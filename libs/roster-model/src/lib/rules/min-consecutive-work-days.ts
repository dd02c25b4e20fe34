/**
 * Hard rule: every run of working days lasts at least contract.minConsecutiveWorkDays (m) days,
 * except runs touching the first or last day of the period (border runs; problem.ts).
 *
 * Strong form (the "start-up" formulation known from minimum up-time constraints, which with the
 * days-off counterpart describes the convex hull of those two rules alone):
 *   v[p,t] ≥ w[p,t] − w[p,t−1]           (v continuous in [0,1]: a run starts on day t ≥ 1)
 *   Σ_{i=max(1,d−m+1)}^{d} v[p,i] ≤ w[p,d] (a run that started in the last m days still works on d)
 * A run starting on day 0 has no v and is exempt; a run reaching the last day works every day it
 * must, so border runs are exempt as the convention requires.
 */
import type { Violation } from '../result';
import { defineRule, type ModelContext, type RuleModule } from '../model/context';
import { runsOf } from './runs';

/** The start (or end) indicator columns v[p,1..D-1], created once per person and rule. */
export function changeColumns(ctx: ModelContext, p: number, kind: 'start' | 'stop'): number[] {
  const { D } = ctx.index;
  const personId = ctx.index.personId(p);
  const rule = kind === 'start' ? 'minConsecutiveWorkDays' : 'minConsecutiveDaysOff';
  const cols: number[] = [-1];
  for (let t = 1; t < D; t++) {
    const value =
      kind === 'start'
        ? (g: number[][]) => (g[p][t] >= 0 && g[p][t - 1] < 0 ? 1 : 0)
        : (g: number[][]) => (g[p][t] < 0 && g[p][t - 1] >= 0 ? 1 : 0);
    const v = ctx.addAux(
      `${kind === 'start' ? 'vOn' : 'vOff'}_${p}_${t}`,
      0,
      1,
      0,
      { rule, personId, day: t },
      value,
    );
    // start: v − w[t] + w[t−1] ≥ 0;  stop: v + w[t] − w[t−1] ≥ 0
    const sign = kind === 'start' ? 1 : -1;
    ctx.addRow(
      `${kind === 'start' ? 'defOn' : 'defOff'}_${p}_${t}`,
      0,
      Infinity,
      [[v, 1], ...ctx.workTerms(p, t, -sign), ...ctx.workTerms(p, t - 1, sign)],
      { rule: 'link', personId, day: t },
    );
    cols.push(v);
  }
  return cols;
}

export const minConsecutiveWorkDays: RuleModule = defineRule({
  name: 'minConsecutiveWorkDays',
  build(ctx) {
    const { P, D } = ctx.index;
    for (let p = 0; p < P; p++) {
      const m = ctx.problem.people[p].contract.minConsecutiveWorkDays;
      if (m === undefined || m < 2 || D < 3) continue;
      const v = changeColumns(ctx, p, 'start');
      for (let d = 2; d < D; d++) {
        const terms: [number, number][] = [];
        for (let i = Math.max(1, d - m + 1); i <= d; i++) terms.push([v[i], 1]);
        if (terms.length < 2) continue;
        terms.push(...ctx.workTerms(p, d, -1));
        ctx.addRow(`minCons_${p}_${d}`, -Infinity, 0, terms, {
          rule: 'minConsecutiveWorkDays',
          personId: ctx.index.personId(p),
          day: Math.max(1, d - m + 1),
          lastDay: d,
        });
      }
    }
  },
  checkPerson(index, p, row) {
    const out: Violation[] = [];
    const m = index.problem.people[p].contract.minConsecutiveWorkDays;
    if (m === undefined) return out;
    for (const [a, b] of runsOf(index.D, (d) => row[d] >= 0)) {
      if (a === 0 || b === index.D - 1 || b - a + 1 >= m) continue;
      out.push({
        rule: 'minConsecutiveWorkDays',
        personId: index.personId(p),
        days: [a, b],
        amount: m - (b - a + 1),
        message: `${index.personName(p)}: only ${b - a + 1} working day(s) in a row from day ${a} (at least ${m})`,
      });
    }
    return out;
  },
});
