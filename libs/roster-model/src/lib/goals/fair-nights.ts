/**
 * Soft goal: spread of night shifts, weights.fairNights × (most nights − fewest nights) among
 * night-eligible people: those whose contract allows at least one night shift type
 * (maxShiftsPerType not 0). Nothing when fewer than two people are eligible.
 */
import type { GoalModule, Grid, ProblemIndex } from '../model/context';
import { buildSpread } from './spread';

export function nightEligible(index: ProblemIndex): number[] {
  const out: number[] = [];
  for (let p = 0; p < index.P; p++) {
    if (index.night.some((isNight, s) => isNight && index.maxShifts(p, s) > 0)) out.push(p);
  }
  return out;
}

function nights(index: ProblemIndex, g: Grid, p: number): number {
  return g[p].filter((s) => s >= 0 && index.night[s]).length;
}

export const fairNights: GoalModule = {
  name: 'fairNights',
  build(ctx) {
    const weight = ctx.weights.fairNights;
    const people = nightEligible(ctx.index);
    if (weight === 0 || people.length < 2) return;
    buildSpread(
      ctx,
      'fairNights',
      'nights',
      weight,
      people,
      (p) => [...Array(ctx.index.D).keys()].flatMap((d) => ctx.nightTerms(p, d)),
      (g, p) => nights(ctx.index, g, p),
    );
  },
  check(index, grid) {
    const people = nightEligible(index);
    if (index.weights.fairNights === 0 || people.length < 2) return 0;
    const counts = people.map((p) => nights(index, grid, p));
    return index.weights.fairNights * (Math.max(...counts) - Math.min(...counts));
  },
};
