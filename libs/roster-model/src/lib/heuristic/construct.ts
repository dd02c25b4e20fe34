/**
 * A fast construction heuristic and a simple local search, used to hand HiGHS a good first roster
 * (warm start) and to give a roster at once when there is no time to solve.
 *
 * Pins and absences are always respected: pinned cells are never changed, and a cell is only given
 * a shift type the person may work that day (ProblemIndex.isFree). Every other hard rule is a
 * heavy penalty, computed with the rules' own per-person checks, so the search leaves a rule broken
 * only when it finds no way round it. The soft part of the score uses the goals' own formulas.
 *
 * construct(problem): greedy filling of cover needs by priority (most costly shortfall first, then
 * the cheapest person to add), then improve() for a short time.
 * improve(problem, roster): random first-improvement search over three moves: change one cell,
 * swap two people's cells on a day, set a block of consecutive days to one shift type or off.
 */
import type { Roster, RosterProblem } from '../problem';
import type { Violation } from '../result';
import { coverCount, coverGaps, needWeights } from '../goals/cover';
import { nightEligible } from '../goals/fair-nights';
import { requestHonoured } from '../goals/requests';
import { NO_PIN, ProblemIndex, type Grid } from '../model/context';
import { RULES } from '../rules';
import { paidMinutesOf } from '../rules/min-paid-minutes';
import { mulberry32 } from '../random';

export interface ConstructOptions {
  /** Seed of the random moves (same seed and iteration limit → same roster). */
  seed?: number;
  /** Time in milliseconds for the greedy fill and the local search together (default 1000). */
  timeLimitMs?: number;
  /** When set, the local search stops after this many moves whatever the time (repeatable results). */
  maxIterations?: number;
}

/** The search state: a grid with incrementally maintained cover counts and per-person scores. */
class Search {
  readonly grid: Grid;
  private readonly needsAt: number[][]; // needs at d*S+s
  private readonly count: number[];
  /** Hard penalty and person-local soft score of each person's row. */
  private readonly hardOf: number[];
  private readonly softOf: number[];
  private readonly requestsOf: number[][];
  private readonly eligibleNights: number[];
  private readonly nights: number[];
  private readonly weekendsWorked: number[];
  /** Weight of one unit of hard penalty; `soft` scales every soft term (both change between phases). */
  big: number;
  soft = 1;
  readonly bigDefault: number;
  private readonly avgPaid: number;

  constructor(
    readonly index: ProblemIndex,
    start: Grid,
  ) {
    const { P, D, S, problem } = index;
    this.grid = start.map((r) => r.slice());
    this.needsAt = Array.from({ length: D * S }, () => []);
    problem.coverNeeds.forEach((n, i) => {
      const s = index.shiftIndex.get(n.shiftTypeId);
      if (s !== undefined) this.needsAt[n.day * S + s].push(i);
    });
    this.count = problem.coverNeeds.map((n) => coverCount(index, n, this.grid));
    this.requestsOf = Array.from({ length: P }, () => []);
    problem.requests.forEach((r, i) => {
      const p = index.personIndex.get(r.personId);
      if (p !== undefined) this.requestsOf[p].push(i);
    });
    this.eligibleNights = nightEligible(index);
    this.nights = this.grid.map((row) => row.filter((s) => s >= 0 && index.night[s]).length);
    this.weekendsWorked = this.grid.map((row) => this.weekendsOf(row));
    const w = index.weights;
    // Reductions rather than Math.max(...list): lists can be longer than the argument limit.
    const maxNeed = problem.coverNeeds.reduce((m, n) => {
      const nw = needWeights(index, n);
      return Math.max(m, nw.underMin, nw.underTarget, nw.over);
    }, 0);
    const maxReq = problem.requests.reduce((m, r) => Math.max(m, r.weight), 0) * w.requests;
    const maxRate = problem.people.reduce((m, p) => Math.max(m, p.hourlyCost ?? 0), 0);
    const maxPaid = index.paid.reduce((m, v) => Math.max(m, v), 0);
    this.avgPaid = index.paid.length
      ? Math.max(1, index.paid.reduce((a, b) => a + b, 0) / index.paid.length)
      : 1;
    // A hard violation must outweigh anything one move can gain on the soft goals.
    this.big =
      1000 +
      10 *
        (2 * maxNeed +
          2 * maxReq +
          w.changes +
          2 * (w.fairNights + w.fairWeekends) +
          (w.labourCost * maxRate * maxPaid) / 60 +
          (w.hoursDeviation * maxPaid) / 60);
    this.bigDefault = this.big;
    const parts = this.grid.map((row, p) => this.partsOf(p, row));
    this.hardOf = parts.map((x) => x[0]);
    this.softOf = parts.map((x) => x[1]);
  }

  private weekendsOf(row: readonly number[]): number {
    return this.index.weekends.filter((days) => days.some((d) => row[d] >= 0)).length;
  }

  private severity(v: Violation): number {
    const a = v.amount ?? 1;
    if (v.rule === 'minPaidMinutes' || v.rule === 'maxPaidMinutes') return 1 + Math.min(10, a / this.avgPaid);
    if (v.rule === 'minRest') return 1 + Math.min(10, a / 600);
    return 1 + Math.min(10, a);
  }

  /** Hard penalty and person-local soft goals (requests, changes, labour cost, hours) of one row. */
  partsOf(p: number, row: readonly number[]): [number, number] {
    const { index } = this;
    let hard = 0;
    for (const rule of RULES) for (const v of rule.checkPerson(index, p, row)) hard += this.severity(v);
    const w = index.weights;
    let soft = 0;
    if (w.requests !== 0 && this.requestsOf[p].length) {
      const one: Grid = [];
      one[p] = row as number[];
      for (const i of this.requestsOf[p]) {
        const r = index.problem.requests[i];
        if (!requestHonoured(index, r, one)) soft += r.weight * w.requests;
      }
    }
    const published = index.problem.published?.[index.personId(p)];
    if (published && w.changes !== 0) {
      for (let d = 0; d < Math.min(published.length, index.D); d++) {
        const id = published[d];
        if (id === undefined) continue;
        const s = id === null || id === '' ? -1 : (index.shiftIndex.get(id) ?? -3);
        if (s !== -3 && row[d] !== s) soft += w.changes;
      }
    }
    const contract = index.problem.people[p].contract;
    const paid = paidMinutesOf(index.paid, row);
    if (w.labourCost !== 0) soft += (w.labourCost * (index.problem.people[p].hourlyCost ?? 0) * paid) / 60;
    if (w.hoursDeviation !== 0 && contract.targetPaidMinutes !== undefined) {
      soft += (w.hoursDeviation * Math.abs(paid - contract.targetPaidMinutes)) / 60;
    }
    return [hard, soft];
  }

  private coverCost(needIndex: number, count: number): number {
    const need = this.index.problem.coverNeeds[needIndex];
    const g = coverGaps(need, count);
    const nw = needWeights(this.index, need);
    return g.underMin * nw.underMin + g.underTarget * nw.underTarget + g.over * nw.over;
  }

  /** Change in cover cost when person p moves from shift a to shift b on day d. */
  private coverDelta(p: number, d: number, a: number, b: number): number {
    if (a === b) return 0;
    const { S, skills, problem } = this.index;
    let delta = 0;
    const apply = (s: number, step: number) => {
      if (s < 0) return;
      for (const i of this.needsAt[d * S + s]) {
        const skill = problem.coverNeeds[i].skillId;
        if (skill !== null && !skills[p].has(skill)) continue;
        delta += this.coverCost(i, this.count[i] + step) - this.coverCost(i, this.count[i]);
        this.count[i] += step; // applied temporarily, undone below
      }
    };
    apply(a, -1);
    apply(b, +1);
    // undo
    const undo = (s: number, step: number) => {
      if (s < 0) return;
      for (const i of this.needsAt[d * S + s]) {
        const skill = problem.coverNeeds[i].skillId;
        if (skill !== null && !skills[p].has(skill)) continue;
        this.count[i] -= step;
      }
    };
    undo(b, +1);
    undo(a, -1);
    return delta;
  }

  private spread(values: number[], people: number[] | null): number {
    let hi = -Infinity;
    let lo = Infinity;
    if (people) {
      for (const p of people) {
        hi = Math.max(hi, values[p]);
        lo = Math.min(lo, values[p]);
      }
    } else {
      for (const v of values) {
        hi = Math.max(hi, v);
        lo = Math.min(lo, v);
      }
    }
    return hi - lo;
  }

  private fairDelta(changes: { p: number; row: readonly number[] }[]): number {
    const { index } = this;
    const w = index.weights;
    let delta = 0;
    if (w.fairNights !== 0 && this.eligibleNights.length >= 2) {
      const before = this.spread(this.nights, this.eligibleNights);
      const saved = changes.map(({ p }) => this.nights[p]);
      for (const { p, row } of changes) this.nights[p] = row.filter((s) => s >= 0 && index.night[s]).length;
      delta += w.fairNights * (this.spread(this.nights, this.eligibleNights) - before);
      changes.forEach(({ p }, i) => (this.nights[p] = saved[i]));
    }
    if (w.fairWeekends !== 0 && index.P >= 2 && index.weekends.length > 0) {
      const before = this.spread(this.weekendsWorked, null);
      const saved = changes.map(({ p }) => this.weekendsWorked[p]);
      for (const { p, row } of changes) this.weekendsWorked[p] = this.weekendsOf(row);
      delta += w.fairWeekends * (this.spread(this.weekendsWorked, null) - before);
      changes.forEach(({ p }, i) => (this.weekendsWorked[p] = saved[i]));
    }
    return delta;
  }

  /** Score change of replacing the rows of some people (cells listed per person). Returns [delta, new scores]. */
  evaluate(changes: { p: number; row: number[] }[]): { delta: number; scores: number[] } {
    let delta = 0;
    const scores: number[] = [];
    for (const { p, row } of changes) {
      const [h, sf] = this.partsOf(p, row);
      scores.push(h, sf);
      delta += (h - this.hardOf[p]) * this.big + (sf - this.softOf[p]) * this.soft;
    }
    // Cover: apply cell changes one after another so two people on the same need are counted right.
    const applied: [number, number, number, number][] = [];
    for (const { p, row } of changes) {
      for (let d = 0; d < this.index.D; d++) {
        if (row[d] === this.grid[p][d]) continue;
        delta += this.soft * this.coverDelta(p, d, this.grid[p][d], row[d]);
        this.shiftCounts(p, d, this.grid[p][d], row[d]);
        applied.push([p, d, this.grid[p][d], row[d]]);
      }
    }
    for (let k = applied.length - 1; k >= 0; k--) {
      const [p, d, a, b] = applied[k];
      this.shiftCounts(p, d, b, a);
    }
    delta += this.soft * this.fairDelta(changes);
    return { delta, scores };
  }

  private shiftCounts(p: number, d: number, a: number, b: number): void {
    const { S, skills, problem } = this.index;
    const step = (s: number, by: number) => {
      if (s < 0) return;
      for (const i of this.needsAt[d * S + s]) {
        const skill = problem.coverNeeds[i].skillId;
        if (skill === null || skills[p].has(skill)) this.count[i] += by;
      }
    };
    step(a, -1);
    step(b, +1);
  }

  commit(changes: { p: number; row: number[] }[], scores: number[]): void {
    changes.forEach(({ p, row }, k) => {
      for (let d = 0; d < this.index.D; d++) {
        if (row[d] !== this.grid[p][d]) this.shiftCounts(p, d, this.grid[p][d], row[d]);
      }
      this.grid[p] = row;
      this.hardOf[p] = scores[2 * k];
      this.softOf[p] = scores[2 * k + 1];
      this.nights[p] = row.filter((s) => s >= 0 && this.index.night[s]).length;
      this.weekendsWorked[p] = this.weekendsOf(row);
    });
  }

  /** Total hard penalty of the current grid. */
  get hard(): number {
    return this.hardOf.reduce((a, b) => a + b, 0);
  }

  /** Goes back to an earlier grid (all counts and scores recomputed). */
  restore(grid: Grid): void {
    const changes = grid
      .map((row, p) => ({ p, row: row.slice() }))
      .filter(({ p, row }) => row.some((v, d) => v !== this.grid[p][d]));
    const scores = changes.flatMap(({ p, row }) => this.partsOf(p, row));
    this.commit(changes, scores);
  }

  /** Whether a cell may be set to value v by the search (pins fixed, absences respected). */
  allowed(p: number, d: number, v: number): boolean {
    if (this.index.pinOf(p, d) !== NO_PIN) return false;
    return v < 0 || this.index.isFree(p, d, v);
  }

  /** Shortfall cost of each need now (for the greedy order). */
  shortfall(i: number): number {
    return this.coverCost(i, this.count[i]) - this.coverCost(i, this.count[i] + 1);
  }
}

function initialGrid(index: ProblemIndex): Grid {
  const grid: Grid = [];
  for (let p = 0; p < index.P; p++) {
    const row = new Array<number>(index.D).fill(-1);
    for (let d = 0; d < index.D; d++) {
      const pin = index.pinOf(p, d);
      if (pin >= 0) row[d] = pin;
    }
    grid.push(row);
  }
  return grid;
}

/** Greedy: repeatedly add the person whose assignment lowers the score most to the most costly short need. */
function greedy(search: Search, deadline: number): void {
  const { index } = search;
  const needs = index.problem.coverNeeds;
  const order = needs.map((_, i) => i);
  let progress = true;
  while (progress) {
    progress = false;
    order.sort((a, b) => search.shortfall(b) - search.shortfall(a) || needs[a].day - needs[b].day);
    for (const i of order) {
      if (Date.now() > deadline) return;
      if (search.shortfall(i) <= 0) continue;
      const need = needs[i];
      const s = index.shiftIndex.get(need.shiftTypeId);
      if (s === undefined) continue;
      let best: { delta: number; p: number; row: number[]; scores: number[] } | null = null;
      for (let p = 0; p < index.P; p++) {
        if (need.skillId !== null && !index.skills[p].has(need.skillId)) continue;
        if (search.grid[p][need.day] === s || !search.allowed(p, need.day, s)) continue;
        const row = search.grid[p].slice();
        row[need.day] = s;
        const { delta, scores } = search.evaluate([{ p, row }]);
        if (delta < 0 && (!best || delta < best.delta)) best = { delta, p, row, scores };
      }
      if (best) {
        search.commit([{ p: best.p, row: best.row }], best.scores);
        progress = true;
      }
    }
  }
}

interface Budget {
  /** Stop after this share of the time or iteration budget. */
  until: number;
  t0: number;
  tEnd: number;
  /** Stop early once the grid breaks no hard rule. */
  stopWhenFeasible?: boolean;
}

/**
 * Two phases of simulated annealing: first, while hard rules are broken, on the hard penalty alone
 * (soft terms only break ties); then on the full score with hard rules dominating.
 */
function localSearch(search: Search, options: ConstructOptions): void {
  const random = mulberry32(options.seed ?? 1);
  const started = Date.now();
  let from = 0;
  if (search.hard > 0) {
    search.big = 1;
    search.soft = 0.001;
    from = anneal(search, options, random, started, from, {
      until: 0.5,
      t0: 0.5,
      tEnd: 0.02,
      stopWhenFeasible: true,
    });
  }
  search.big = search.bigDefault;
  search.soft = 1;
  anneal(search, options, random, started, from, { until: 1, t0: 3, tEnd: 0.05 });
}

/** One annealing run; returns the share of the budget used so far. */
function anneal(
  search: Search,
  options: ConstructOptions,
  random: () => number,
  started: number,
  from: number,
  budget: Budget,
): number {
  const { index } = search;
  const { P, D, S } = index;
  if (P === 0 || D === 0) return budget.until;
  const total = options.timeLimitMs ?? 1000;
  const maxIt = options.maxIterations ?? Infinity;
  const firstIt = Number.isFinite(maxIt) ? Math.round(from * maxIt) : 0;
  const pick = (n: number) => Math.floor(random() * n);
  // Worse moves are accepted with probability exp(−delta / T), T falling geometrically from t0 to
  // tEnd over the phase; the best grid seen is kept.
  let temperature = budget.t0;
  let current = 0;
  let best = 0;
  let bestGrid: Grid | null = null;
  let bestDirty = false;
  let used = from;
  for (let it = firstIt; it < maxIt; it++) {
    if ((it & 63) === 0) {
      used = Number.isFinite(maxIt) ? it / maxIt : (Date.now() - started) / total;
      if (used >= budget.until) break;
      if (budget.stopWhenFeasible && search.hard === 0) break;
      const share = (used - from) / Math.max(1e-9, budget.until - from);
      temperature = budget.t0 * Math.pow(budget.tEnd / budget.t0, share);
    }
    const kind = random();
    let changes: { p: number; row: number[] }[];
    if (kind < 0.4) {
      // change one cell
      const p = pick(P);
      const d = pick(D);
      const v = pick(S + 1) - 1;
      if (v === search.grid[p][d] || !search.allowed(p, d, v)) continue;
      const row = search.grid[p].slice();
      row[d] = v;
      changes = [{ p, row }];
    } else if (kind < 0.75) {
      // swap two people's cells over 1-7 consecutive days (cover stays the same when skills match)
      const len = random() < 0.4 ? 1 : 1 + pick(7);
      const d0 = pick(Math.max(1, D - len + 1));
      const p1 = pick(P);
      const p2 = pick(P);
      if (p1 === p2) continue;
      const r1 = search.grid[p1].slice();
      const r2 = search.grid[p2].slice();
      let ok = true;
      let same = true;
      for (let d = d0; d < Math.min(D, d0 + len) && ok; d++) {
        const a = r1[d];
        const b = r2[d];
        if (a === b) continue;
        same = false;
        if (!search.allowed(p1, d, b) || !search.allowed(p2, d, a)) ok = false;
        r1[d] = b;
        r2[d] = a;
      }
      if (!ok || same) continue;
      changes = [
        { p: p1, row: r1 },
        { p: p2, row: r2 },
      ];
    } else {
      // a block of 2-4 days set to one value
      const p = pick(P);
      const len = 2 + pick(3);
      const d0 = pick(Math.max(1, D - len + 1));
      const v = random() < 0.3 ? -1 : search.grid[p][d0] >= 0 ? search.grid[p][d0] : pick(S);
      const row = search.grid[p].slice();
      let ok = true;
      let same = true;
      for (let d = d0; d < Math.min(D, d0 + len); d++) {
        if (row[d] === v) continue;
        if (!search.allowed(p, d, v)) {
          ok = false;
          break;
        }
        row[d] = v;
        same = false;
      }
      if (!ok || same) continue;
      changes = [{ p, row }];
    }
    const { delta, scores } = search.evaluate(changes);
    if (delta <= 0 || random() < Math.exp(-delta / temperature)) {
      if (delta > 0 && bestDirty) {
        bestGrid = search.grid.map((r) => r.slice());
        bestDirty = false;
      }
      search.commit(changes, scores);
      current += delta;
      if (current < best - 1e-9) {
        best = current;
        bestDirty = true;
      }
    }
  }
  if (!bestDirty && bestGrid) search.restore(bestGrid);
  return used;
}

/** Builds a roster greedily and improves it by local search (see the file header). */
export function construct(problem: RosterProblem, options: ConstructOptions = {}): Roster {
  const index = new ProblemIndex(problem);
  const started = Date.now();
  const total = options.timeLimitMs ?? 1000;
  const search = new Search(index, initialGrid(index));
  // The greedy fill may use up to 60% of the time (at least 200 ms); the search gets the rest.
  greedy(search, started + Math.max(200, 0.6 * total));
  const left = total - (Date.now() - started);
  if (left > 0) localSearch(search, { ...options, timeLimitMs: left });
  return index.fromGrid(search.grid);
}

/** Improves a given roster by local search; pinned cells are set to their pins first, blocked cells cleared. */
export function improve(problem: RosterProblem, roster: Roster, options: ConstructOptions = {}): Roster {
  const index = new ProblemIndex(problem);
  const { grid } = index.toGrid(roster);
  for (let p = 0; p < index.P; p++) {
    for (let d = 0; d < index.D; d++) {
      const pin = index.pinOf(p, d);
      if (pin !== NO_PIN) grid[p][d] = pin;
      else if (grid[p][d] >= 0 && !index.isFree(p, d, grid[p][d])) grid[p][d] = -1;
    }
  }
  const search = new Search(index, grid);
  localSearch(search, options);
  return index.fromGrid(search.grid);
}
