/**
 * The figures of a period's report, computed from the roster model's own problem and roster.
 *
 * Everything that the solver also scores (cover gaps, requests, hours against the contract, labour
 * cost) is read through the roster model: its ProblemIndex (paid minutes, night flags, weekends,
 * skills, the contract limits scaled to the period), its independent checker (objective terms and
 * hard-rule findings) and its request explanations (which requests are not honoured and why).
 * period-figures.spec.ts proves the totals here equal the checker's objective terms.
 */
import type {
  CoverDayReportDto,
  CoverReportRowDto,
  PersonReportDto,
  ReportTotalsDto,
  RequestNotHonouredDto,
} from '@rotaplex/contracts';
import {
  checkRoster,
  explainRequests,
  type Grid,
  ProblemIndex,
  type Roster,
  type RosterProblem,
} from '@rotaplex/roster-model';

export interface ReportSource {
  problem: RosterProblem;
  roster: Roster;
  /** dates[d] is day d of the problem ("YYYY-MM-DD"). */
  dates: string[];
  /** Shift type id → its code (e.g. "E"). */
  shiftCodes: Record<string, string>;
}

export interface PeriodFigures {
  people: PersonReportDto[];
  cover: CoverReportRowDto[];
  coverByDay: CoverDayReportDto[];
  requestsNotHonoured: RequestNotHonouredDto[];
  totals: ReportTotalsDto;
  objectiveTerms: Record<string, number>;
  objective: number;
}

/** Money to cents (half away from zero, as a till does). */
export function cents(value: number): number {
  return (Math.sign(value) * Math.round(Math.abs(value) * 100 + 1e-9)) / 100;
}

/** People counted towards a need: on its shift that day and, when it names a skill, holding it. */
export function countOnNeed(
  index: ProblemIndex,
  grid: Grid,
  need: { day: number; shiftTypeId: string; skillId: string | null },
): number {
  const s = index.shiftIndex.get(need.shiftTypeId);
  if (s === undefined) return 0;
  let n = 0;
  for (let p = 0; p < index.P; p++) {
    if (grid[p][need.day] === s && (need.skillId === null || index.skills[p].has(need.skillId))) n++;
  }
  return n;
}

/** Shortfall below the minimum, further shortfall up to the target, and surplus above the target. */
export function coverGaps(
  min: number,
  target: number,
  assigned: number,
): { shortOfMin: number; shortOfTarget: number; over: number } {
  const shortOfMin = Math.max(0, min - assigned);
  return {
    shortOfMin,
    shortOfTarget: Math.max(0, target - assigned) - shortOfMin,
    over: Math.max(0, assigned - target),
  };
}

export function periodFigures(source: ReportSource): PeriodFigures {
  const { problem, roster, dates, shiftCodes } = source;
  const index = new ProblemIndex(problem);
  const { grid } = index.toGrid(roster);
  const check = checkRoster(problem, roster, index);
  const notHonoured = explainRequests(problem, roster, index);

  const notHonouredBy = new Map<string, number>();
  for (const r of notHonoured) notHonouredBy.set(r.personId, (notHonouredBy.get(r.personId) ?? 0) + 1);
  const requestsBy = new Map<string, number>();
  for (const r of problem.requests) {
    if (r.day < 0 || r.day >= index.D || !index.personIndex.has(r.personId)) continue;
    requestsBy.set(r.personId, (requestsBy.get(r.personId) ?? 0) + 1);
  }

  let unroundedCost = 0;
  const people = problem.people.map((person, p): PersonReportDto => {
    const row = grid[p];
    const worked = row.filter((s) => s >= 0);
    const paidMinutes = worked.reduce((sum, s) => sum + index.paid[s], 0);
    const weekends = index.weekends.filter((days) => days.some((d) => row[d] >= 0));
    const rate = person.hourlyCost ?? null;
    const cost = rate === null ? null : (rate * paidMinutes) / 60;
    if (cost !== null) unroundedCost += cost;
    const target = person.contract.targetPaidMinutes ?? null;
    const requests = requestsBy.get(person.id) ?? 0;
    return {
      staffMemberId: person.id,
      name: person.name,
      shifts: worked.length,
      paidMinutes,
      minPaidMinutes: person.contract.minPaidMinutes ?? null,
      maxPaidMinutes: person.contract.maxPaidMinutes ?? null,
      targetPaidMinutes: target,
      deviationMinutes: target === null ? null : paidMinutes - target,
      nights: worked.filter((s) => index.night[s]).length,
      weekendsWorked: weekends.length,
      weekendDaysWorked: index.weekends.flat().filter((d) => row[d] >= 0).length,
      hourlyCost: rate,
      labourCost: cost === null ? null : cents(cost),
      requests,
      requestsHonoured: requests - (notHonouredBy.get(person.id) ?? 0),
    };
  });

  const cover = problem.coverNeeds
    .filter((n) => n.day >= 0 && n.day < index.D && index.shiftIndex.has(n.shiftTypeId))
    .map((need): CoverReportRowDto => {
      const assigned = countOnNeed(index, grid, need);
      return {
        date: dates[need.day],
        shiftTypeId: need.shiftTypeId,
        shiftCode: shiftCodes[need.shiftTypeId] ?? need.shiftTypeId,
        skillId: need.skillId,
        skillCode: need.skillId === null ? null : (problem.skillNames?.[need.skillId] ?? need.skillId),
        min: need.min,
        target: need.target,
        assigned,
        ...coverGaps(need.min, need.target, assigned),
      };
    })
    .sort((a, b) => a.date.localeCompare(b.date) || a.shiftCode.localeCompare(b.shiftCode));

  const coverByDay = dates.map((date): CoverDayReportDto => {
    const rows = cover.filter((c) => c.date === date);
    return {
      date,
      needs: rows.length,
      needsMetMin: rows.filter((c) => c.shortOfMin === 0).length,
      needsMetTarget: rows.filter((c) => c.shortOfMin === 0 && c.shortOfTarget === 0).length,
      shortOfMin: sum(rows.map((c) => c.shortOfMin)),
      shortOfTarget: sum(rows.map((c) => c.shortOfTarget)),
      over: sum(rows.map((c) => c.over)),
    };
  });

  const nameOf = new Map(problem.people.map((p) => [p.id, p.name]));
  const requestsNotHonoured = notHonoured.map((r): RequestNotHonouredDto => ({
    staffMemberId: r.personId,
    name: nameOf.get(r.personId) ?? r.personId,
    date: dates[r.day],
    kind: r.kind,
    reasons: r.reasons.map((text) => withDatesAndCodes(text, dates, shiftCodes)),
  }));

  const totals: ReportTotalsDto = {
    people: people.length,
    shifts: sum(people.map((p) => p.shifts)),
    paidMinutes: sum(people.map((p) => p.paidMinutes)),
    nights: sum(people.map((p) => p.nights)),
    weekendDaysWorked: sum(people.map((p) => p.weekendDaysWorked)),
    labourCost: cents(unroundedCost),
    peopleWithoutCost: people.filter((p) => p.hourlyCost === null).length,
    needs: cover.length,
    needsMetMin: sum(coverByDay.map((d) => d.needsMetMin)),
    needsMetTarget: sum(coverByDay.map((d) => d.needsMetTarget)),
    shortOfMin: sum(cover.map((c) => c.shortOfMin)),
    shortOfTarget: sum(cover.map((c) => c.shortOfTarget)),
    over: sum(cover.map((c) => c.over)),
    requests: sum([...requestsBy.values()]),
    requestsHonoured: sum(people.map((p) => p.requestsHonoured)),
    violations: check.violations.length,
  };

  return {
    people,
    cover,
    coverByDay,
    requestsNotHonoured,
    totals,
    objectiveTerms: { ...check.terms },
    objective: check.objective,
  };
}

function sum(values: number[]): number {
  return values.reduce((a, b) => a + b, 0);
}

/** The explanations speak of "day 3" and shift ids; a report shows dates and shift codes. */
function withDatesAndCodes(text: string, dates: string[], shiftCodes: Record<string, string>): string {
  let out = text.replace(/\bday (\d+)\b/g, (all, d: string) => dates[Number(d)] ?? all);
  for (const [id, code] of Object.entries(shiftCodes)) {
    const escaped = id.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
    out = out.replace(new RegExp(`(?<![\\w-])${escaped}(?![\\w-])`, 'g'), code);
  }
  return out;
}
