/**
 * A fast local search over whole rosters, with incremental evaluation, that runs beside HiGHS and
 * hands it rosters (simulated annealing; Kirkpatrick, Gelatt & Vecchi, Science 220, 1983).
 *
 * State: the roster as one Int16Array (person-major), cover counts per need, each person's line
 * score (line-cost.ts) and the night and weekend counts of the two fairness goals kept in
 * histograms, so a move costs the rescoring of the one or two lines it touches plus its cells'
 * cover needs: about a microsecond on a ward-sized problem.
 *
 * Moves (each keeps pins and never puts anyone on a shift type they are absent for or may never
 * work, as ProblemIndex.isFree says):
 * - change one cell to another shift type or a day off;
 * - swap two people's cells over 1-7 consecutive days (keeps cover when their skills match);
 * - set a block of 2-5 consecutive days of one person to one shift type or to days off;
 * - hand a shift to a colleague who is off that day, or take one over (a one-day swap with a day off);
 * - with a line solver (line-dp.ts), for a share of the time: replace one person's line by the best
 *   line given everybody else, or clear two people's lines and rebuild both that way (ruin and
 *   recreate), once a rule-keeping roster is known; lines that break a rule are replaced so when
 *   the moves have found none after a tenth of the time (and then at each restart).
 * Hard rules are a priced part of the cost (weight `hardWeight` per unit of line-cost.ts's size),
 * which lets the search pass through rosters that break a rule; only rosters that break none count
 * as results. The weight rises while the search stays on rosters that break rules.
 */
import type { Roster } from '../problem';
import { needWeights } from '../goals/cover';
import { nightEligible } from '../goals/fair-nights';
import { NO_PIN, type Grid, type ProblemIndex } from '../model/context';
import { LineCost, type LineScore } from './line-cost';
import { mulberry32 } from '../random';

/** Max and min of counts kept as a histogram (values 0 … size − 1). */
class Spread {
  private readonly hist: Int32Array;
  private hi = 0;
  private lo = 0;
  private members = 0;

  constructor(size: number) {
    this.hist = new Int32Array(size + 1);
  }

  reset(values: ArrayLike<number>, who: ArrayLike<number>): void {
    this.hist.fill(0);
    this.members = who.length;
    this.hi = 0;
    this.lo = this.hist.length - 1;
    for (let i = 0; i < who.length; i++) {
      const v = values[who[i]];
      this.hist[v]++;
      if (v > this.hi) this.hi = v;
      if (v < this.lo) this.lo = v;
    }
  }

  move(from: number, to: number): void {
    if (from === to) return;
    this.hist[from]--;
    this.hist[to]++;
    if (to > this.hi) this.hi = to;
    if (to < this.lo) this.lo = to;
    while (this.hi > 0 && this.hist[this.hi] === 0) this.hi--;
    while (this.lo < this.hist.length - 1 && this.hist[this.lo] === 0) this.lo++;
  }

  get value(): number {
    return this.members >= 2 ? this.hi - this.lo : 0;
  }
}

export interface RosterSearchOptions {
  seed?: number;
  /** Stop after this many milliseconds (default 1000). */
  timeLimitMs?: number;
  /** Stop after this many moves whatever the time (repeatable results in tests). */
  maxMoves?: number;
  /**
   * Stop when no better roster has been found for this many milliseconds and for half the time
   * searched so far (a search that has settled; the solve goes on with HiGHS). Default: never.
   */
  stallMs?: number;
  /**
   * Stop when no roster that keeps every hard rule has been found after this many milliseconds (a
   * problem this search does not make feasible in time is left to the exact methods). Default: never.
   */
  giveUpMs?: number;
  /** Stop as soon as a roster that breaks no hard rule costs at most this. */
  targetObjective?: number;
  /** Start temperature as a multiple of the typical soft weight (default 1). */
  startTemperature?: number;
  /** Asked now and then (about every 50 ms): stop when it returns true. */
  shouldStop?: () => boolean;
  /**
   * Every new best roster that breaks no hard rule: its objective, and a function that returns the
   * roster (valid only during the call, so a listener that only counts pays nothing for it).
   */
  onBest?: (objective: number, roster: () => Grid) => void;
  /** Asked at each restart: a roster from elsewhere to continue from when it is better, or null. */
  incoming?: () => Grid | null;
  /**
   * The best line of person p with `extra[d * S + s]` added for working shift s on day d, every
   * other line fixed (line-dp.ts), or null. With it the search repairs the lines that break rules
   * at the start and at each restart, and spends `lineShare` of its time on such lines as moves.
   */
  lineSolver?: (p: number, extra: Float64Array) => Int16Array | null;
  /** Share of the time for line moves (default LINE_SHARE). */
  lineShare?: number;
  /**
   * Milliseconds after which, still without a rule-keeping roster, every rule-breaking line is
   * rebuilt by the line solver (default: RESCUE_SHARE of the time limit, at least RESCUE_MIN_MS).
   */
  rescueMs?: number;
  /** Share of line moves that rebuild two people's lines (default LINE_PAIR). */
  linePair?: number;
  /** After each accepted line move: the running totals and the roster (for tests of the totals). */
  afterLineMove?: (soft: number, hard: number, roster: () => Grid) => void;
}

export interface RosterSearchResult {
  /** Best roster found that breaks no hard rule, or the least-breaking one when none does. */
  grid: Grid;
  /** Objective of `grid` (soft goals; meaningful when `feasible`). */
  objective: number;
  feasible: boolean;
  moves: number;
  /** Milliseconds until the best roster was found. */
  msToBest: number;
}

const MOVE_CHANGE = 0;
const MOVE_SWAP = 1;
const MOVE_BLOCK = 2;
const MOVE_WITHIN = 3;
const MOVE_LINE = 4;
/** Share of the search's time spent on best-line moves (one costs as much as 1,000-100,000 moves). */
const LINE_SHARE = 0.2;
/** When the line solver rebuilds rule-breaking lines (see RosterSearchOptions.rescueMs). */
const RESCUE_SHARE = 0.1;
const RESCUE_MIN_MS = 1000;
/** Share of line moves that clear two people's lines and rebuild both (ruin and recreate). */
const LINE_PAIR = 0.25;
/**
 * Strategic oscillation of the hard-rule weight, looked at every 4,096 moves: dearer (×1.2) when more
 * than RAISE_ABOVE of them were spent on rosters that break a rule, cheaper (÷1.1) below LOWER_BELOW.
 * With 0.9 instead of 0.5 the search ended on benchmark Instances 2 and 3 without any roster that
 * keeps every rule in 1 of 3 runs of 2 million moves.
 */
const RAISE_ABOVE = 0.5;
const LOWER_BELOW = 0.1;
/** Temperatures as multiples of the problem's typical soft weight (RosterSearch.scale). */
const START_TEMPERATURE = 1;
/** 0.005 against 0.02: mean of three 8-million-move runs on the demo ward 13,852 against 13,963. */
const END_TEMPERATURE = 0.005;
/** Moves in the first cooling round; each later round is twice as long (at most 2 million). */
const FIRST_ROUND = 20_000;
/** Cumulative shares of the moves: change, swap, within a line, block. */
const MOVE_MIX = [0.3, 0.75, 0.85] as const;
/** Share of within-line moves where the shift that moves to a day off may change type. */
const WITHIN_RETYPE = 0.5;

export class RosterSearch {
  readonly P: number;
  readonly D: number;
  readonly S: number;
  readonly grid: Int16Array;
  private readonly line: LineCost;
  private readonly lineHard: Float64Array;
  private readonly lineSoft: Float64Array;
  private readonly nights: Int32Array;
  private readonly weekends: Int32Array;
  private readonly nightSpread: Spread;
  private readonly weekendSpread: Spread;
  private readonly nightMembers: Int32Array;
  private readonly allMembers: Int32Array;
  private readonly nightWeight: number;
  private readonly weekendWeight: number;
  /** Needs at (d, s): needsAt[needStart[d * S + s] … needStart[d * S + s + 1]]. */
  private readonly needStart: Int32Array;
  private readonly needsAt: Int32Array;
  /** counts[i * P + p] = 1 when person p counts towards need i. */
  private readonly counts: Uint8Array;
  private readonly needMin: Int32Array;
  private readonly needTarget: Int32Array;
  private readonly wMin: Float64Array;
  private readonly wTarget: Float64Array;
  private readonly wOver: Float64Array;
  private readonly count: Int32Array;
  /** Values the search may give each cell: options[(p * D + d) * (S + 1) …], -1 = off; optCount per cell. */
  private readonly options: Int16Array;
  private readonly optCount: Uint8Array;
  private readonly score: LineScore = { hard: 0, soft: 0, nights: 0, weekends: 0 };
  /** Current totals. */
  hard = 0;
  soft = 0;
  hardWeight: number;
  /** Typical soft weight of one move (for the temperature). */
  readonly scale: number;

  constructor(
    readonly index: ProblemIndex,
    start: Grid,
  ) {
    const { P, D, S, problem } = index;
    this.P = P;
    this.D = D;
    this.S = S;
    this.line = new LineCost(index);
    this.grid = new Int16Array(P * D);
    for (let p = 0; p < P; p++) for (let d = 0; d < D; d++) this.grid[p * D + d] = start[p]?.[d] ?? -1;

    const needs = problem.coverNeeds;
    const lists: number[][] = Array.from({ length: D * S }, () => []);
    this.counts = new Uint8Array(needs.length * P);
    needs.forEach((n, i) => {
      const s = index.shiftIndex.get(n.shiftTypeId);
      if (s === undefined || n.day < 0 || n.day >= D) return;
      lists[n.day * S + s].push(i);
      for (let p = 0; p < P; p++) {
        if (n.skillId === null || index.skills[p].has(n.skillId)) this.counts[i * P + p] = 1;
      }
    });
    this.needStart = new Int32Array(D * S + 1);
    let at = 0;
    lists.forEach((l, i) => {
      this.needStart[i] = at;
      at += l.length;
    });
    this.needStart[D * S] = at;
    this.needsAt = Int32Array.from(lists.flat());
    this.needMin = Int32Array.from(needs.map((n) => n.min));
    this.needTarget = Int32Array.from(needs.map((n) => n.target));
    const weights = needs.map((n) => needWeights(index, n));
    this.wMin = Float64Array.from(weights.map((w) => w.underMin));
    this.wTarget = Float64Array.from(weights.map((w) => w.underTarget));
    this.wOver = Float64Array.from(weights.map((w) => w.over));
    this.count = new Int32Array(needs.length);

    this.options = new Int16Array(P * D * (S + 1));
    this.optCount = new Uint8Array(P * D);
    for (let p = 0; p < P; p++) {
      for (let d = 0; d < D; d++) {
        const cell = p * D + d;
        if (index.pinOf(p, d) !== NO_PIN) continue; // pinned: no options, never moved
        let k = 0;
        this.options[cell * (S + 1) + k++] = -1;
        for (let s = 0; s < S; s++) if (index.isFree(p, d, s)) this.options[cell * (S + 1) + k++] = s;
        this.optCount[cell] = k;
      }
    }
    // Pins and blocked cells of the start are set right.
    for (let p = 0; p < P; p++) {
      for (let d = 0; d < D; d++) {
        const pin = index.pinOf(p, d);
        const cell = p * D + d;
        if (pin !== NO_PIN) this.grid[cell] = pin;
        else if (this.grid[cell] >= 0 && !index.isFree(p, d, this.grid[cell])) this.grid[cell] = -1;
      }
    }

    this.lineHard = new Float64Array(P);
    this.lineSoft = new Float64Array(P);
    this.nights = new Int32Array(P);
    this.weekends = new Int32Array(P);
    this.nightMembers = Int32Array.from(nightEligible(index));
    this.allMembers = Int32Array.from([...Array(P).keys()]);
    this.nightWeight = index.weights.fairNights;
    this.weekendWeight = P >= 2 && index.weekends.length > 0 ? index.weights.fairWeekends : 0;
    this.nightSpread = new Spread(D);
    this.weekendSpread = new Spread(index.weekends.length);

    let typical = 0;
    let n = 0;
    for (let i = 0; i < needs.length; i++) {
      typical += this.wTarget[i] > 0 ? this.wTarget[i] : this.wMin[i];
      n++;
    }
    for (const r of problem.requests) {
      typical += r.weight * index.weights.requests;
      n++;
    }
    this.scale = n > 0 ? Math.max(1e-3, typical / n) : 1;
    let largest = 0;
    for (let i = 0; i < needs.length; i++) largest = Math.max(largest, this.wMin[i], this.wTarget[i]);
    this.hardWeight = Math.max(10 * this.scale, largest);
    this.recount();
  }

  /** Recomputes every total from the grid. */
  recount(): void {
    const { P, D, S } = this;
    this.count.fill(0);
    for (let p = 0; p < P; p++) {
      for (let d = 0; d < D; d++) {
        const s = this.grid[p * D + d];
        if (s < 0) continue;
        const i0 = this.needStart[d * S + s];
        const i1 = this.needStart[d * S + s + 1];
        for (let j = i0; j < i1; j++) {
          const i = this.needsAt[j];
          this.count[i] += this.counts[i * P + p];
        }
      }
    }
    this.hard = 0;
    this.soft = 0;
    for (let i = 0; i < this.count.length; i++) this.soft += this.needCost(i, this.count[i]);
    for (let p = 0; p < P; p++) {
      this.line.score(p, this.grid, this.score);
      this.lineHard[p] = this.score.hard;
      this.lineSoft[p] = this.score.soft;
      this.nights[p] = this.score.nights;
      this.weekends[p] = this.score.weekends;
      this.hard += this.score.hard;
      this.soft += this.score.soft;
    }
    this.nightSpread.reset(this.nights, this.nightMembers);
    this.weekendSpread.reset(this.weekends, this.allMembers);
    this.soft += this.fairness();
  }

  private fairness(): number {
    return this.nightWeight * this.nightSpread.value + this.weekendWeight * this.weekendSpread.value;
  }

  private needCost(i: number, c: number): number {
    const min = this.needMin[i];
    const target = this.needTarget[i];
    const underMin = c < min ? min - c : 0;
    const underTarget = (c < target ? target - c : 0) - underMin;
    const over = c > target ? c - target : 0;
    return underMin * this.wMin[i] + underTarget * this.wTarget[i] + over * this.wOver[i];
  }

  /** Sets one cell and returns the change in cover cost. */
  private setCell(p: number, d: number, v: number): number {
    const { P, D, S } = this;
    const cell = p * D + d;
    const old = this.grid[cell];
    if (old === v) return 0;
    let delta = 0;
    if (old >= 0) {
      for (let j = this.needStart[d * S + old]; j < this.needStart[d * S + old + 1]; j++) {
        const i = this.needsAt[j];
        if (this.counts[i * P + p] === 0) continue;
        const c = this.count[i];
        delta += this.needCost(i, c - 1) - this.needCost(i, c);
        this.count[i] = c - 1;
      }
    }
    if (v >= 0) {
      for (let j = this.needStart[d * S + v]; j < this.needStart[d * S + v + 1]; j++) {
        const i = this.needsAt[j];
        if (this.counts[i * P + p] === 0) continue;
        const c = this.count[i];
        delta += this.needCost(i, c + 1) - this.needCost(i, c);
        this.count[i] = c + 1;
      }
    }
    this.grid[cell] = v;
    return delta;
  }

  /** Rescores person p's line; returns [hard change, soft change] through the fields below. */
  private dHard = 0;
  private dSoft = 0;
  private rescore(p: number): void {
    this.line.score(p, this.grid, this.score);
    this.dHard += this.score.hard - this.lineHard[p];
    this.dSoft += this.score.soft - this.lineSoft[p];
    this.lineHard[p] = this.score.hard;
    this.lineSoft[p] = this.score.soft;
    const n = this.score.nights;
    const w = this.score.weekends;
    if (n !== this.nights[p]) {
      if (this.nightWeight !== 0 && this.isNightMember(p)) this.nightSpread.move(this.nights[p], n);
      this.nights[p] = n;
    }
    if (w !== this.weekends[p]) {
      this.weekendSpread.move(this.weekends[p], w);
      this.weekends[p] = w;
    }
  }

  private nightMember: Uint8Array | null = null;
  private isNightMember(p: number): boolean {
    if (!this.nightMember) {
      this.nightMember = new Uint8Array(this.P);
      for (const q of this.nightMembers) this.nightMember[q] = 1;
    }
    return this.nightMember[p] === 1;
  }

  /** Undo buffer of the move being tried: cell, old value. */
  private undoCells = new Int32Array(64);
  private undoValues = new Int16Array(64);
  private undoLength = 0;

  private change(p: number, d: number, v: number): number {
    const cell = p * this.D + d;
    if (this.undoLength === this.undoCells.length) {
      const cells = new Int32Array(this.undoCells.length * 2);
      cells.set(this.undoCells);
      const values = new Int16Array(this.undoValues.length * 2);
      values.set(this.undoValues);
      this.undoCells = cells;
      this.undoValues = values;
    }
    this.undoCells[this.undoLength] = cell;
    this.undoValues[this.undoLength++] = this.grid[cell];
    return this.setCell(p, d, v);
  }

  private mayHold(p: number, d: number, v: number): boolean {
    const cell = p * this.D + d;
    const n = this.optCount[cell];
    const base = cell * (this.S + 1);
    for (let k = 0; k < n; k++) if (this.options[base + k] === v) return true;
    return false;
  }

  /** The whole search. */
  run(options: RosterSearchOptions = {}): RosterSearchResult {
    const { P, D, S } = this;
    const random = mulberry32(options.seed ?? 1);
    const started = performance.now();
    const limitMs = options.timeLimitMs ?? 1000;
    const maxMoves = options.maxMoves ?? Infinity;
    const target = options.targetObjective ?? -Infinity;
    const stallMs = options.stallMs;
    const t0 = (options.startTemperature ?? START_TEMPERATURE) * this.scale;
    const tEnd = END_TEMPERATURE * this.scale;
    const movable: number[] = [];
    for (let p = 0; p < P; p++) for (let d = 0; d < D; d++) if (this.optCount[p * D + d] > 1) movable.push(p);
    if (movable.length === 0 || D === 0) return this.result(0, 0);

    const lineSolver = options.lineSolver;
    const lineShare = options.lineShare ?? LINE_SHARE;
    const linePair = options.linePair ?? LINE_PAIR;
    let lineMs = 0;
    let lineDue = false;
    // Lines that break rules are rebuilt by the line solver only when the moves have not found a
    // rule-keeping roster by then: a start rebuilt at once made benchmark instances 5 and 7 worse.
    const rescueMs = options.rescueMs ?? Math.max(RESCUE_MIN_MS, RESCUE_SHARE * limitMs);
    let rescued = false;
    let best = this.hard === 0 ? this.soft : Infinity;
    let bestHard = this.hard;
    let bestGrid = this.grid.slice();
    let bestAt = 0;
    // Cooling rounds finished.
    let rounds = 0;
    let saved = true;
    let moves = 0;
    // A round cools from t0 to tEnd; each new round (reheat) starts from the best roster.
    let roundLength = FIRST_ROUND;
    let roundMoves = 0;
    let temperature = t0;
    let cooling = Math.pow(tEnd / t0, 1 / roundLength);
    let infeasibleMoves = 0;
    const minWeight = this.scale;
    const maxWeight = 1000 * this.hardWeight;
    const people2 = P >= 2;
    const mix = MOVE_MIX;
    while (moves < maxMoves) {
      if ((moves & 1023) === 0) {
        const now = performance.now();
        if (now - started >= limitMs) break;
        if (best === Infinity && options.giveUpMs !== undefined && now - started >= options.giveUpMs) break;
        if (stallMs !== undefined && best < Infinity) {
          const quiet = now - started - bestAt;
          if (quiet >= stallMs && quiet >= 0.5 * (now - started) && rounds >= 1) break;
        }
        if ((moves & 65535) === 0 && options.shouldStop?.()) break;
        if (lineSolver && !rescued && best === Infinity && now - started >= rescueMs) {
          rescued = true;
          this.repairLines(lineSolver);
          if (this.hard === 0) {
            best = this.soft;
            bestGrid = this.grid.slice();
            saved = true;
            bestAt = performance.now() - started;
            options.onBest?.(best, () => this.toGrid());
          }
        }
        lineDue =
          lineSolver !== undefined && (best < Infinity || rescued) && lineMs < lineShare * (now - started);
      }
      if (roundMoves >= roundLength) {
        // Reheat from the best roster (or from one handed in that is better).
        const incoming = options.incoming?.() ?? null;
        if (!(incoming && this.adoptIfBetter(incoming, best)) && saved && best < Infinity)
          this.load(bestGrid);
        if (lineSolver && rescued && this.hard > 0) this.repairLines(lineSolver);
        if (this.hard === 0 && this.soft < best - 1e-9) {
          best = this.soft;
          bestGrid = this.grid.slice();
          bestAt = performance.now() - started;
          options.onBest?.(best, () => this.toGrid());
        }
        roundMoves = 0;
        rounds++;
        roundLength = Math.min(roundLength * 2, 2_000_000);
        cooling = Math.pow(tEnd / t0, 1 / roundLength);
        temperature = t0;
      }
      moves++;
      roundMoves++;
      if (this.hard > 0) infeasibleMoves++;
      if ((moves & 4095) === 0) {
        // Strategic oscillation: rules get dearer while the search stays on rosters that break them
        // and cheaper while it stays on rosters that keep them.
        const share = infeasibleMoves / 4096;
        if (share > RAISE_ABOVE) this.hardWeight = Math.min(this.hardWeight * 1.2, maxWeight);
        else if (share < LOWER_BELOW) this.hardWeight = Math.max(this.hardWeight / 1.1, minWeight);
        infeasibleMoves = 0;
      }
      temperature *= cooling;

      this.undoLength = 0;
      this.dHard = 0;
      this.dSoft = 0;
      let dCover = 0;
      let p1 = movable[Math.floor(random() * movable.length)];
      let p2 = -1;
      const kindDraw = random();
      const kind = lineDue
        ? MOVE_LINE
        : kindDraw < mix[0]
          ? MOVE_CHANGE
          : kindDraw < mix[1] && people2
            ? MOVE_SWAP
            : kindDraw < mix[2]
              ? MOVE_WITHIN
              : MOVE_BLOCK;
      if (kind === MOVE_CHANGE) {
        const d = Math.floor(random() * D);
        const cell = p1 * D + d;
        const n = this.optCount[cell];
        if (n < 2) continue;
        const v = this.options[cell * (S + 1) + Math.floor(random() * n)];
        if (v === this.grid[cell]) continue;
        dCover += this.change(p1, d, v);
      } else if (kind === MOVE_SWAP) {
        p2 = Math.floor(random() * P);
        if (p2 === p1) continue;
        const len = random() < 0.5 ? 1 : 2 + Math.floor(random() * 6);
        const d0 = Math.floor(random() * Math.max(1, D - len + 1));
        const d1 = Math.min(D, d0 + len);
        let ok = true;
        let any = false;
        for (let d = d0; d < d1; d++) {
          const a = this.grid[p1 * D + d];
          const b = this.grid[p2 * D + d];
          if (a === b) continue;
          if (!this.mayHold(p1, d, b) || !this.mayHold(p2, d, a)) {
            ok = false;
            break;
          }
          any = true;
        }
        if (!ok || !any) continue;
        for (let d = d0; d < d1; d++) {
          const a = this.grid[p1 * D + d];
          const b = this.grid[p2 * D + d];
          if (a === b) continue;
          dCover += this.change(p1, d, b);
          dCover += this.change(p2, d, a);
        }
      } else if (kind === MOVE_LINE) {
        // One person's best line with the others fixed; while rules are broken, a line that breaks one.
        lineDue = false;
        const lineStart = performance.now();
        if (this.hard === 0 && people2 && random() < linePair) {
          // Two people's lines cleared and rebuilt one after the other, each the best given the rest.
          p2 = Math.floor(random() * P);
          if (p2 === p1) p2 = (p1 + 1) % P;
          for (let d = 0; d < D; d++) {
            if (this.grid[p1 * D + d] >= 0 && this.mayHold(p1, d, -1)) dCover += this.change(p1, d, -1);
            if (this.grid[p2 * D + d] >= 0 && this.mayHold(p2, d, -1)) dCover += this.change(p2, d, -1);
          }
          const a = this.applyLine(p1, lineSolver!);
          const b = this.applyLine(p2, lineSolver!);
          lineMs += performance.now() - lineStart;
          if (Number.isNaN(a) || Number.isNaN(b)) {
            this.undoMove(p1, p2);
            continue;
          }
          dCover += a + b;
        } else {
          const q = this.hard > 0 ? this.brokenLine(Math.floor(random() * P)) : p1;
          const dLine = q < 0 ? NaN : this.applyLine(q, lineSolver!);
          lineMs += performance.now() - lineStart;
          if (Number.isNaN(dLine)) continue;
          dCover += dLine;
          p1 = q;
        }
      } else if (kind === MOVE_WITHIN) {
        // Two days of one person's line trade places (hours stay the same).
        const d1 = Math.floor(random() * D);
        const d2 = Math.floor(random() * D);
        const a = this.grid[p1 * D + d1];
        let b = this.grid[p1 * D + d2];
        // Half the time the shift moving to d1 may change type (a shift moves to another day).
        if (a < 0 && b >= 0 && random() < WITHIN_RETYPE) {
          const cell = p1 * D + d1;
          const n = this.optCount[cell];
          if (n > 1) b = this.options[cell * (S + 1) + 1 + Math.floor(random() * (n - 1))];
        }
        if (a === b || !this.mayHold(p1, d1, b) || !this.mayHold(p1, d2, a)) continue;
        dCover += this.change(p1, d1, b);
        dCover += this.change(p1, d2, a);
      } else {
        const len = 2 + Math.floor(random() * 4);
        const d0 = Math.floor(random() * Math.max(1, D - len + 1));
        const d1 = Math.min(D, d0 + len);
        const first = this.grid[p1 * D + d0];
        const v = random() < 0.35 ? -1 : first >= 0 && random() < 0.5 ? first : Math.floor(random() * S);
        for (let d = d0; d < d1; d++) {
          if (this.grid[p1 * D + d] === v || !this.mayHold(p1, d, v)) continue;
          dCover += this.change(p1, d, v);
        }
        if (this.undoLength === 0) continue;
      }
      const oldNightSpread = this.nightSpread.value;
      const oldWeekendSpread = this.weekendSpread.value;
      this.rescore(p1);
      if (p2 >= 0) this.rescore(p2);
      const dFair =
        this.nightWeight * (this.nightSpread.value - oldNightSpread) +
        this.weekendWeight * (this.weekendSpread.value - oldWeekendSpread);
      const dSoft = this.dSoft + dCover + dFair;
      const delta = this.dHard * this.hardWeight + dSoft;
      if (delta <= 0 || random() < Math.exp(-delta / temperature)) {
        const newBest = this.hard + this.dHard < 0.5 && this.soft + dSoft < best - 1e-9;
        if (!saved && !newBest) {
          // The roster before this move was the best: keep a copy before leaving it (also on a move
          // of delta ≤ 0, which may trade a broken rule for soft gains).
          // (Undo the move, copy, redo: cheaper than copying on every improvement.)
          this.undoMove(p1, p2, true);
          bestGrid = this.grid.slice();
          saved = true;
          this.redoMove(p1, p2);
        }
        this.hard += this.dHard;
        this.soft += dSoft;
        if (this.hard < 0.5) this.hard = this.exactHard();
        if (kind === MOVE_LINE) options.afterLineMove?.(this.soft, this.hard, () => this.toGrid());
        if (this.hard === 0) {
          if (this.soft < best - 1e-9) {
            best = this.soft;
            bestHard = 0;
            bestAt = performance.now() - started;
            saved = false;
            options.onBest?.(best, () => this.toGrid());
            if (best <= target + 1e-9) break;
          }
        } else {
          if (best === Infinity && this.hard < bestHard - 1e-9) {
            bestHard = this.hard;
            bestGrid = this.grid.slice();
            saved = true;
          }
        }
      } else {
        this.undoMove(p1, p2);
      }
    }
    // Unsaved means the current roster is the best.
    if (saved) this.load(bestGrid);
    return this.result(moves, bestAt);
  }

  private extra: Float64Array | null = null;

  /** What working each (day, shift) would add to the cover cost of everybody but p: extra[d * S + s]. */
  private coverExtra(p: number): Float64Array {
    const { P, D, S } = this;
    const extra = this.extra ?? (this.extra = new Float64Array(D * S));
    for (let d = 0; d < D; d++) {
      const current = this.grid[p * D + d];
      for (let s = 0; s < S; s++) {
        let e = 0;
        for (let j = this.needStart[d * S + s]; j < this.needStart[d * S + s + 1]; j++) {
          const i = this.needsAt[j];
          if (this.counts[i * P + p] === 0) continue;
          const c = this.count[i] - (current === s ? 1 : 0);
          e += this.needCost(i, c + 1) - this.needCost(i, c);
        }
        extra[d * S + s] = e;
      }
    }
    return extra;
  }

  /** The first person from `from` on (cyclically) whose line breaks a rule, or −1. */
  private brokenLine(from: number): number {
    for (let k = 0; k < this.P; k++) {
      const p = (from + k) % this.P;
      if (this.lineHard[p] > 0) return p;
    }
    return -1;
  }

  /**
   * Sets person p's line to the line solver's answer through `change` (so the move can be undone) and
   * returns the change in cover cost; NaN (nothing changed) when the solver has none or it would
   * move a cell the search may not hold.
   */
  private applyLine(p: number, solver: NonNullable<RosterSearchOptions['lineSolver']>): number {
    const line = solver(p, this.coverExtra(p));
    if (!line) return NaN;
    const { D } = this;
    for (let d = 0; d < D; d++) {
      const v = line[d];
      if (v !== this.grid[p * D + d] && !this.mayHold(p, d, v)) return NaN;
    }
    let dCover = 0;
    for (let d = 0; d < D; d++) {
      if (line[d] !== this.grid[p * D + d]) dCover += this.change(p, d, line[d]);
    }
    return dCover;
  }

  /** Every line that breaks a rule is replaced by its best rule-keeping line (where there is one). */
  private repairLines(solver: NonNullable<RosterSearchOptions['lineSolver']>): void {
    for (let p = 0; p < this.P; p++) {
      if (this.lineHard[p] <= 0) continue;
      this.undoLength = 0;
      this.applyLine(p, solver);
    }
    this.recount();
  }

  /** Reverts the cells of the move being tried and rescores its people (keeping them for redoMove when asked). */
  private undoMove(p1: number, p2: number, keepRedo = false): void {
    if (keepRedo && this.redoValues.length < this.undoLength)
      this.redoValues = new Int16Array(this.undoCells.length);
    for (let k = this.undoLength - 1; k >= 0; k--) {
      const cell = this.undoCells[k];
      if (keepRedo) this.redoValues[k] = this.grid[cell];
      this.setCell(Math.floor(cell / this.D), cell % this.D, this.undoValues[k]);
    }
    this.dHard = 0;
    this.dSoft = 0;
    this.rescore(p1);
    if (p2 >= 0) this.rescore(p2);
  }

  private redoValues: Int16Array = new Int16Array(64);
  private redoMove(p1: number, p2: number): void {
    for (let k = 0; k < this.undoLength; k++) {
      const cell = this.undoCells[k];
      this.setCell(Math.floor(cell / this.D), cell % this.D, this.redoValues[k]);
    }
    this.dHard = 0;
    this.dSoft = 0;
    this.rescore(p1);
    if (p2 >= 0) this.rescore(p2);
  }

  /** Exact hard total (the running sum carries rounding). */
  private exactHard(): number {
    let h = 0;
    for (let p = 0; p < this.P; p++) h += this.lineHard[p];
    return h;
  }

  private load(grid: Int16Array): void {
    this.grid.set(grid);
    this.recount();
  }

  /** Continues from `incoming` when it breaks no rule and beats `best`; otherwise changes nothing. */
  private adoptIfBetter(incoming: Grid, best: number): boolean {
    const before = this.grid.slice();
    const { P, D } = this;
    for (let p = 0; p < P; p++) {
      for (let d = 0; d < D; d++) {
        const v = incoming[p]?.[d] ?? -1;
        // A cell the search may not change keeps its value (pins); others must be allowed values.
        this.grid[p * D + d] = this.optCount[p * D + d] === 0 || this.mayHold(p, d, v) ? v : -1;
      }
    }
    this.recount();
    if (this.hard === 0 && this.soft < best - 1e-9) return true;
    this.load(before);
    return false;
  }

  toGrid(flat: Int16Array = this.grid): Grid {
    const out: Grid = [];
    for (let p = 0; p < this.P; p++) out.push(Array.from(flat.subarray(p * this.D, (p + 1) * this.D)));
    return out;
  }

  private result(moves: number, msToBest: number): RosterSearchResult {
    return {
      grid: this.toGrid(),
      objective: this.soft,
      feasible: this.hard === 0,
      moves,
      msToBest,
    };
  }
}

/** Runs the search from a roster (pins set, blocked cells cleared) and returns the best roster found. */
export function searchRoster(
  index: ProblemIndex,
  start: Roster,
  options: RosterSearchOptions = {},
): RosterSearchResult & { roster: Roster } {
  const { grid } = index.toGrid(start);
  const search = new RosterSearch(index, grid);
  const result = search.run(options);
  return { ...result, roster: index.fromGrid(result.grid) };
}
