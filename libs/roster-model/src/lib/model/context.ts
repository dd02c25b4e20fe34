/**
 * Shared lookups of a problem (used by the model builder and by the checker) and the build
 * context handed to every rule and goal module.
 *
 * A roster is handled internally as a "grid": grid[personIndex][day] = shift type index, or -1 for
 * a day off. `toGrid` converts a Roster (ids) into a grid and reports ids it does not know.
 */
import { DEFAULT_WEIGHTS, type ObjectiveWeights, type Roster, type RosterProblem } from '../problem';
import type { HardRuleName, ObjectiveTermName, Violation } from '../result';
import { buildTimeTable, isNightShift, weekendsOf, type TimeTable } from '../time';
import type { MipBuilder, RowMeta } from './builder';

export const NO_PIN = -2;
export const PIN_OFF = -1;

/** A roster as shift type indices: grid[person][day], -1 = day off. */
export type Grid = number[][];

/** A pair of assignments (s on day d, t on day d2 > d) whose rest falls below a limit. */
export interface RestConflict {
  d: number;
  s: number;
  d2: number;
  t: number;
  rest: number;
}

/** Everything rules, goals and the checker need to know about a problem, computed once. */
export class ProblemIndex {
  readonly P: number;
  readonly D: number;
  readonly S: number;
  readonly weights: ObjectiveWeights;
  readonly personIndex = new Map<string, number>();
  readonly shiftIndex = new Map<string, number>();
  readonly paid: number[];
  readonly night: boolean[];
  readonly weekends: number[][];
  /** absent[(p * D + d) * S + s] = 1 when an absence blocks shift s on day d for person p. */
  readonly absent: Uint8Array;
  /** pin[p * D + d] = NO_PIN, PIN_OFF or the pinned shift index. */
  readonly pin: Int32Array;
  readonly skills: Set<string>[];
  private timeTable: TimeTable | null = null;
  private maxShiftTable: Float64Array | null = null;
  private successorTable: number[][] | null = null;
  private readonly restCache = new Map<number, RestConflict[]>();

  constructor(readonly problem: RosterProblem) {
    this.P = problem.people.length;
    this.D = problem.days;
    this.S = problem.shiftTypes.length;
    this.weights = { ...DEFAULT_WEIGHTS, ...(problem.weights ?? {}) };
    problem.people.forEach((p, i) => this.personIndex.set(p.id, i));
    problem.shiftTypes.forEach((s, i) => this.shiftIndex.set(s.id, i));
    this.paid = problem.shiftTypes.map((s) => s.paidMinutes);
    this.night = problem.shiftTypes.map((s) => isNightShift(s));
    this.weekends = weekendsOf(problem);
    this.skills = problem.people.map((p) => new Set(p.skills));
    this.absent = new Uint8Array(this.P * this.D * this.S);
    for (const a of problem.absences) {
      const p = this.personIndex.get(a.personId);
      if (p === undefined || a.day < 0 || a.day >= this.D) continue;
      const list = a.shiftTypeIds
        ? a.shiftTypeIds.map((id) => this.shiftIndex.get(id)).filter((s): s is number => s !== undefined)
        : [...Array(this.S).keys()];
      for (const s of list) this.absent[(p * this.D + a.day) * this.S + s] = 1;
    }
    this.pin = new Int32Array(this.P * this.D).fill(NO_PIN);
    for (const pin of problem.pins) {
      const p = this.personIndex.get(pin.personId);
      if (p === undefined || pin.day < 0 || pin.day >= this.D) continue;
      if (pin.shiftTypeId === null) this.pin[p * this.D + pin.day] = PIN_OFF;
      else {
        const s = this.shiftIndex.get(pin.shiftTypeId);
        if (s !== undefined) this.pin[p * this.D + pin.day] = s;
      }
    }
  }

  get time(): TimeTable {
    if (!this.timeTable) this.timeTable = buildTimeTable(this.problem);
    return this.timeTable;
  }

  personId(p: number): string {
    return this.problem.people[p].id;
  }

  personName(p: number): string {
    return this.problem.people[p].name || this.problem.people[p].id;
  }

  shiftId(s: number): string {
    return this.problem.shiftTypes[s].id;
  }

  isAbsent(p: number, d: number, s: number): boolean {
    return this.absent[(p * this.D + d) * this.S + s] === 1;
  }

  pinOf(p: number, d: number): number {
    return this.pin[p * this.D + d];
  }

  /** Max shifts of type s for person p (Infinity when the contract sets none). */
  maxShifts(p: number, s: number): number {
    if (!this.maxShiftTable) {
      this.maxShiftTable = new Float64Array(this.P * this.S);
      for (let q = 0; q < this.P; q++) {
        for (let t = 0; t < this.S; t++) {
          const v = this.problem.people[q].contract.maxShiftsPerType?.[this.shiftId(t)];
          this.maxShiftTable[q * this.S + t] = v === undefined ? Infinity : v;
        }
      }
    }
    return this.maxShiftTable[p * this.S + s];
  }

  /** successors[s] = shift types that may not be worked the day after s (forbidden successions). */
  get successors(): number[][] {
    if (!this.successorTable) {
      const next: number[][] = this.problem.shiftTypes.map(() => []);
      for (const f of this.problem.forbiddenSuccessions) {
        const a = this.shiftIndex.get(f.from);
        const b = this.shiftIndex.get(f.to);
        if (a !== undefined && b !== undefined && !next[a].includes(b)) next[a].push(b);
      }
      this.successorTable = next;
    }
    return this.successorTable;
  }

  /** Whether x[p,d,s] can be 1 without breaking an absence, a pin or a zero max-shifts limit. */
  isFree(p: number, d: number, s: number): boolean {
    const pin = this.pinOf(p, d);
    if (pin !== NO_PIN) return pin === s && !this.isAbsent(p, d, s) && this.maxShifts(p, s) > 0;
    return !this.isAbsent(p, d, s) && this.maxShifts(p, s) > 0;
  }

  /** Whether the model has a column x[p,d,s]: free cells, plus pinned cells even when something forbids them. */
  hasColumn(p: number, d: number, s: number): boolean {
    const pin = this.pinOf(p, d);
    if (pin === s) return true;
    return this.isFree(p, d, s);
  }

  /**
   * All pairs of assignments, on different days, whose rest (real minutes from the end of the
   * first to the start of the second) is below `minRest`. Not only neighbouring days: a long shift
   * or a long rest limit can reach further.
   */
  restConflicts(minRest: number): RestConflict[] {
    const cached = this.restCache.get(minRest);
    if (cached) return cached;
    const { start, end } = this.time;
    const S = this.S;
    const out: RestConflict[] = [];
    for (let d = 0; d < this.D; d++) {
      for (let d2 = d + 1; d2 < this.D; d2++) {
        let minSeen = Infinity;
        for (let s = 0; s < S; s++) {
          for (let t = 0; t < S; t++) {
            const rest = start[d2 * S + t] - end[d * S + s];
            minSeen = Math.min(minSeen, rest);
            if (rest < minRest) out.push({ d, s, d2, t, rest });
          }
        }
        // Rest only grows with the day distance (by a day less at most an hour of clock change).
        if (minSeen >= minRest) break;
      }
    }
    this.restCache.set(minRest, out);
    return out;
  }

  /** Converts a Roster (ids) to a grid; unknown people are ignored, unknown shift ids are reported. */
  toGrid(roster: Roster): { grid: Grid; unknown: Violation[] } {
    const grid: Grid = [];
    const unknown: Violation[] = [];
    for (let p = 0; p < this.P; p++) {
      const row = new Array<number>(this.D).fill(-1);
      const cells = roster[this.personId(p)] ?? [];
      for (let d = 0; d < this.D; d++) {
        const id = cells[d];
        if (id === null || id === undefined || id === '') continue;
        const s = this.shiftIndex.get(id);
        if (s === undefined) {
          unknown.push({
            rule: 'unknownShiftType',
            personId: this.personId(p),
            days: [d],
            message: `${this.personName(p)}: day ${d} has unknown shift type "${id}"`,
          });
        } else row[d] = s;
      }
      grid.push(row);
    }
    return { grid, unknown };
  }

  fromGrid(grid: Grid): Roster {
    const roster: Roster = {};
    for (let p = 0; p < this.P; p++)
      roster[this.personId(p)] = grid[p].map((s) => (s < 0 ? null : this.shiftId(s)));
    return roster;
  }
}

/** The context every module's build() works in. */
export class ModelContext {
  /** x[(p * D + d) * S + s] = column index, or -1 when the assignment is impossible. */
  readonly xCol: Int32Array;
  /** Value functions of auxiliary columns, used by encode() to complete a roster's column vector. */
  readonly auxValue = new Map<number, (grid: Grid) => number>();
  private readonly coverRows = new Map<number, number>();
  private readonly weekendCols = new Map<string, number>();
  private readonly weekendExact = new Set<string>();
  private readonly workCols = new Map<number, number>();

  constructor(
    readonly index: ProblemIndex,
    readonly builder: MipBuilder,
  ) {
    const { P, D, S } = index;
    this.xCol = new Int32Array(P * D * S).fill(-1);
    for (let p = 0; p < P; p++) {
      for (let d = 0; d < D; d++) {
        for (let s = 0; s < S; s++) {
          if (!index.hasColumn(p, d, s)) continue;
          this.xCol[(p * D + d) * S + s] = builder.addColumn(`x_${p}_${d}_${s}`, 0, 1, 0, true, {
            kind: 'x',
            personId: index.personId(p),
            personIndex: p,
            day: d,
            shiftTypeId: index.shiftId(s),
            shiftIndex: s,
          });
        }
      }
    }
  }

  get problem(): RosterProblem {
    return this.index.problem;
  }

  get weights(): ObjectiveWeights {
    return this.index.weights;
  }

  x(p: number, d: number, s: number): number {
    return this.xCol[(p * this.index.D + d) * this.index.S + s];
  }

  /** x columns of person p on day d. */
  dayColumns(p: number, d: number): number[] {
    const out: number[] = [];
    for (let s = 0; s < this.index.S; s++) {
      const c = this.x(p, d, s);
      if (c >= 0) out.push(c);
    }
    return out;
  }

  /**
   * The work column w[p,d] ∈ [0,1] with Σ_s x[p,d,s] − w[p,d] = 0, created (by the oneShiftPerDay
   * rule, which this row states) when p has two or more possible shifts that day. Run, weekend and
   * day-off rows then hold one term per day instead of one per shift type: a much sparser matrix,
   * which the simplex method solves far faster on problems with many shift types.
   */
  workColumn(p: number, d: number): number {
    const key = p * this.index.D + d;
    const existing = this.workCols.get(key);
    if (existing !== undefined) return existing;
    const cols = this.dayColumns(p, d);
    if (cols.length < 2) return -1;
    const personId = this.index.personId(p);
    const w = this.addAux(`w_${p}_${d}`, 0, 1, 0, { rule: 'oneShiftPerDay', personId, day: d }, (g) =>
      g[p][d] >= 0 ? 1 : 0,
    );
    this.addRow(`one_${p}_${d}`, 0, 0, [...cols.map((c) => [c, 1] as [number, number]), [w, -1]], {
      rule: 'oneShiftPerDay',
      personId,
      day: d,
    });
    this.workCols.set(key, w);
    return w;
  }

  /** Terms of w[p,d] = Σ_s x[p,d,s] (1 when p works on day d): the work column, or the x columns. */
  workTerms(p: number, d: number, coef = 1): [number, number][] {
    const w = this.workCols.get(p * this.index.D + d);
    if (w !== undefined) return [[w, coef]];
    return this.dayColumns(p, d).map((c) => [c, coef] as [number, number]);
  }

  /** Terms of n[p,d] = Σ over night shift types of x[p,d,s]. */
  nightTerms(p: number, d: number, coef = 1): [number, number][] {
    const out: [number, number][] = [];
    for (let s = 0; s < this.index.S; s++) {
      const c = this.x(p, d, s);
      if (c >= 0 && this.index.night[s]) out.push([c, coef]);
    }
    return out;
  }

  /** Terms of paid minutes of p over the period, Σ paid[s]·x[p,d,s]. */
  paidTerms(p: number): [number, number][] {
    const out: [number, number][] = [];
    for (let d = 0; d < this.index.D; d++) {
      for (let s = 0; s < this.index.S; s++) {
        const c = this.x(p, d, s);
        if (c >= 0 && this.index.paid[s] !== 0) out.push([c, this.index.paid[s]]);
      }
    }
    return out;
  }

  addRow(
    name: string,
    lb: number,
    ub: number,
    terms: readonly (readonly [number, number])[],
    meta: RowMeta,
  ): number {
    return this.builder.addRow(name, lb, ub, terms, meta);
  }

  /** Adds a continuous auxiliary column with its value function for encode(). */
  addAux(
    name: string,
    lb: number,
    ub: number,
    cost: number,
    meta: {
      rule: HardRuleName | ObjectiveTermName;
      personId?: string;
      day?: number;
      shiftTypeId?: string;
      needIndex?: number;
    },
    value: (grid: Grid) => number,
  ): number {
    const col = this.builder.addColumn(name, lb, ub, cost, false, { kind: 'aux', ...meta });
    this.auxValue.set(col, value);
    return col;
  }

  /**
   * The cover balance row of a need: Σ x (people with the skill on that shift) + slacks = target.
   * Created on first use; the cover goals add their slack columns to it.
   */
  coverRow(needIndex: number): number {
    const existing = this.coverRows.get(needIndex);
    if (existing !== undefined) return existing;
    const need = this.problem.coverNeeds[needIndex];
    const s = this.index.shiftIndex.get(need.shiftTypeId);
    const terms: [number, number][] = [];
    if (s !== undefined) {
      for (let p = 0; p < this.index.P; p++) {
        if (need.skillId !== null && !this.index.skills[p].has(need.skillId)) continue;
        const c = this.x(p, need.day, s);
        if (c >= 0) terms.push([c, 1]);
      }
    }
    const row = this.addRow(`cover_${needIndex}`, need.target, need.target, terms, {
      rule: 'cover',
      day: need.day,
      shiftTypeId: need.shiftTypeId,
      needIndex,
    });
    this.coverRows.set(needIndex, row);
    return row;
  }

  /**
   * Continuous y[p,k] in [0,1] with y ≥ w[p,d] for each day d of weekend k (enough for "at most so
   * many weekends"). With `exact`, also y ≤ Σ_d w[p,d], which makes y exactly "p works on weekend k"
   * for any 0/1 x (needed when fewer worked weekends would pay, as in the fairness goal).
   */
  weekendVar(p: number, k: number, exact = false): number {
    const key = `${p}_${k}`;
    const days = this.index.weekends[k];
    let y = this.weekendCols.get(key);
    if (y === undefined) {
      y = this.addAux(
        `y_${p}_${k}`,
        0,
        1,
        0,
        { rule: 'maxWeekends', personId: this.index.personId(p), day: days[0] },
        (grid) => (days.some((d) => grid[p][d] >= 0) ? 1 : 0),
      );
      for (const d of days) {
        const w = this.workTerms(p, d);
        this.addRow(`wkLo_${p}_${d}`, 0, Infinity, [[y, 1], ...w.map(([c]) => [c, -1] as [number, number])], {
          rule: 'link',
          personId: this.index.personId(p),
          day: d,
        });
      }
      this.weekendCols.set(key, y);
    }
    if (exact && !this.weekendExact.has(key)) {
      const all = days.flatMap((d) => this.workTerms(p, d));
      this.addRow(`wkHi_${p}_${k}`, 0, Infinity, [...all, [y, -1]], {
        rule: 'link',
        personId: this.index.personId(p),
        day: days[0],
        lastDay: days[days.length - 1],
      });
      this.weekendExact.add(key);
    }
    return y;
  }
}

/** A hard rule: adds its rows to the model, and finds its violations in a roster without the solver. */
export interface RuleModule {
  name: HardRuleName;
  build(ctx: ModelContext): void;
  /** Violations of this rule by one person's row of the grid (every rule is about one person at a time). */
  checkPerson(index: ProblemIndex, p: number, row: readonly number[]): Violation[];
  /** Violations of this rule by the whole roster. */
  check(index: ProblemIndex, grid: Grid): Violation[];
}

/** Completes a rule from its per-person check. */
export function defineRule(rule: Omit<RuleModule, 'check'>): RuleModule {
  return {
    ...rule,
    check(index, grid) {
      const out: Violation[] = [];
      for (let p = 0; p < index.P; p++) out.push(...rule.checkPerson(index, p, grid[p]));
      return out;
    },
  };
}

/** A soft goal: adds its columns/costs to the model, and computes its weighted value from a roster. */
export interface GoalModule {
  name: ObjectiveTermName;
  build(ctx: ModelContext): void;
  check(index: ProblemIndex, grid: Grid): number;
}
