/**
 * Shared model of a fairness spread: hi ≥ count[p] and lo ≤ count[p] for every person in the
 * group, with cost weight·(hi − lo), so at the optimum hi − lo = max − min of the counts.
 */
import type { ObjectiveTermName } from '../result';
import type { Grid, ModelContext } from '../model/context';

export function buildSpread(
  ctx: ModelContext,
  rule: ObjectiveTermName,
  tag: string,
  weight: number,
  people: number[],
  countTerms: (p: number) => [number, number][],
  count: (g: Grid, p: number) => number,
): void {
  const values = (g: Grid) => people.map((p) => count(g, p));
  const hi = ctx.addAux(`${tag}Hi`, 0, Infinity, weight, { rule }, (g) => Math.max(...values(g)));
  const lo = ctx.addAux(`${tag}Lo`, 0, Infinity, -weight, { rule }, (g) => Math.min(...values(g)));
  for (const p of people) {
    const terms = countTerms(p);
    const personId = ctx.index.personId(p);
    ctx.addRow(
      `${tag}Hi_${p}`,
      0,
      Infinity,
      [[hi, 1], ...terms.map(([c, v]) => [c, -v] as [number, number])],
      {
        rule,
        personId,
      },
    );
    ctx.addRow(`${tag}Lo_${p}`, 0, Infinity, [...terms, [lo, -1]], { rule, personId });
  }
}
