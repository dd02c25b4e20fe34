/**
 * The cost of one person's line of the roster (every hard rule and every soft goal that depends on
 * that person alone), compiled once per problem into flat arrays so the local search can score a
 * line thousands of times a millisecond without allocating.
 *
 * It states the same rules as rules/*.ts and goals/*.ts (their checkPerson/check are the reference;
 * line-cost.spec.ts compares both on random rosters):
 * - `hard` is 0 exactly when the checker finds no violation in the line; otherwise it grows with the
 *   size of each violation (days over or under a run limit, shifts over a limit, shortfall of paid
 *   minutes in shifts of average length, one per rest conflict or forbidden succession), which gives
 *   the search a slope towards a line that keeps every rule;
 * - `soft` is the weighted sum of the person's requests, changes against the published roster,
 *   labour cost and deviation from contract hours, exactly as the goals compute them.
 * Nights and worked weekends are counted on the way for the two fairness goals.
 */
import type { ProblemIndex } from '../model/context';

export interface LineScore {
  hard: number;
  soft: number;
  nights: number;
  weekends: number;
}

const NONE = -1;

/** Fields are read by line-dp.ts, which builds best lines under the same rules. */
export class LineCost {
  readonly P: number;
  readonly D: number;
  readonly S: number;
  readonly paid: Float64Array;
  readonly night: Uint8Array;
  /** forbidden[s * S + t] = 1 when t may not follow s on the next day. */
  readonly forbidden: Uint8Array;
  /** weekendOf[d] = index of the weekend holding day d, or -1. */
  readonly weekendOf: Int32Array;
  private readonly weekendCount: number;
  /** Contract limits per person (NaN: no such rule). */
  readonly minPaid: Float64Array;
  readonly maxPaid: Float64Array;
  readonly targetPaid: Float64Array;
  readonly maxCons: Int32Array;
  readonly minCons: Int32Array;
  readonly minOff: Int32Array;
  readonly maxWeekends: Int32Array;
  readonly maxNights: Int32Array;
  /** maxShifts[p * S + s] (Infinity when unlimited). */
  readonly maxShifts: Float64Array;
  /** Rest conflicts per person's limit: restTable[p] indexes restLists. */
  readonly restTable: Int32Array;
  /** restStart[k][d * S + s] … restStart[k][d * S + s + 1]: conflicts (d2, t) in restPairs[k]. */
  readonly restStart: Int32Array[] = [];
  readonly restPairs: Int32Array[] = [];
  /** Requests of each person: reqStart[p] … reqStart[p + 1] into reqDay/reqKind/reqShift/reqWeight. */
  readonly reqStart: Int32Array;
  readonly reqDay: Int32Array;
  /** 0 dayOff, 1 shiftOn, 2 shiftOff. */
  readonly reqKind: Uint8Array;
  readonly reqShift: Int32Array;
  readonly reqWeight: Float64Array;
  /** published[p * D + d]: published value, -1 off, -3 not compared. */
  readonly published: Int32Array | null;
  readonly changeWeight: number;
  readonly labour: Float64Array;
  readonly hoursWeight: number;
  /** absent[(p * D + d) * S + s] (pins may force such a cell; the search never does). */
  private readonly absent: Uint8Array;
  /** pin[p * D + d]: NO_PIN (-2), -1 (off) or a shift. */
  private readonly pin: Int32Array;
  /** Hard units per paid minute (one shift of average length = 1). */
  private readonly perMinute: number;
  private readonly typeCounts: Int32Array;

  constructor(readonly index: ProblemIndex) {
    const { P, D, S, problem } = index;
    this.P = P;
    this.D = D;
    this.S = S;
    this.paid = Float64Array.from(index.paid);
    this.night = Uint8Array.from(index.night.map((n) => (n ? 1 : 0)));
    this.forbidden = new Uint8Array(S * S);
    index.successors.forEach((next, s) => next.forEach((t) => (this.forbidden[s * S + t] = 1)));
    this.weekendOf = new Int32Array(D).fill(NONE);
    index.weekends.forEach((days, k) => days.forEach((d) => (this.weekendOf[d] = k)));
    this.weekendCount = index.weekends.length;
    const num = (v: number | undefined): number => (v === undefined ? NaN : v);
    const int = (v: number | undefined): number => (v === undefined ? NONE : v);
    const contracts = problem.people.map((p) => p.contract);
    this.minPaid = Float64Array.from(contracts.map((c) => num(c.minPaidMinutes)));
    this.maxPaid = Float64Array.from(contracts.map((c) => num(c.maxPaidMinutes)));
    this.targetPaid = Float64Array.from(contracts.map((c) => num(c.targetPaidMinutes)));
    this.maxCons = Int32Array.from(contracts.map((c) => int(c.maxConsecutiveWorkDays)));
    this.minCons = Int32Array.from(contracts.map((c) => int(c.minConsecutiveWorkDays)));
    this.minOff = Int32Array.from(contracts.map((c) => int(c.minConsecutiveDaysOff)));
    this.maxWeekends = Int32Array.from(contracts.map((c) => int(c.maxWeekends)));
    this.maxNights = Int32Array.from(contracts.map((c) => int(c.maxConsecutiveNights)));
    this.maxShifts = new Float64Array(P * S);
    for (let p = 0; p < P; p++) for (let s = 0; s < S; s++) this.maxShifts[p * S + s] = index.maxShifts(p, s);

    // Rest conflicts, one table per distinct limit.
    this.restTable = new Int32Array(P).fill(NONE);
    const byLimit = new Map<number, number>();
    contracts.forEach((c, p) => {
      const limit = c.minRestMinutes;
      if (!limit || limit <= 0) return;
      let k = byLimit.get(limit);
      if (k === undefined) {
        k = this.restPairs.length;
        byLimit.set(limit, k);
        const lists: number[][] = Array.from({ length: D * S }, () => []);
        for (const r of index.restConflicts(limit)) lists[r.d * S + r.s].push(r.d2, r.t);
        const start = new Int32Array(D * S + 1);
        const pairs: number[] = [];
        lists.forEach((l, i) => {
          start[i] = pairs.length / 2;
          pairs.push(...l);
        });
        start[D * S] = pairs.length / 2;
        this.restStart.push(start);
        this.restPairs.push(Int32Array.from(pairs));
      }
      this.restTable[p] = k;
    });

    // Requests (unknown people, days or shift types count as honoured: left out).
    const perPerson: { d: number; kind: number; s: number; w: number }[][] = Array.from(
      { length: P },
      () => [],
    );
    for (const r of problem.requests) {
      const p = index.personIndex.get(r.personId);
      if (p === undefined || r.day < 0 || r.day >= D) continue;
      if (r.kind === 'dayOff') {
        perPerson[p].push({ d: r.day, kind: 0, s: NONE, w: r.weight * index.weights.requests });
        continue;
      }
      const s = r.shiftTypeId === undefined ? undefined : index.shiftIndex.get(r.shiftTypeId);
      if (s === undefined) continue;
      perPerson[p].push({
        d: r.day,
        kind: r.kind === 'shiftOn' ? 1 : 2,
        s,
        w: r.weight * index.weights.requests,
      });
    }
    this.reqStart = new Int32Array(P + 1);
    const flat = perPerson.flat();
    let at = 0;
    perPerson.forEach((list, p) => {
      this.reqStart[p] = at;
      at += list.length;
    });
    this.reqStart[P] = at;
    this.reqDay = Int32Array.from(flat.map((r) => r.d));
    this.reqKind = Uint8Array.from(flat.map((r) => r.kind));
    this.reqShift = Int32Array.from(flat.map((r) => r.s));
    this.reqWeight = Float64Array.from(flat.map((r) => r.w));

    this.changeWeight = index.weights.changes;
    if (problem.published && this.changeWeight !== 0) {
      this.published = new Int32Array(P * D).fill(-3);
      for (let p = 0; p < P; p++) {
        const cells = problem.published[index.personId(p)];
        if (!cells) continue;
        for (let d = 0; d < Math.min(cells.length, D); d++) {
          const id = cells[d];
          if (id === undefined) continue;
          this.published[p * D + d] = id === null || id === '' ? -1 : (index.shiftIndex.get(id) ?? -3);
        }
      }
    } else this.published = null;
    this.labour = Float64Array.from(
      problem.people.map((p) => (index.weights.labourCost * (p.hourlyCost ?? 0)) / 60),
    );
    this.hoursWeight = index.weights.hoursDeviation;
    this.absent = index.absent;
    this.pin = index.pin;
    const avg = S ? index.paid.reduce((a, b) => a + b, 0) / S : 1;
    this.perMinute = 1 / Math.max(1, avg);
    this.typeCounts = new Int32Array(S);
  }

  /**
   * Scores person p's line, read from grid[p * D … p * D + D − 1], into `out`.
   * Rules are the same as the checker's (see the file header); only their sizes are weighed here.
   */
  score(p: number, grid: Int16Array, out: LineScore): void {
    const { D, S } = this;
    const base = p * D;
    const counts = this.typeCounts;
    counts.fill(0);
    const maxCons = this.maxCons[p];
    const minCons = this.minCons[p];
    const minOff = this.minOff[p];
    const maxNights = this.maxNights[p];
    const restK = this.restTable[p];
    const restStart = restK >= 0 ? this.restStart[restK] : null;
    const restPairs = restK >= 0 ? this.restPairs[restK] : null;
    let hard = 0;
    let paid = 0;
    let nights = 0;
    let workRun = 0;
    let workStart = 0;
    let offRun = 0;
    let offStart = 0;
    let nightRun = 0;
    let weekendsWorked = 0;
    let lastWeekend = NONE;
    let prev = -1;
    for (let d = 0; d < D; d++) {
      const s = grid[base + d];
      if (s >= 0) {
        paid += this.paid[s];
        counts[s]++;
        if (this.absent[(base + d) * S + s] === 1) hard += 1;
        const pinned = this.pin[base + d];
        if (pinned !== -2 && pinned !== s) hard += 1;
        if (prev >= 0 && this.forbidden[prev * S + s] === 1) hard += 1;
        if (restPairs !== null) {
          const i = d * S + s;
          for (let j = restStart![i]; j < restStart![i + 1]; j++) {
            if (grid[base + restPairs[2 * j]] === restPairs[2 * j + 1]) hard += 1;
          }
        }
        if (offRun > 0) {
          if (minOff > 0 && offStart > 0 && offRun < minOff) hard += minOff - offRun;
          offRun = 0;
        }
        if (workRun === 0) workStart = d;
        workRun++;
        if (this.night[s] === 1) {
          nights++;
          nightRun++;
        } else {
          if (maxNights >= 0 && nightRun > maxNights) hard += nightRun - maxNights;
          nightRun = 0;
        }
        const k = this.weekendOf[d];
        if (k >= 0 && k !== lastWeekend) {
          lastWeekend = k;
          weekendsWorked++;
        }
      } else {
        const pinned = this.pin[base + d];
        if (pinned >= 0) hard += 1;
        if (workRun > 0) {
          if (maxCons >= 0 && workRun > maxCons) hard += workRun - maxCons;
          if (minCons > 0 && workStart > 0 && workRun < minCons) hard += minCons - workRun;
          workRun = 0;
        }
        if (maxNights >= 0 && nightRun > maxNights) hard += nightRun - maxNights;
        nightRun = 0;
        if (offRun === 0) offStart = d;
        offRun++;
      }
      prev = s;
    }
    // Runs reaching the last day: only maximum lengths apply (border runs).
    if (workRun > 0 && maxCons >= 0 && workRun > maxCons) hard += workRun - maxCons;
    if (maxNights >= 0 && nightRun > maxNights) hard += nightRun - maxNights;
    for (let s = 0; s < S; s++) {
      const over = counts[s] - this.maxShifts[p * S + s];
      if (over > 0) hard += over;
    }
    const min = this.minPaid[p];
    if (paid < min) hard += 1 + (min - paid) * this.perMinute;
    const max = this.maxPaid[p];
    if (paid > max) hard += 1 + (paid - max) * this.perMinute;
    const maxWk = this.maxWeekends[p];
    if (maxWk >= 0 && weekendsWorked > maxWk) hard += weekendsWorked - maxWk;

    let soft = 0;
    for (let r = this.reqStart[p]; r < this.reqStart[p + 1]; r++) {
      const got = grid[base + this.reqDay[r]];
      const kind = this.reqKind[r];
      const honoured =
        kind === 0 ? got < 0 : kind === 1 ? got === this.reqShift[r] : got !== this.reqShift[r];
      if (!honoured) soft += this.reqWeight[r];
    }
    if (this.published !== null) {
      for (let d = 0; d < D; d++) {
        const v = this.published[base + d];
        if (v !== -3 && grid[base + d] !== v) soft += this.changeWeight;
      }
    }
    soft += this.labour[p] * paid;
    const target = this.targetPaid[p];
    if (this.hoursWeight !== 0 && target === target)
      soft += (this.hoursWeight * Math.abs(paid - target)) / 60;
    out.hard = hard;
    out.soft = soft;
    out.nights = nights;
    out.weekends = weekendsWorked;
  }

  get weekendsInPeriod(): number {
    return this.weekendCount;
  }
}
