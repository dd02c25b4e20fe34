/**
 * A second, self-contained evaluator of a roster against a benchmark instance, written straight from
 * the problem definition in ../shared/benchmarks/curtois-qu/SOURCES.md §4 (hard constraints 2-10 and
 * the total penalty). It shares no code with the product's checker, so tests can hold the two against
 * each other: same violations (by rule and person) and same objective.
 */
import type { Roster } from '../problem';
import type { BenchInstance } from './curtois-qu';

/** The benchmark's hard constraints (§4 numbering), named like the product's hard rules. */
export type BenchRule =
  | 'forbiddenSuccession' // 2
  | 'maxShiftsPerType' // 3
  | 'maxPaidMinutes' // 4
  | 'minPaidMinutes' // 5
  | 'maxConsecutiveWorkDays' // 6
  | 'minConsecutiveWorkDays' // 7
  | 'minConsecutiveDaysOff' // 8
  | 'maxWeekends' // 9
  | 'absence' // 10 (days off)
  | 'unknownShiftType';

export interface BenchViolation {
  rule: BenchRule;
  staffId: string;
  day: number;
}

export interface BenchEvaluation {
  violations: BenchViolation[];
  onRequestPenalty: number;
  offRequestPenalty: number;
  coverPenalty: number;
  /** Total penalty (§4 "Objective"). */
  penalty: number;
}

/** Maximal runs of `value` in `flags` as [start, length]. */
function runs(flags: boolean[], value: boolean): [number, number][] {
  const out: [number, number][] = [];
  let start = -1;
  for (let d = 0; d <= flags.length; d++) {
    const inRun = d < flags.length && flags[d] === value;
    if (inRun && start < 0) start = d;
    if (!inRun && start >= 0) {
      out.push([start, d - start]);
      start = -1;
    }
  }
  return out;
}

export function evaluateBenchmarkRoster(instance: BenchInstance, roster: Roster): BenchEvaluation {
  const H = instance.horizon;
  const shiftById = new Map(instance.shifts.map((s) => [s.id, s]));
  const violations: BenchViolation[] = [];
  const row = (staffId: string): (string | null)[] => {
    const r = roster[staffId] ?? [];
    return Array.from({ length: H }, (_, d) => r[d] ?? null);
  };

  for (const e of instance.staff) {
    const r = row(e.id);
    const add = (rule: BenchRule, day: number): void => {
      violations.push({ rule, staffId: e.id, day });
    };
    r.forEach((s, d) => {
      if (s !== null && !shiftById.has(s)) add('unknownShiftType', d);
    });
    // 2. shift rotation, pairs of days inside the horizon only
    for (let d = 0; d + 1 < H; d++) {
      const s = r[d];
      const t = r[d + 1];
      if (s !== null && t !== null && shiftById.get(s)?.forbiddenNext.includes(t))
        add('forbiddenSuccession', d);
    }
    // 3. maximum shifts per type
    for (const s of instance.shifts) {
      const n = r.filter((x) => x === s.id).length;
      if (n > (e.maxShifts[s.id] ?? 0)) add('maxShiftsPerType', r.indexOf(s.id));
    }
    // 4, 5. total minutes
    const minutes = r.reduce((sum, s) => sum + (s === null ? 0 : (shiftById.get(s)?.lengthMinutes ?? 0)), 0);
    if (minutes > e.maxTotalMinutes) add('maxPaidMinutes', 0);
    if (minutes < e.minTotalMinutes) add('minPaidMinutes', 0);
    const works = r.map((s) => s !== null);
    // 6. maximum consecutive shifts (days outside the horizon are days off)
    for (const [start, len] of runs(works, true)) {
      if (len > e.maxConsecutiveShifts) add('maxConsecutiveWorkDays', start);
      // 7. minimum consecutive shifts, except runs touching day 0 or day H-1
      if (start > 0 && start + len < H && len < e.minConsecutiveShifts) add('minConsecutiveWorkDays', start);
    }
    // 8. minimum consecutive days off, except runs touching day 0 or day H-1
    for (const [start, len] of runs(works, false)) {
      if (start > 0 && start + len < H && len < e.minConsecutiveDaysOff) add('minConsecutiveDaysOff', start);
    }
    // 9. maximum weekends: weekend k is days 7k+5 and 7k+6
    let weekends = 0;
    for (let k = 0; 7 * k + 5 < H; k++) {
      if (works[7 * k + 5] || (7 * k + 6 < H && works[7 * k + 6])) weekends++;
    }
    if (weekends > e.maxWeekends) add('maxWeekends', 0);
    // 10. days off
    for (const d of instance.daysOff[e.id] ?? []) if (works[d]) add('absence', d);
  }

  let onRequestPenalty = 0;
  for (const q of instance.onRequests) if (row(q.staffId)[q.day] !== q.shiftId) onRequestPenalty += q.weight;
  let offRequestPenalty = 0;
  for (const q of instance.offRequests)
    if (row(q.staffId)[q.day] === q.shiftId) offRequestPenalty += q.weight;
  let coverPenalty = 0;
  for (const c of instance.cover) {
    const n = instance.staff.filter((e) => row(e.id)[c.day] === c.shiftId).length;
    coverPenalty +=
      c.weightUnder * Math.max(0, c.requirement - n) + c.weightOver * Math.max(0, n - c.requirement);
  }
  return {
    violations,
    onRequestPenalty,
    offRequestPenalty,
    coverPenalty,
    penalty: onRequestPenalty + offRequestPenalty + coverPenalty,
  };
}
