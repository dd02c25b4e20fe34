/**
 * A generated ward for measuring the engine on wards other than the demo: by default 40 people with
 * two skills (registered nurses "rn", about 55%, and care assistants "ca"), four shift types (early,
 * late, night, long day), full- and part-time contracts within EU working-time limits, a tight
 * weekly cover pattern, some leave and unavailability, and 2-4 date requests per person.
 *
 * An invented scenario for measurement only, not a correctness source: every name, time, contract
 * and number here is made up. The seed perturbs who is part-time (and on how many hours), who works
 * no nights, the leave weeks, the weekly unavailability, the requests and about one cover target in
 * seven (±1), so tuning on a few seeds tunes for the class of ward rather than one file.
 *
 * The problem has the shape the API gives the engine (RosterInputService): contracts are weekly
 * rules scaled to the period by contractForPeriod, approved leave lowers minimum and target hours
 * (creditLeave, shared with the API), requests carry DATE_REQUEST_WEIGHT, no forbidden successions
 * (the 11 h rest rule already forbids night → early, night → late, late → early and the like) and the
 * product's default objective weights (DEFAULT_WEIGHTS, fairness of nights and weekends included).
 *
 * Every hard rule is per person and cover shortfalls are soft, so a roster without hard violations
 * exists as long as each person's line can meet their rules on their own; the contracts and the
 * leave credit keep that true. The minimum cover is below what the staff can give (weekends are
 * the tightest: with 2 weekends in 4, about half the people can work any one weekend).
 */
import { contractForPeriod, type ContractRules, DATE_REQUEST_WEIGHT, NO_RULES } from '@rotaplex/contracts';
import type {
  Absence,
  CoverNeed,
  Person,
  RosterProblem,
  ShiftRequest,
  ShiftType,
  ShiftTypeId,
  SkillId,
} from '../problem';
import { mulberry32 } from '../random';
import { creditLeave } from '../leave-credit';
import { dateOf, weekdayOf } from '../time';

export interface WardOptions {
  /** Number of people (default 40); the cover pattern scales with it. */
  people?: number;
  /** Days in the period from a Monday (default 28). */
  days?: number;
  /** Seed of the perturbations (default 1). */
  seed?: number;
}

/** A Monday with no daylight-saving change in the next 28 days. */
export const WARD_START_DATE = '2027-02-01';
export const WARD_TIME_ZONE = 'Europe/Amsterdam';

/** Invented shift times; paid minutes are the length less an unpaid break. */
export const WARD_SHIFT_TYPES: readonly ShiftType[] = [
  { id: 'E', name: 'Early', start: '07:00', end: '15:00', paidMinutes: 450 },
  { id: 'L', name: 'Late', start: '14:30', end: '22:30', paidMinutes: 450 },
  { id: 'N', name: 'Night', start: '22:00', end: '07:30', paidMinutes: 540, night: true },
  { id: 'LD', name: 'Long day', start: '07:00', end: '19:30', paidMinutes: 690 },
];

export const WARD_SKILLS = { rn: 'RN', ca: 'CA' } as const;

/** Share of registered nurses among the people. */
const RN_SHARE = 0.55;
/** Share of each skill on a part-time contract. */
const PART_TIME_SHARE = 0.35;
/** Weekly hours of a part-time contract (one is drawn per part-time person). */
const PART_TIME_HOURS = [22.5, 30];
/** Share of the cover needs whose target the seed moves by one. */
const TARGET_NUDGE_SHARE = 1 / 7;

/** EU Working Time Directive 2003/88/EC: Art. 3, 11 h daily rest; Art. 6, 48 h average week. */
const EU_MIN_REST_MINUTES = 11 * 60;
const EU_MAX_WEEK_MINUTES = 48 * 60;

/**
 * Full-time: 37.5 h contracted, at least 30 h, at most the directive's 48 h average (the period is
 * the reference period); 6 days in a row at most, days off at least two together, 2 weekends in 4,
 * 4 nights in a row.
 */
export const WARD_FULL_TIME: ContractRules = {
  ...NO_RULES,
  targetPaidMinutes: 2250,
  minPaidMinutes: 1800,
  maxPaidMinutes: EU_MAX_WEEK_MINUTES,
  maxConsecutiveWorkDays: 6,
  minConsecutiveDaysOff: 2,
  maxWeekends: 2,
  maxConsecutiveNights: 4,
  minRestMinutes: EU_MIN_REST_MINUTES,
};

/** Part-time on `hours` a week: one 7.5 h shift either side of the contracted hours; 5 days in a row, 3 nights. */
export function wardPartTime(hours: number): ContractRules {
  const target = Math.round(hours * 60);
  return {
    ...NO_RULES,
    targetPaidMinutes: target,
    minPaidMinutes: Math.max(0, target - 450),
    maxPaidMinutes: Math.min(EU_MAX_WEEK_MINUTES, target + 450),
    maxConsecutiveWorkDays: 5,
    maxWeekends: 2,
    maxConsecutiveNights: 3,
    minRestMinutes: EU_MIN_REST_MINUTES,
  };
}

type Need = [shiftTypeId: ShiftTypeId, skillId: SkillId, min: number, target: number, minFloor?: number];

/**
 * The weekly cover pattern for 40 people (min and target per shift type and skill), scaled to the
 * number of people. Weekdays need about 96% of the contracted hours at target; weekends are a little
 * lower, and nights always have at least one registered nurse (two at 40 people).
 */
const WEEKDAY: Need[] = [
  ['E', 'rn', 4, 5],
  ['L', 'rn', 3, 4],
  ['LD', 'rn', 1, 2],
  ['N', 'rn', 2, 2, 1],
  ['E', 'ca', 3, 4],
  ['L', 'ca', 2, 3],
  ['LD', 'ca', 1, 2],
  ['N', 'ca', 1, 2],
];
const WEEKEND: Need[] = [
  ['E', 'rn', 3, 4],
  ['L', 'rn', 3, 3],
  ['LD', 'rn', 1, 1],
  ['N', 'rn', 2, 2, 1],
  ['E', 'ca', 2, 3],
  ['L', 'ca', 2, 2],
  ['LD', 'ca', 1, 1],
  ['N', 'ca', 1, 1],
];

/** A random whole number in [0, n). */
function pick(rng: () => number, n: number): number {
  return Math.min(n - 1, Math.floor(rng() * n));
}

/** The first `k` of a seeded shuffle of 0…n-1. */
function sample(rng: () => number, n: number, k: number): number[] {
  const order = [...Array(n).keys()];
  for (let i = n - 1; i > 0; i--) {
    const j = pick(rng, i + 1);
    [order[i], order[j]] = [order[j], order[i]];
  }
  return order.slice(0, Math.max(0, Math.min(n, k)));
}

/** The generated ward (see the file header). Same options, same problem. */
export function generateWard({ people = 40, days = 28, seed = 1 }: WardOptions = {}): RosterProblem {
  if (!Number.isInteger(people) || people < 2)
    throw new RangeError(`people must be 2 or more, got ${people}`);
  if (!Number.isInteger(days) || days < 7) throw new RangeError(`days must be 7 or more, got ${days}`);
  const rng = mulberry32(seed);
  const base = { startDate: WARD_START_DATE };
  const isWeekend = (d: number): boolean => [0, 6].includes(weekdayOf(base, d));
  const weeks = Math.floor(days / 7);

  // People: nurses first, then care assistants; who is part-time and who works no nights by seed.
  const rnCount = Math.max(1, Math.round(people * RN_SHARE));
  const groups: { skill: SkillId; prefix: string; title: string; count: number; hourlyCost: number }[] = [
    { skill: 'rn', prefix: 'rn', title: 'Nurse', count: rnCount, hourlyCost: 24.5 },
    { skill: 'ca', prefix: 'ca', title: 'Assistant', count: people - rnCount, hourlyCost: 15.8 },
  ];
  const weekly: ContractRules[] = [];
  const staff: Omit<Person, 'contract'>[] = [];
  for (const g of groups) {
    const partTime = new Set(sample(rng, g.count, Math.round(g.count * PART_TIME_SHARE)));
    for (let i = 0; i < g.count; i++) {
      const n = String(i + 1).padStart(2, '0');
      staff.push({
        id: `${g.prefix}${n}`,
        name: `${g.title} ${n}`,
        skills: [g.skill],
        hourlyCost: g.hourlyCost,
      });
      weekly.push(
        partTime.has(i)
          ? wardPartTime(PART_TIME_HOURS[pick(rng, PART_TIME_HOURS.length)])
          : { ...WARD_FULL_TIME },
      );
    }
  }
  // About one person in thirteen works no nights (e.g. an occupational-health restriction).
  for (const p of sample(rng, people, Math.round(people / 13)))
    weekly[p] = { ...weekly[p], maxShiftsPerType: { N: 0 } };

  // Leave: about one person in ten has a week (Monday to Sunday) off, at most two of a skill in a
  // week; about one in twenty has a single day of leave (a study day) on a weekday.
  const absences: Absence[] = [];
  const onLeave = new Set<string>();
  const leave = (p: number, d: number): void => {
    const key = `${p}|${d}`;
    if (d >= days || onLeave.has(key)) return;
    onLeave.add(key);
    absences.push({ personId: staff[p].id, day: d, kind: 'leave' });
  };
  const awayInWeek = new Map<string, number>();
  const weekLeave = Math.max(1, Math.round(people / 10));
  let placed = 0;
  for (const p of sample(rng, people, people)) {
    if (placed >= weekLeave) break;
    const w = pick(rng, weeks);
    const key = `${staff[p].skills[0]}|${w}`;
    if ((awayInWeek.get(key) ?? 0) >= 2) continue;
    awayInWeek.set(key, (awayInWeek.get(key) ?? 0) + 1);
    for (let d = w * 7; d < w * 7 + 7; d++) leave(p, d);
    placed++;
  }
  for (const p of sample(rng, people, Math.round(people / 20))) {
    const weekdays = [...Array(days).keys()].filter((d) => !isWeekend(d) && !onLeave.has(`${p}|${d}`));
    if (weekdays.length) leave(p, weekdays[pick(rng, weekdays.length)]);
  }

  // Weekly unavailability (from the staff's availability): about one person in thirteen cannot start
  // at 07:00 (early and long day) on one weekday, every week.
  for (const p of sample(rng, people, Math.round(people / 13))) {
    const weekday = 1 + pick(rng, 5);
    for (let d = 0; d < days; d++) {
      if (weekdayOf(base, d) === weekday && !onLeave.has(`${p}|${d}`))
        absences.push({ personId: staff[p].id, day: d, kind: 'unavailable', shiftTypeIds: ['E', 'LD'] });
    }
  }

  // Contracts for the period, approved leave credited against the hours as the API does.
  const dates = [...Array(days).keys()].map((d) => dateOf(base, d));
  const personList: Person[] = creditLeave(
    staff.map((s, p) => ({ ...s, contract: contractForPeriod(weekly[p], days) })),
    absences,
    dates,
  );

  // Requests: 2-4 a person on days they are not on leave, at most one a day: half days off (a third
  // of those on one of two popular days, so not all can be met), a quarter shifts off, a quarter
  // shifts on (of a type the person may work).
  const requests: ShiftRequest[] = [];
  const popular = sample(rng, days, 2);
  const shiftIds = WARD_SHIFT_TYPES.map((s) => s.id);
  for (let p = 0; p < people; p++) {
    const free = [...Array(days).keys()].filter((d) => !onLeave.has(`${p}|${d}`));
    const asked = new Set<number>();
    const count = 2 + pick(rng, 3);
    for (let tries = 0; asked.size < count && tries < 50; tries++) {
      const r = rng();
      const kind = r < 0.5 ? 'dayOff' : r < 0.75 ? 'shiftOff' : 'shiftOn';
      const d =
        kind === 'dayOff' && rng() < 1 / 3
          ? popular[pick(rng, popular.length)]
          : free[pick(rng, free.length)];
      if (d === undefined || asked.has(d) || onLeave.has(`${p}|${d}`)) continue;
      asked.add(d);
      if (kind === 'dayOff') {
        requests.push({ personId: staff[p].id, day: d, kind, weight: DATE_REQUEST_WEIGHT });
        continue;
      }
      const allowed = shiftIds.filter(
        (s) => kind === 'shiftOff' || personList[p].contract.maxShiftsPerType?.[s] !== 0,
      );
      requests.push({
        personId: staff[p].id,
        day: d,
        kind,
        shiftTypeId: allowed[pick(rng, allowed.length)],
        weight: DATE_REQUEST_WEIGHT,
      });
    }
  }

  // Cover: the weekly pattern scaled to the people; about one target in seven moved by one.
  const scale = people / 40;
  const coverNeeds: CoverNeed[] = [];
  for (let d = 0; d < days; d++) {
    for (const [shiftTypeId, skillId, min0, target0, minFloor = 0] of isWeekend(d) ? WEEKEND : WEEKDAY) {
      const min = Math.max(minFloor, Math.round(min0 * scale));
      let target = Math.max(min, Math.round(target0 * scale));
      if (rng() < TARGET_NUDGE_SHARE) target = Math.max(min, target + (rng() < 0.5 ? -1 : 1));
      if (target > 0) coverNeeds.push({ day: d, shiftTypeId, skillId, min, target });
    }
  }

  return {
    startDate: WARD_START_DATE,
    days,
    timeZone: WARD_TIME_ZONE,
    shiftTypes: WARD_SHIFT_TYPES.map((s) => ({ ...s })),
    people: personList,
    coverNeeds,
    requests,
    absences,
    forbiddenSuccessions: [],
    pins: [],
    weights: {},
    skillNames: { ...WARD_SKILLS },
  };
}
