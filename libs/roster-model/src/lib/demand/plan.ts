/**
 * A roster period's requirement and covering plan from a unit's demand (the contracts' DTOs):
 * the forecast of each date (its own row, else its weekday's pattern) becomes agents per interval
 * (Erlang C, then shrinkage), and the covering model chooses how many people start each shift
 * type each day. Ward patients become people per shift and skill by ratio, with the floor.
 */
import {
  type ContactCentreDemandDto,
  type IntervalRequirementDto,
  minutesOfDay,
  type ShiftStartDto,
  shiftLengthMinutes,
  type WardDemandDto,
  type WardShiftRequirementDto,
} from '@rotaplex/contracts';
import { agentsForTarget, serviceLevel, trafficErlangs, withShrinkage } from './erlang';
import { type CoveringSolver, coverShifts, shiftIntervals } from './covering';
import { wardRequirement } from './ward';

/** A shift type as the plan needs it. */
export interface PlanShiftType {
  id: string;
  /** "HH:mm" */
  start: string;
  /** "HH:mm"; not after start = the next day. */
  end: string;
  paidMinutes: number;
}

function weekdayOf(date: string): number {
  return new Date(`${date}T00:00:00Z`).getUTCDay();
}

function pad(n: number): string {
  return String(n).padStart(2, '0');
}

/** Per-interval requirement of the period's dates (dates.length x 1440 / intervalMinutes rows). */
export function contactRequirement(
  demand: ContactCentreDemandDto,
  dates: readonly string[],
): IntervalRequirementDto[] {
  const len = demand.intervalMinutes;
  const perDay = 1440 / len;
  const byWeekday = new Map(demand.pattern.map((p) => [p.weekday, p.intervals]));
  const byDate = new Map(demand.dates.map((d) => [d.date, d.intervals]));
  const { service } = demand;
  const out: IntervalRequirementDto[] = [];
  for (const date of dates) {
    const day = byDate.get(date) ?? byWeekday.get(weekdayOf(date)) ?? [];
    const slots = new Array<{ contacts: number; ahtSeconds: number } | undefined>(perDay);
    for (const i of day) slots[Math.floor(minutesOfDay(i.start) / len)] = i;
    for (let k = 0; k < perDay; k++) {
      const minute = k * len;
      const start = `${date}T${pad(Math.floor(minute / 60))}:${pad(minute % 60)}`;
      const slot = slots[k];
      const contacts = slot?.contacts ?? 0;
      const aht = slot?.ahtSeconds ?? 0;
      const a = contacts > 0 && aht > 0 ? trafficErlangs(contacts, aht, len) : 0;
      const r = agentsForTarget(a, aht > 0 ? aht : 1, service);
      out.push({
        start,
        contacts,
        ahtSeconds: aht,
        trafficErlangs: a,
        agents: r.agents,
        scheduled: withShrinkage(r.agents, service.shrinkagePercent),
        serviceLevelPercent: r.serviceLevelPercent,
        asaSeconds: r.asaSeconds,
        occupancyPercent: r.occupancyPercent,
      });
    }
  }
  return out;
}

export interface ContactCoverPlan {
  starts: ShiftStartDto[];
  /** People on shift per interval (target plan). */
  planned: number[];
  /** scheduled - planned, when positive. */
  short: number[];
  paidHours: number;
  underCoverPersonIntervals: number;
  /** The part of it in intervals that no allowed shift covers at all (no plan can fill them). */
  outsideShiftsPersonIntervals: number;
  status: string;
}

function coverShiftOf(s: PlanShiftType) {
  return {
    id: s.id,
    startMinute: minutesOfDay(s.start),
    lengthMinutes: shiftLengthMinutes(s.start, s.end),
    cost: s.paidMinutes / 60,
  };
}

/**
 * The covering plan: `people` covers `scheduled` (after shrinkage) at least cost; `minimum` covers
 * `agents` (before shrinkage) at least cost within those shifts (never more than `people`).
 */
export async function planContactCover(
  requirement: readonly IntervalRequirementDto[],
  dates: readonly string[],
  intervalMinutes: number,
  shiftTypes: readonly PlanShiftType[],
  options: {
    maxPeoplePerDay?: number | null;
    wrap?: boolean;
    timeLimitSeconds?: number;
    /** Where the covering MIPs run (default: this thread's HiGHS session). */
    solver?: CoveringSolver;
  } = {},
): Promise<ContactCoverPlan> {
  if (!shiftTypes.length) throw new RangeError('the plan needs at least one shift type');
  const shifts = shiftTypes.map(coverShiftOf);
  const base = {
    days: dates.length,
    intervalMinutes,
    shifts,
    maxPeoplePerDay: options.maxPeoplePerDay ?? null,
    wrap: options.wrap ?? true,
    timeLimitSeconds: options.timeLimitSeconds ?? 20,
    solver: options.solver,
  };
  // The target first (after shrinkage, the plan to roster); then the minimum, the cheapest plan for
  // the agents alone inside the target's shifts, so minimum <= target and the caps hold for both.
  const target = await coverShifts({ ...base, requirement: requirement.map((r) => r.scheduled) });
  const needsMinimum = requirement.some((r) => r.agents !== r.scheduled);
  const minimum = needsMinimum
    ? await coverShifts({
        ...base,
        requirement: requirement.map((r) => r.agents),
        upperBounds: target.people,
      })
    : null;
  const starts: ShiftStartDto[] = [];
  const people = target.people;
  const least = minimum?.people ?? target.people;
  const planned = new Array<number>(requirement.length).fill(0);
  let paidHours = 0;
  dates.forEach((date, d) => {
    shiftTypes.forEach((s, k) => {
      const n = people[d][k];
      paidHours += (n * s.paidMinutes) / 60;
      if (n > 0) {
        for (const t of shiftIntervals(d, shifts[k], intervalMinutes, dates.length, base.wrap))
          planned[t] += n;
      }
      starts.push({ date, shiftTypeId: s.id, people: n, minimum: least[d][k] });
    });
  });
  const short = requirement.map((r, t) => Math.max(0, r.scheduled - planned[t]));
  const coverable = new Uint8Array(requirement.length);
  dates.forEach((_, d) =>
    shifts.forEach((s) => {
      for (const t of shiftIntervals(d, s, intervalMinutes, dates.length, base.wrap)) coverable[t] = 1;
    }),
  );
  return {
    starts,
    planned,
    short,
    paidHours,
    underCoverPersonIntervals: short.reduce((a, b) => a + b, 0),
    outsideShiftsPersonIntervals: short.reduce((a, n, t) => a + (coverable[t] ? 0 : n), 0),
    status: minimum && minimum.status !== 'optimal' ? minimum.status : target.status,
  };
}

/** People on shift per interval for the given assignments (no wrap: the roster is what it is). */
export function rosteredCover(
  dates: readonly string[],
  intervalMinutes: number,
  assignments: readonly { date: string; shiftTypeId: string }[],
  shiftTypes: readonly PlanShiftType[],
): number[] {
  const dayOf = new Map(dates.map((d, i) => [d, i]));
  const shiftOf = new Map(shiftTypes.map((s) => [s.id, coverShiftOf(s)]));
  const out = new Array<number>(dates.length * (1440 / intervalMinutes)).fill(0);
  for (const a of assignments) {
    const d = dayOf.get(a.date);
    const s = shiftOf.get(a.shiftTypeId);
    if (d === undefined || !s) continue;
    for (const t of shiftIntervals(d, s, intervalMinutes, dates.length, false)) out[t]++;
  }
  return out;
}

/** Service level (percent) of `people` on shift after shrinkage, or null without contacts. */
export function rosteredServiceLevel(
  r: Pick<IntervalRequirementDto, 'trafficErlangs' | 'ahtSeconds'>,
  people: number,
  targetSeconds: number,
  shrinkagePercent: number,
): number | null {
  if (r.trafficErlangs === 0) return null;
  const available = Math.floor(people * (1 - shrinkagePercent / 100) + 1e-9);
  return serviceLevel(available, r.trafficErlangs, targetSeconds, r.ahtSeconds) * 100;
}

/** People per date, shift type and skill by the ward's patients and ratios (a date row replaces its weekday's). */
export function wardPlan(
  ward: WardDemandDto,
  dates: readonly string[],
  shiftTypeIds: readonly string[],
): WardShiftRequirementDto[] {
  const known = new Set(shiftTypeIds);
  const out: WardShiftRequirementDto[] = [];
  const none = { low: 0, medium: 0, high: 0 };
  for (const date of dates) {
    const weekday = weekdayOf(date);
    for (const shiftTypeId of shiftTypeIds) {
      if (!known.has(shiftTypeId)) continue;
      const row =
        ward.patients.find((p) => p.date === date && p.shiftTypeId === shiftTypeId) ??
        ward.patients.find((p) => p.date === null && p.weekday === weekday && p.shiftTypeId === shiftTypeId);
      const patients = row?.patients ?? none;
      for (const ratio of ward.ratios) {
        const r = wardRequirement(patients, ratio);
        out.push({ date, shiftTypeId, skillId: ratio.skillId, patients, ...r });
      }
    }
  }
  return out;
}
