/**
 * "What if" checks for explanations: change one cell of a roster and ask the checker's own rule
 * and goal modules what breaks and what costs more. Nothing here uses the solver.
 *
 * Hard rules are all about one person, so a change to person p is checked with each rule's
 * per-person check (fast enough to try every candidate for every short need). Goal terms span
 * people (cover, fairness), so they are recomputed on the whole roster.
 */
import type { RosterProblem } from '../problem';
import type { ObjectiveTermName, Violation } from '../result';
import { GOALS } from '../goals';
import { type ProblemIndex, type Grid } from '../model/context';
import { RULES } from '../rules';

export interface TermChange {
  term: ObjectiveTermName;
  delta: number;
}

export class WhatIf {
  private readonly baselineKeys = new Map<number, Set<string>>();
  private baselineTerms: Map<ObjectiveTermName, number> | null = null;

  constructor(
    readonly index: ProblemIndex,
    readonly grid: Grid,
  ) {}

  get problem(): RosterProblem {
    return this.index.problem;
  }

  private static key(v: Violation): string {
    return `${v.rule}|${v.days.join(',')}|${v.message}`;
  }

  /** Hard-rule violations of person p with `row` as their roster row. */
  violationsOf(p: number, row: readonly number[]): Violation[] {
    return RULES.flatMap((rule) => rule.checkPerson(this.index, p, row));
  }

  /** Violations that giving person p shift `s` (or -1: a day off) on `day` would add to the roster. */
  newViolations(p: number, day: number, s: number): Violation[] {
    let base = this.baselineKeys.get(p);
    if (!base) {
      base = new Set(this.violationsOf(p, this.grid[p]).map(WhatIf.key));
      this.baselineKeys.set(p, base);
    }
    const row = this.grid[p].slice();
    row[day] = s;
    const known = base;
    return this.violationsOf(p, row).filter((v) => !known.has(WhatIf.key(v)));
  }

  private termsOf(grid: Grid): Map<ObjectiveTermName, number> {
    return new Map(GOALS.map((g) => [g.name, g.check(this.index, grid)]));
  }

  /** How each objective term would change (only the terms that change, largest increase first). */
  termChanges(p: number, day: number, s: number): TermChange[] {
    if (!this.baselineTerms) this.baselineTerms = this.termsOf(this.grid);
    const before = this.grid[p][day];
    this.grid[p][day] = s;
    try {
      const after = this.termsOf(this.grid);
      const out: TermChange[] = [];
      for (const [term, value] of after) {
        const delta = value - (this.baselineTerms.get(term) ?? 0);
        if (Math.abs(delta) > 1e-9) out.push({ term, delta });
      }
      return out.sort((a, b) => b.delta - a.delta);
    } finally {
      this.grid[p][day] = before;
    }
  }
}
