/**
 * The best line for one person while everybody else's line stays as it is, by dynamic programming
 * over the days (a resource-constrained shortest path through the person's days; labels with
 * dominance, as in the pricing problems of column generation for rostering).
 *
 * A label is a partial line up to day d. Its state holds what the rules of line-cost.ts need to know
 * about the past: the last day's value, the length of the current run of work or days off (and
 * whether it began on the first day: border runs are exempt from minimum lengths), the current run
 * of nights, paid minutes so far, worked weekends (and whether the current weekend already counts)
 * and the shifts of each type that has a limit. Labels with the same state except the type counts
 * are kept while none is at least as cheap with no more shifts of any limited type (dominance), at
 * most `maxPerState` of them, and at most `maxLabels` a day. Every rule is a pruning test on the way
 * (with a look-ahead: a label that can no longer reach the minimum hours is dropped), except rest
 * conflicts that reach beyond the next day, checked on the finished line by LineCost. Without the
 * two caps the result is the exact best line: line-dp.spec.ts compares it with the optimal line of
 * a one-person MIP; with the defaults it is a close heuristic that stays fast on half-year lines.
 *
 * The cost of a line is LineCost's soft cost (requests, changes against the published roster,
 * labour, distance from contract hours) plus `extra[d * S + s]` for each worked shift: the change of
 * the cover cost of everybody else (the fairness spreads are left to the search's acceptance test).
 */
import type { ProblemIndex } from '../model/context';
import { NO_PIN } from '../model/context';
import { LineCost, type LineScore } from './line-cost';

interface Label {
  /** How far the label is ahead of what the minimum hours still need (Infinity without a minimum). */
  slack: number;
  cost: number;
  paid: number;
  weekends: number;
  /** Shifts of each limited type (LineDp.limited order), or null when no type is limited. */
  counts: Int16Array | null;
  last: number;
  run: number;
  border: number;
  nightRun: number;
  weekendCounted: number;
  prev: Label | null;
}

export interface LineDpOptions {
  /** Labels kept per state (default 8: on benchmark instance 8 as good as 64 at a fifth of the time). */
  maxPerState?: number;
  /**
   * Labels kept per day, cheapest first (default 2,000: on benchmark instances 8 and 12 the same
   * lines as 200,000; on the half-year instance 20 the same as 10,000 at a quarter of the time).
   */
  maxLabels?: number;
  /**
   * No cap per state and EXACT_MAX_LABELS a day: every label not dominated is kept, so `lowest` is
   * exact unless that safety limit was hit (`lowestIsExact` says which; overrides both caps).
   */
  exact?: boolean;
  /** The problem's line costs when the caller already built them (they are read only). */
  cost?: LineCost;
}

/**
 * Labels a day in exact mode before the programme gives up exactness (a safety limit on memory and
 * time). Most labels on one day measured in column generation (5 December 2026): benchmark instance
 * 8 (four limited shift types) 36,011, instance 10 9,542, instance 12 2,046, the demo ward 3,420.
 */
export const EXACT_MAX_LABELS = 100_000;

export class LineDp {
  readonly cost: LineCost;
  private readonly score: LineScore = { hard: 0, soft: 0, nights: 0, weekends: 0 };
  private readonly lineBuffer: Int16Array;
  private readonly maxPerState: number;
  private readonly maxLabels: number;
  private truncated = false;
  private readonly exact: boolean;
  /**
   * After `solve`: the lowest cost of any line the programme reached (rest conflicts beyond the next
   * day not checked), Infinity when none. With both caps off (`exact`) no line is cheaper: the
   * pricing value of column generation (bound/line-bound.ts).
   */
  lowest = Infinity;
  /** `lowest` is the exact minimum (exact mode, and no day went over EXACT_MAX_LABELS). */
  lowestIsExact = false;
  /** Most labels kept on one day since construction (for benchmarks). */
  peakLabels = 0;
  /** Calls and their total milliseconds (for benchmarks). */
  calls = 0;
  ms = 0;

  constructor(
    readonly index: ProblemIndex,
    options: LineDpOptions = {},
  ) {
    this.cost = options.cost ?? new LineCost(index);
    this.lineBuffer = new Int16Array(index.P * index.D);
    this.maxPerState = options.exact ? Infinity : (options.maxPerState ?? 8);
    this.exact = options.exact ?? false;
    this.maxLabels = options.exact ? EXACT_MAX_LABELS : (options.maxLabels ?? 2_000);
  }

  /**
   * Person p's best rule-keeping line with `extra[d * S + s]` added per worked shift and `perWeekend`
   * per weekend worked (column generation's fairness prices), or null when the programme finds none. Pinned days keep their pin; other days may be off or hold any shift
   * type the person is free for (ProblemIndex.isFree), as in the local search.
   */
  solve(p: number, extra: Float64Array, perWeekend = 0): Int16Array | null {
    const t0 = performance.now();
    this.truncated = false;
    this.lowest = Infinity;
    let line = this.run(p, extra, perWeekend, false);
    // The cheapest labels of a capped day may all have fallen behind the minimum hours: again,
    // keeping those furthest ahead (tight contracts over half a year, benchmark instance 21).
    if (!line && this.truncated) line = this.run(p, extra, perWeekend, true);
    this.lowestIsExact = this.exact && !this.truncated;
    this.calls++;
    this.ms += performance.now() - t0;
    return line;
  }

  private run(p: number, extra: Float64Array, perWeekend: number, bySlack: boolean): Int16Array | null {
    const { index, cost: lc } = this;
    const { D, S } = index;
    const maxCons = lc.maxCons[p];
    const minCons = lc.minCons[p];
    const minOff = lc.minOff[p];
    const maxNights = lc.maxNights[p];
    const maxWeekends = lc.maxWeekends[p];
    const maxPaid = Number.isNaN(lc.maxPaid[p]) ? Infinity : lc.maxPaid[p];
    const minPaid = Number.isNaN(lc.minPaid[p]) ? -Infinity : lc.minPaid[p];
    const target = lc.targetPaid[p];
    const hoursWeight = lc.hoursWeight;
    const workCap = maxCons >= 0 ? maxCons : Math.max(1, minCons);
    const offCap = Math.max(1, minOff);

    // Values each day may hold, and their cost: cell[d * (S + 1) + v + 1].
    const W = S + 1;
    const cellCost = new Float64Array(D * W);
    const allowed: number[][] = [];
    for (let d = 0; d < D; d++) {
      const pin = index.pinOf(p, d);
      const values: number[] = [];
      if (pin !== NO_PIN) values.push(pin);
      else {
        values.push(-1);
        for (let s = 0; s < S; s++) if (index.isFree(p, d, s)) values.push(s);
      }
      allowed.push(values);
      for (let s = 0; s < S; s++) cellCost[d * W + s + 1] = extra[d * S + s] + lc.labour[p] * lc.paid[s];
    }
    for (let r = lc.reqStart[p]; r < lc.reqStart[p + 1]; r++) {
      const d = lc.reqDay[r];
      const w = lc.reqWeight[r];
      const kind = lc.reqKind[r];
      for (let v = -1; v < S; v++) {
        const honoured = kind === 0 ? v < 0 : kind === 1 ? v === lc.reqShift[r] : v !== lc.reqShift[r];
        if (!honoured) cellCost[d * W + v + 1] += w;
      }
    }
    if (lc.published !== null) {
      for (let d = 0; d < D; d++) {
        const was = lc.published[p * D + d];
        if (was === -3) continue;
        for (let v = -1; v < S; v++) if (v !== was) cellCost[d * W + v + 1] += lc.changeWeight;
      }
    }
    // Limited types: a limit below the days the person could work that type.
    const limitedOf = new Int32Array(S).fill(-1);
    const limits: number[] = [];
    for (let s = 0; s < S; s++) {
      const max = lc.maxShifts[p * S + s];
      if (max < D) {
        limitedOf[s] = limits.length;
        limits.push(max);
      }
    }
    const L = limits.length;
    // Rest conflicts with the next day (further ones are checked on the finished line).
    const restK = lc.restTable[p];
    const restNext = new Uint8Array(restK >= 0 ? D * S * S : 0);
    if (restK >= 0) {
      const start = lc.restStart[restK];
      const pairs = lc.restPairs[restK];
      for (let d = 0; d + 1 < D; d++) {
        for (let s = 0; s < S; s++) {
          const i = d * S + s;
          for (let j = start[i]; j < start[i + 1]; j++) {
            if (pairs[2 * j] === d + 1) restNext[i * S + pairs[2 * j + 1]] = 1;
          }
        }
      }
    }
    // Most paid minutes the rest of the period can still add (for the minimum-hours test).
    const longest = new Float64Array(D + 1);
    for (let d = D - 1; d >= 0; d--) {
      let best = 0;
      for (const v of allowed[d]) if (v >= 0) best = Math.max(best, lc.paid[v]);
      longest[d] = longest[d + 1] + best;
    }

    // Most days the rest of the period (from day d) can be worked with runs of at most maxCons days
    // and at least minOff days off between them; weekends wholly from day d; the longest shift.
    const cycleOn = maxCons >= 0 ? maxCons : D;
    const cycleOff = maxCons >= 0 ? Math.max(1, minOff) : 0;
    const workable = new Int32Array(D + 1);
    for (let d = 0; d <= D; d++) {
      const rest = D - d;
      const full = Math.floor(rest / (cycleOn + cycleOff));
      workable[d] = full * cycleOn + Math.min(rest - full * (cycleOn + cycleOff), cycleOn);
    }
    const weekendsFrom = new Int32Array(D + 1);
    let smallestWeekend = D;
    for (const days of index.weekends) smallestWeekend = Math.min(smallestWeekend, days.length);
    for (let d = D - 1; d >= 0; d--) {
      const k = lc.weekendOf[d];
      const starts = k >= 0 && (d === 0 || lc.weekendOf[d - 1] !== k);
      weekendsFrom[d] = weekendsFrom[d + 1] + (starts ? 1 : 0);
    }
    let longestShift = 0;
    for (let s = 0; s < S; s++) longestShift = Math.max(longestShift, lc.paid[s]);
    // State keys as small integers (mixed radix): run, night run, weekends and paid minutes in units
    // of the greatest common divisor of the shift lengths.
    let unit = 0;
    for (let s = 0; s < S; s++) unit = gcd(unit, Math.round(lc.paid[s]));
    unit = Math.max(1, unit);
    const radixRun = Math.max(workCap, offCap) + 1;
    const radixNight = maxNights >= 0 ? maxNights + 1 : 1;
    const radixWeekends = (maxWeekends >= 0 ? maxWeekends : lc.weekendsInPeriod) + 1;
    const maxPaidUnits = Math.floor(Math.min(maxPaid, longest[0]) / unit) + 1;
    const root: Label = {
      slack: Infinity,
      cost: 0,
      paid: 0,
      weekends: 0,
      counts: L > 0 ? new Int16Array(L) : null,
      last: -2,
      run: 0,
      border: 1,
      nightRun: 0,
      weekendCounted: 0,
      prev: null,
    };
    let labels: Label[] = [root];
    const maxPerState = this.maxPerState;
    for (let d = 0; d < D; d++) {
      const layer = new Map<number, Label[]>();
      const k = lc.weekendOf[d];
      const sameWeekend = d > 0 && k >= 0 && lc.weekendOf[d - 1] === k;
      for (const from of labels) {
        for (const v of allowed[d]) {
          let run: number;
          let border: number;
          if (v >= 0) {
            if (from.last >= 0) {
              if (lc.forbidden[from.last * S + v] === 1) continue;
              if (restK >= 0 && restNext[((d - 1) * S + from.last) * S + v] === 1) continue;
              run = from.run + 1;
              if (run > workCap) {
                if (maxCons >= 0) continue;
                run = workCap;
              }
              border = from.border;
            } else {
              if (from.last === -1 && minOff > 0 && from.border === 0 && from.run < minOff) continue;
              run = 1;
              border = d === 0 ? 1 : 0;
            }
          } else if (from.last === -1) {
            run = Math.min(from.run + 1, offCap);
            border = from.border;
          } else {
            if (from.last >= 0 && minCons > 0 && from.border === 0 && from.run < minCons) continue;
            run = 1;
            border = d === 0 ? 1 : 0;
          }
          let nightRun = 0;
          if (v >= 0 && lc.night[v] === 1 && maxNights >= 0) {
            nightRun = from.nightRun + 1;
            if (nightRun > maxNights) continue;
          }
          const counted = sameWeekend && from.weekendCounted === 1;
          let weekends = from.weekends;
          let weekendCounted = counted ? 1 : 0;
          let weekendCost = 0;
          if (v >= 0 && k >= 0 && !counted) {
            weekends++;
            weekendCost = perWeekend;
            if (maxWeekends >= 0 && weekends > maxWeekends) continue;
            weekendCounted = 1;
          }
          const paid = v >= 0 ? from.paid + lc.paid[v] : from.paid;
          if (paid > maxPaid) continue;
          // Look-ahead: the most the rest of the period can still pay, with runs of at most maxCons
          // days between minOff days off, and every weekend beyond the budget off.
          let slack = Infinity;
          if (minPaid > 0) {
            let can = Math.min(longest[d + 1], workable[d + 1] * longestShift);
            if (maxWeekends >= 0) {
              const skip = Math.max(0, weekendsFrom[d + 1] - (maxWeekends - weekends));
              can = Math.min(can, (D - d - 1 - skip * smallestWeekend) * longestShift);
            }
            slack = paid + can - minPaid;
            if (slack < 0) continue;
          }
          let counts = from.counts;
          if (v >= 0 && limitedOf[v] >= 0) {
            const i = limitedOf[v];
            if (counts![i] + 1 > limits[i]) continue;
            counts = counts!.slice();
            counts[i]++;
          }
          const label: Label = {
            slack,
            cost: from.cost + cellCost[d * W + v + 1] + weekendCost,
            paid,
            weekends,
            counts,
            last: v,
            run,
            border,
            nightRun,
            weekendCounted,
            prev: from,
          };
          const key =
            ((((((v + 1) * radixRun + run) * 2 + border) * radixNight + nightRun) * 2 + weekendCounted) *
              radixWeekends +
              weekends) *
              maxPaidUnits +
            Math.round(paid / unit);
          const bucket = layer.get(key);
          if (!bucket) layer.set(key, [label]);
          else insert(bucket, label, maxPerState);
        }
      }
      labels = [];
      for (const bucket of layer.values()) for (const l of bucket) labels.push(l);
      if (labels.length > this.peakLabels) this.peakLabels = labels.length;
      if (labels.length > this.maxLabels) {
        // Cheapest first; when that left no line, those furthest ahead of the minimum hours first.
        if (bySlack) labels.sort((a, b) => b.slack - a.slack || a.cost - b.cost);
        else labels.sort((a, b) => a.cost - b.cost);
        labels.length = this.maxLabels;
        this.truncated = true;
      }
      if (labels.length === 0) return null;
    }
    // End: minimum hours, distance from contract hours; the cheapest line that LineCost passes.
    const finals: { label: Label; total: number }[] = [];
    for (const l of labels) {
      if (l.paid < minPaid) continue;
      let total = l.cost;
      if (hoursWeight !== 0 && target === target) total += (hoursWeight * Math.abs(l.paid - target)) / 60;
      finals.push({ label: l, total });
    }
    finals.sort((a, b) => a.total - b.total);
    if (!bySlack || finals.length > 0) this.lowest = finals.length > 0 ? finals[0].total : Infinity;
    const buffer = this.lineBuffer;
    const base = p * D;
    for (const { label } of finals.slice(0, 16)) {
      let at: Label | null = label;
      for (let d = D - 1; d >= 0; d--) {
        buffer[base + d] = at!.last;
        at = at!.prev;
      }
      lc.score(p, buffer, this.score);
      if (this.score.hard === 0) return buffer.slice(base, base + D);
    }
    return null;
  }
}

/** Adds `label` to its state's labels unless one there dominates it; drops those it dominates. */
function insert(bucket: Label[], label: Label, maxPerState: number): void {
  for (let i = bucket.length - 1; i >= 0; i--) {
    const other = bucket[i];
    if (other.cost <= label.cost && countsAtMost(other.counts, label.counts)) return;
    if (label.cost <= other.cost && countsAtMost(label.counts, other.counts)) {
      bucket[i] = bucket[bucket.length - 1];
      bucket.pop();
    }
  }
  bucket.push(label);
  if (bucket.length > maxPerState) {
    let worst = 0;
    for (let i = 1; i < bucket.length; i++) if (bucket[i].cost > bucket[worst].cost) worst = i;
    bucket[worst] = bucket[bucket.length - 1];
    bucket.pop();
  }
}

function gcd(a: number, b: number): number {
  while (b !== 0) [a, b] = [b, a % b];
  return Math.abs(a);
}

function countsAtMost(a: Int16Array | null, b: Int16Array | null): boolean {
  if (a === null || b === null) return true;
  for (let i = 0; i < a.length; i++) if (a[i] > b[i]) return false;
  return true;
}
