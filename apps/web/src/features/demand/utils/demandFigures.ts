import type {
  AcceptedCoverRowDto,
  ContactIntervalDto,
  ContactWeekdayDto,
  CoverNeedsDto,
  DemandPlanDto,
  DemandIntervalMinutes,
} from '@rotaplex/contracts';

/** Weekdays in the order a European week reads (Monday first), numbered as the API does (0 = Sunday). */
export const WEEK_ORDER = [1, 2, 3, 4, 5, 6, 0] as const;
export const WEEKDAY_SHORT = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'] as const;

const pad = (n: number) => String(n).padStart(2, '0');
export const minutesToTime = (m: number) => `${pad(Math.floor(m / 60))}:${pad(m % 60)}`;
export const timeToMinutes = (t: string) => Number(t.slice(0, 2)) * 60 + Number(t.slice(3, 5));

/** The interval starts of a whole day ("00:00", "00:30", …). */
export function dayStarts(intervalMinutes: number): string[] {
  return Array.from({ length: (24 * 60) / intervalMinutes }, (_, i) => minutesToTime(i * intervalMinutes));
}

/** Weekday of a "YYYY-MM-DD" date (0 = Sunday), independent of the browser's time zone. */
export const weekdayOf = (date: string) => new Date(`${date}T00:00:00Z`).getUTCDay();

/**
 * Moves one day's intervals to another interval length. Coarser: contacts of the intervals inside
 * the new one are added up and AHT is their contact-weighted mean. Finer: an interval's contacts
 * are shared evenly among its parts with the same AHT. Total contacts and total workload
 * (contacts x AHT) stay the same either way.
 */
export function rebucket(
  intervals: readonly ContactIntervalDto[],
  to: DemandIntervalMinutes,
  from: DemandIntervalMinutes,
): ContactIntervalDto[] {
  if (to === from) return intervals.map((i) => ({ ...i }));
  const out = new Map<number, { contacts: number; work: number }>();
  for (const i of intervals) {
    const start = timeToMinutes(i.start);
    if (to > from) {
      const key = Math.floor(start / to) * to;
      const acc = out.get(key) ?? { contacts: 0, work: 0 };
      acc.contacts += i.contacts;
      acc.work += i.contacts * i.ahtSeconds;
      out.set(key, acc);
    } else {
      const parts = from / to;
      for (let p = 0; p < parts; p++) {
        const c = i.contacts / parts;
        out.set(start + p * to, { contacts: c, work: c * i.ahtSeconds });
      }
    }
  }
  return [...out.entries()]
    .sort(([a], [b]) => a - b)
    .filter(([, v]) => v.contacts > 0)
    .map(([start, v]) => ({
      start: minutesToTime(start),
      contacts: Math.round(v.contacts * 100) / 100,
      ahtSeconds: Math.round(v.work / v.contacts),
    }));
}

/** The week pattern with every weekday present (missing weekdays as empty days), Monday first. */
export function fullWeek(pattern: readonly ContactWeekdayDto[]): ContactWeekdayDto[] {
  return WEEK_ORDER.map((weekday) => ({
    weekday,
    intervals: pattern.find((d) => d.weekday === weekday)?.intervals.map((i) => ({ ...i })) ?? [],
  }));
}

/** "HH:mm" of the first and last interval with contacts over the week, or null for an empty week. */
export function busyRange(pattern: readonly ContactWeekdayDto[]): [string, string] | null {
  const starts = pattern.flatMap((d) => d.intervals.filter((i) => i.contacts > 0).map((i) => i.start)).sort();
  return starts.length ? [starts[0], starts[starts.length - 1]] : null;
}

// ---------------------------------------------------------------- the plan

type ContactPlan = NonNullable<DemandPlanDto['contactCentre']>;

/** One point of the interval charts. */
export interface IntervalPoint {
  /** "YYYY-MM-DDTHH:mm". */
  start: string;
  /** Axis label: "08:30" for a day, "Mon 08:30" over a week. */
  label: string;
  contacts: number;
  /** Agents on contacts (Erlang C). */
  agents: number;
  /** Agents to schedule after shrinkage: the requirement. */
  required: number;
  /** People the covering plan puts on shift. */
  planned: number;
  rostered: number;
  /** Service level of the rostered people, percent (null without contacts). */
  serviceLevel: number | null;
}

/** The plan's intervals of the given dates, as chart points. */
export function intervalPoints(
  plan: ContactPlan,
  dates: readonly string[],
  withDay: boolean,
): IntervalPoint[] {
  const wanted = new Set(dates);
  return plan.requirement.flatMap((r, t) => {
    const date = r.start.slice(0, 10);
    if (!wanted.has(date)) return [];
    const c = plan.cover[t];
    const time = r.start.slice(11, 16);
    return [
      {
        start: r.start,
        label: withDay ? `${WEEKDAY_SHORT[weekdayOf(date)]} ${time}` : time,
        contacts: r.contacts,
        agents: r.agents,
        required: r.scheduled,
        planned: c?.planned ?? 0,
        rostered: c?.rostered ?? 0,
        serviceLevel: c?.rosteredServiceLevelPercent ?? null,
      },
    ];
  });
}

/** Trims the quiet hours at both ends of a day (keeps one interval either side of the busy part). */
export function busyPart(points: readonly IntervalPoint[]): IntervalPoint[] {
  const busy = (p: IntervalPoint) => p.contacts > 0 || p.required > 0 || p.rostered > 0 || p.planned > 0;
  const first = points.findIndex(busy);
  if (first < 0) return [];
  let last = points.length - 1;
  while (!busy(points[last])) last--;
  return points.slice(Math.max(0, first - 1), Math.min(points.length, last + 2));
}

/** Intervals where the rostered people are fewer than the requirement, and the people missing. */
export function rosteredShortfall(points: readonly IntervalPoint[]): { intervals: number; people: number } {
  let intervals = 0;
  let people = 0;
  for (const p of points) {
    if (p.rostered < p.required) {
      intervals++;
      people += p.required - p.rostered;
    }
  }
  return { intervals, people };
}

/** The rows the accept step sends, built from the plan as docs/demand.md says. */
export function acceptRows(plan: DemandPlanDto): AcceptedCoverRowDto[] {
  const rows: AcceptedCoverRowDto[] = [];
  const cc = plan.contactCentre;
  if (cc)
    for (const s of cc.starts)
      rows.push({
        date: s.date,
        shiftTypeId: s.shiftTypeId,
        skillId: cc.skillId,
        min: s.minimum,
        target: s.people,
      });
  for (const r of plan.ward?.requirement ?? [])
    rows.push({
      date: r.date,
      shiftTypeId: r.shiftTypeId,
      skillId: r.skillId,
      min: r.required,
      target: r.required,
    });
  return rows;
}

/** A cover need before and after accepting (before is null when nothing was set for that shift and skill). */
export interface CoverChange {
  row: AcceptedCoverRowDto;
  before: { min: number; target: number } | null;
}

/**
 * What each accepted row replaces: the date override with the same date, shift type and skill, or
 * else the weekly pattern's row of that weekday (the need that applied until now).
 */
export function coverChanges(rows: readonly AcceptedCoverRowDto[], needs: CoverNeedsDto): CoverChange[] {
  return rows.map((row) => {
    const same = (n: { shiftTypeId: string; skillId: string | null }) =>
      n.shiftTypeId === row.shiftTypeId && n.skillId === row.skillId;
    const override = needs.overrides.find((o) => o.date === row.date && same(o));
    const pattern = needs.pattern.find((p) => p.weekday === weekdayOf(row.date) && same(p));
    const before = override ?? pattern;
    return { row, before: before ? { min: before.min, target: before.target } : null };
  });
}

/** True when the row sets what was there already. */
export const unchanged = (c: CoverChange) =>
  c.before !== null && c.before.min === c.row.min && c.before.target === c.row.target;

/** Under-cover in words, for people who would rather read than count person-intervals. */
export function underCoverWords(plan: ContactPlan): string {
  const outside = plan.outsideShiftsPersonIntervals;
  const capped = plan.underCoverPersonIntervals - outside;
  const hours = (n: number) => {
    const h = (n * plan.intervalMinutes) / 60;
    return `${Number.isInteger(h) ? h : h.toFixed(1)} person-hour${h === 1 ? '' : 's'}`;
  };
  const parts: string[] = [];
  if (capped > 0) parts.push(`the cap on people per day leaves ${hours(capped)} below the requirement`);
  if (outside > 0) parts.push(`${hours(outside)} of requirement fall outside every allowed shift's hours`);
  if (!parts.length) return 'The plan covers every interval\u2019s requirement.';
  const text = parts.join('; ');
  return `${text[0].toUpperCase()}${text.slice(1)}.`;
}

/** "YYYY-MM-DD" plus n days. */
export function addDays(date: string, n: number): string {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + n);
  return d.toISOString().slice(0, 10);
}
