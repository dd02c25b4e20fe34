/**
 * Seeded random problems for the property tests and the second-solver tests (fast-check
 * arbitraries). Invented data: they only have to be small, varied and well formed.
 */
import fc from 'fast-check';
import type { Roster, RosterProblem } from '../lib/problem';
import { toRosterProblem, type BenchInstance } from '../lib/bench/curtois-qu';
import type { BenchRule } from '../lib/bench/evaluate';

export interface BenchArbOptions {
  horizons?: number[];
  maxStaff?: number;
  maxShiftTypes?: number;
}

const SHIFT_IDS = ['E', 'L', 'N'];

/** Small instances in the benchmark's own terms (SOURCES.md §3-4), every rule present. */
export function benchInstanceArb(options: BenchArbOptions = {}): fc.Arbitrary<BenchInstance> {
  const horizons = options.horizons ?? [7, 14];
  return fc
    .record({
      H: fc.constantFrom(...horizons),
      S: fc.integer({ min: 1, max: options.maxShiftTypes ?? 3 }),
      E: fc.integer({ min: 2, max: options.maxStaff ?? 4 }),
    })
    .chain(({ H, S, E }) => {
      const shiftIds = SHIFT_IDS.slice(0, S);
      const days = Array.from({ length: H }, (_, d) => d);
      const shift = fc.record({
        length: fc.constantFrom(480, 600, 720),
        forbidden: fc.subarray(shiftIds),
      });
      const staff = fc.record({
        maxShifts: fc.tuple(...shiftIds.map(() => fc.integer({ min: 0, max: H }))),
        maxTotalShifts: fc.integer({ min: 2, max: H }),
        minTotalShifts: fc.constantFrom(0, 0, 1, 2),
        maxCons: fc.integer({ min: 2, max: 6 }),
        minCons: fc.integer({ min: 1, max: 3 }),
        minOff: fc.integer({ min: 1, max: 3 }),
        maxWeekends: fc.integer({ min: 0, max: H / 7 }),
        daysOff: fc.subarray(days, { maxLength: 3 }),
      });
      const request = fc.record({
        e: fc.integer({ min: 0, max: E - 1 }),
        d: fc.integer({ min: 0, max: H - 1 }),
        s: fc.integer({ min: 0, max: S - 1 }),
        w: fc.integer({ min: 1, max: 3 }),
        on: fc.boolean(),
      });
      return fc.record({
        H: fc.constant(H),
        shiftIds: fc.constant(shiftIds),
        shifts: fc.tuple(...shiftIds.map(() => shift)),
        staff: fc.array(staff, { minLength: E, maxLength: E }),
        requests: fc.array(request, { maxLength: 3 * E }),
        cover: fc.array(fc.integer({ min: 0, max: Math.min(E, 3) }), { minLength: H * S, maxLength: H * S }),
      });
    })
    .map(({ H, shiftIds, shifts, staff, requests, cover }) => {
      const staffIds = staff.map((_, i) => `P${i}`);
      const seen = new Set<string>();
      const inst: BenchInstance = {
        name: 'random',
        horizon: H,
        shifts: shifts.map((s, i) => ({
          id: shiftIds[i],
          lengthMinutes: s.length,
          forbiddenNext: s.forbidden,
        })),
        staff: staff.map((e, i) => {
          const maxTotal = e.maxTotalShifts * 480;
          // a minimum no one could reach would make most problems infeasible: keep it reachable on paper
          const minShifts = Math.min(
            e.minTotalShifts,
            e.maxShifts.reduce((a, b) => a + b, 0),
          );
          return {
            id: staffIds[i],
            maxShifts: Object.fromEntries(shiftIds.map((s, k) => [s, e.maxShifts[k]])),
            maxTotalMinutes: maxTotal,
            minTotalMinutes: Math.min(minShifts * 480, maxTotal),
            maxConsecutiveShifts: e.maxCons,
            minConsecutiveShifts: e.minCons,
            minConsecutiveDaysOff: e.minOff,
            maxWeekends: e.maxWeekends,
          };
        }),
        daysOff: Object.fromEntries(
          staff
            .filter((e) => e.daysOff.length > 0)
            .map((e) => [staffIds[staff.indexOf(e)], [...e.daysOff].sort((a, b) => a - b)]),
        ),
        onRequests: [],
        offRequests: [],
        cover: [],
      };
      for (const q of requests) {
        // one request per person and day at most (as in the published files, SOURCES.md §3)
        const key = `${q.e}/${q.d}`;
        if (seen.has(key)) continue;
        seen.add(key);
        const r = { staffId: staffIds[q.e], day: q.d, shiftId: shiftIds[q.s], weight: q.w };
        (q.on ? inst.onRequests : inst.offRequests).push(r);
      }
      for (let d = 0; d < H; d++) {
        shiftIds.forEach((s, k) =>
          inst.cover.push({
            day: d,
            shiftId: s,
            requirement: cover[d * shiftIds.length + k],
            weightUnder: 100,
            weightOver: 1,
          }),
        );
      }
      return inst;
    });
}

/** Any roster over an instance's staff, days and shift ids (rules may be broken). */
export function rosterArb(inst: BenchInstance): fc.Arbitrary<Roster> {
  const cell = fc.oneof(
    { weight: 2, arbitrary: fc.constant(null) },
    fc.constantFrom(...inst.shifts.map((s) => s.id)),
  );
  return fc
    .tuple(...inst.staff.map(() => fc.array(cell, { minLength: inst.horizon, maxLength: inst.horizon })))
    .map((rows) => Object.fromEntries(inst.staff.map((e, i) => [e.id, rows[i]])));
}

export const PLANTABLE_RULES: BenchRule[] = [
  'forbiddenSuccession',
  'maxShiftsPerType',
  'maxPaidMinutes',
  'minPaidMinutes',
  'maxConsecutiveWorkDays',
  'minConsecutiveWorkDays',
  'minConsecutiveDaysOff',
  'maxWeekends',
  'absence',
];

/**
 * Plants a violation of `rule` for person `staffId` around `day` by editing a copy of the roster
 * the way a manager could in the grid. Returns null when the instance makes the rule impossible
 * to break for that person (e.g. a max-weekends limit as large as the number of weekends).
 */
export function plantViolation(
  inst: BenchInstance,
  roster: Roster,
  rule: BenchRule,
  staffId: string,
  day: number,
): Roster | null {
  const H = inst.horizon;
  const emp = inst.staff.find((e) => e.id === staffId);
  if (!emp) throw new Error(`unknown staff ${staffId}`);
  const out: Roster = Object.fromEntries(Object.entries(roster).map(([k, v]) => [k, [...v]]));
  const row = out[staffId];
  const anyShift = (inst.shifts.find((s) => (emp.maxShifts[s.id] ?? 0) > 0) ?? inst.shifts[0]).id;
  const work = (d: number): void => {
    if (row[d] === null) row[d] = anyShift;
  };
  const clamp = (d: number, lo: number, hi: number): number => Math.min(Math.max(d, lo), hi);
  switch (rule) {
    case 'forbiddenSuccession': {
      const pairs = inst.shifts.flatMap((s) => s.forbiddenNext.map((t) => [s.id, t] as const));
      if (pairs.length === 0 || H < 2) return null;
      const [s, t] = pairs[day % pairs.length];
      const d = clamp(day, 0, H - 2);
      row[d] = s;
      row[d + 1] = t;
      return out;
    }
    case 'maxShiftsPerType': {
      const s = [...inst.shifts].sort((a, b) => (emp.maxShifts[a.id] ?? 0) - (emp.maxShifts[b.id] ?? 0))[0];
      const limit = emp.maxShifts[s.id] ?? 0;
      if (limit + 1 > H) return null;
      let placed = row.filter((x) => x === s.id).length;
      for (let k = 0; k < H && placed <= limit; k++) {
        const d = (day + k) % H;
        if (row[d] !== s.id) {
          row[d] = s.id;
          placed++;
        }
      }
      return out;
    }
    case 'maxPaidMinutes': {
      const longest = [...inst.shifts].sort((a, b) => b.lengthMinutes - a.lengthMinutes)[0];
      if (H * longest.lengthMinutes <= emp.maxTotalMinutes) return null;
      for (let d = 0; d < H; d++) row[d] = longest.id;
      return out;
    }
    case 'minPaidMinutes':
      if (emp.minTotalMinutes <= 0) return null;
      row.fill(null);
      return out;
    case 'maxConsecutiveWorkDays': {
      const K = emp.maxConsecutiveShifts;
      if (K + 1 > H) return null;
      const start = clamp(day, 0, H - K - 1);
      for (let d = start; d <= start + K; d++) work(d);
      return out;
    }
    case 'minConsecutiveWorkDays':
    case 'minConsecutiveDaysOff': {
      const m = rule === 'minConsecutiveWorkDays' ? emp.minConsecutiveShifts : emp.minConsecutiveDaysOff;
      if (m < 2 || H < 3) return null;
      const d = clamp(day, 1, H - 2);
      if (rule === 'minConsecutiveWorkDays') {
        row[d - 1] = null;
        work(d);
        row[d + 1] = null;
      } else {
        work(d - 1);
        row[d] = null;
        work(d + 1);
      }
      return out;
    }
    case 'maxWeekends': {
      const weekends = Math.floor((H - 5 + 6) / 7);
      if (emp.maxWeekends + 1 > weekends) return null;
      for (let k = 0; k <= emp.maxWeekends; k++) work(7 * ((Math.floor(day / 7) + k) % weekends) + 5);
      return out;
    }
    case 'absence': {
      const off = inst.daysOff[staffId] ?? [];
      if (off.length === 0) return null;
      const d = off.reduce((best, x) => (Math.abs(x - day) < Math.abs(best - day) ? x : best), off[0]);
      work(d);
      return out;
    }
    default:
      return null;
  }
}

/**
 * A product-form problem built from a random benchmark instance, with the features the benchmark
 * lacks switched on: skills and skill needs, minimum cover, derived minimum rest (shift times vary,
 * Europe/London across the spring clock change), max consecutive nights, day-off requests, pins,
 * leave, contracted hours, fairness, labour cost and repair against a published roster.
 */
export function productProblemArb(options: BenchArbOptions = {}): fc.Arbitrary<RosterProblem> {
  return benchInstanceArb(options).chain((inst) => {
    const P = inst.staff.length;
    const H = inst.horizon;
    return fc
      .record({
        starts: fc.tuple(...inst.shifts.map(() => fc.constantFrom('06:00', '14:00', '20:00', '22:00'))),
        rest: fc.tuple(...inst.staff.map(() => fc.constantFrom(undefined, 600, 660))),
        nights: fc.tuple(...inst.staff.map(() => fc.constantFrom(undefined, 1, 2, 3))),
        skilled: fc.tuple(...inst.staff.map(() => fc.boolean())),
        hourlyCost: fc.tuple(...inst.staff.map(() => fc.integer({ min: 10, max: 30 }))),
        target: fc.tuple(...inst.staff.map(() => fc.constantFrom(undefined, 1920, 2400))),
        skillNeeds: fc.array(
          fc.record({
            d: fc.integer({ min: 0, max: H - 1 }),
            s: fc.integer({ min: 0, max: inst.shifts.length - 1 }),
          }),
          { maxLength: 4 },
        ),
        dayOffRequests: fc.array(
          fc.record({
            p: fc.integer({ min: 0, max: P - 1 }),
            d: fc.integer({ min: 0, max: H - 1 }),
            w: fc.integer({ min: 1, max: 5 }),
          }),
          { maxLength: 3 },
        ),
        leave: fc.array(
          fc.record({ p: fc.integer({ min: 0, max: P - 1 }), d: fc.integer({ min: 0, max: H - 1 }) }),
          {
            maxLength: 2,
          },
        ),
        pin: fc.option(
          fc.record({ p: fc.integer({ min: 0, max: P - 1 }), d: fc.integer({ min: 0, max: H - 1 }) }),
        ),
        published: fc.option(rosterArb(inst)),
        weights: fc.record({
          fairNights: fc.integer({ min: 0, max: 5 }),
          fairWeekends: fc.integer({ min: 0, max: 5 }),
          hoursDeviation: fc.integer({ min: 0, max: 2 }),
          labourCost: fc.constantFrom(0, 0.01),
          changes: fc.integer({ min: 0, max: 20 }),
        }),
      })
      .map((x) => {
        const base = toRosterProblem(inst);
        const lengths = inst.shifts.map((s) => s.lengthMinutes);
        const problem: RosterProblem = {
          ...base,
          // 2026-03-23 is a Monday; the UK clocks go forward on Sunday 29 March 2026 (day 6)
          startDate: '2026-03-23',
          timeZone: 'Europe/London',
          shiftTypes: base.shiftTypes.map((s, i) => {
            const [h, m] = x.starts[i].split(':').map(Number);
            const end = (h * 60 + m + lengths[i]) % 1440;
            const { night: _night, ...rest } = s;
            return {
              ...rest,
              start: x.starts[i],
              end: `${String(Math.floor(end / 60)).padStart(2, '0')}:${String(end % 60).padStart(2, '0')}`,
            };
          }),
          people: base.people.map((p, i) => ({
            ...p,
            skills: x.skilled[i] ? ['senior'] : [],
            hourlyCost: x.hourlyCost[i],
            contract: {
              ...p.contract,
              minRestMinutes: x.rest[i],
              maxConsecutiveNights: x.nights[i],
              targetPaidMinutes: x.target[i],
            },
          })),
          coverNeeds: [
            ...base.coverNeeds.map((n) => ({ ...n, min: Math.min(1, n.target) })),
            ...uniqueBy(x.skillNeeds, ({ d, s }) => `${d}/${s}`).map(({ d, s }) => ({
              day: d,
              shiftTypeId: inst.shifts[s].id,
              skillId: 'senior',
              min: 1,
              target: 1,
            })),
          ],
          requests: [
            ...base.requests,
            ...x.dayOffRequests.map(({ p, d, w }) => ({
              personId: inst.staff[p].id,
              day: d,
              kind: 'dayOff' as const,
              weight: w,
            })),
          ],
          absences: [
            ...base.absences,
            ...x.leave.map(({ p, d }) => ({ personId: inst.staff[p].id, day: d, kind: 'leave' as const })),
          ],
          pins: x.pin ? [{ personId: inst.staff[x.pin.p].id, day: x.pin.d, shiftTypeId: null }] : [],
          weights: { coverUnderMin: 500, coverUnderTarget: 100, coverOver: 1, requests: 1, ...x.weights },
          published: x.published ?? undefined,
        };
        return problem;
      });
  });
}

function uniqueBy<T>(items: T[], key: (item: T) => string): T[] {
  const seen = new Set<string>();
  return items.filter((item) => {
    const k = key(item);
    if (seen.has(k)) return false;
    seen.add(k);
    return true;
  });
}
