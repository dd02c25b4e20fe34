/**
 * Validation of a roster problem: every error in plain words, so bad input is rejected before a
 * model is built. An empty list means the problem is well formed.
 */
import { DEFAULT_WEIGHTS, type RosterProblem } from '../problem';
import { isValidTimeZone, parseDate, parseHm } from '../time';

export class InvalidProblemError extends Error {
  constructor(readonly errors: string[]) {
    super(
      `Invalid roster problem: ${errors.slice(0, 5).join('; ')}${errors.length > 5 ? ` (and ${errors.length - 5} more)` : ''}`,
    );
    this.name = 'InvalidProblemError';
  }
}

const isCount = (v: unknown) => typeof v === 'number' && Number.isInteger(v) && v >= 0;
const isNonNeg = (v: unknown) => typeof v === 'number' && Number.isFinite(v) && v >= 0;

export function validateProblem(problem: RosterProblem): string[] {
  const errors: string[] = [];
  const err = (m: string) => errors.push(m);
  try {
    parseDate(problem.startDate);
  } catch (e) {
    err(`startDate: ${(e as Error).message}`);
  }
  if (!Number.isInteger(problem.days) || problem.days < 1 || problem.days > 731) {
    err(`days must be a whole number from 1 to 731 (got ${problem.days})`);
  }
  if (!isValidTimeZone(problem.timeZone)) err(`timeZone "${problem.timeZone}" is not a known IANA time zone`);
  const D = Number.isInteger(problem.days) ? problem.days : 0;
  const dayOk = (d: number) => Number.isInteger(d) && d >= 0 && d < D;

  const shiftIds = new Set<string>();
  for (const s of problem.shiftTypes) {
    if (!s.id) err('a shift type has an empty id');
    if (shiftIds.has(s.id)) err(`shift type id "${s.id}" is used twice`);
    shiftIds.add(s.id);
    for (const k of ['start', 'end'] as const) {
      try {
        parseHm(s[k]);
      } catch (e) {
        err(`shift type "${s.id}" ${k}: ${(e as Error).message}`);
      }
    }
    if (!isNonNeg(s.paidMinutes)) err(`shift type "${s.id}": paidMinutes must be a number ≥ 0`);
  }
  const personIds = new Set<string>();
  for (const p of problem.people) {
    if (!p.id) err('a person has an empty id');
    if (personIds.has(p.id)) err(`person id "${p.id}" is used twice`);
    personIds.add(p.id);
    const c = p.contract ?? {};
    for (const [id, v] of Object.entries(c.maxShiftsPerType ?? {})) {
      if (!shiftIds.has(id)) err(`person "${p.id}": maxShiftsPerType names unknown shift type "${id}"`);
      if (!isCount(v)) err(`person "${p.id}": maxShiftsPerType.${id} must be a whole number ≥ 0`);
    }
    const counts = [
      'maxConsecutiveWorkDays',
      'minConsecutiveWorkDays',
      'minConsecutiveDaysOff',
      'maxWeekends',
      'maxConsecutiveNights',
    ] as const;
    for (const k of counts)
      if (c[k] !== undefined && !isCount(c[k])) err(`person "${p.id}": ${k} must be a whole number ≥ 0`);
    for (const k of ['minPaidMinutes', 'maxPaidMinutes', 'targetPaidMinutes', 'minRestMinutes'] as const) {
      if (c[k] !== undefined && !isNonNeg(c[k])) err(`person "${p.id}": ${k} must be a number ≥ 0`);
    }
    if (
      c.minPaidMinutes !== undefined &&
      c.maxPaidMinutes !== undefined &&
      c.minPaidMinutes > c.maxPaidMinutes
    ) {
      err(`person "${p.id}": minPaidMinutes ${c.minPaidMinutes} is above maxPaidMinutes ${c.maxPaidMinutes}`);
    }
    if (p.hourlyCost !== undefined && !isNonNeg(p.hourlyCost))
      err(`person "${p.id}": hourlyCost must be a number ≥ 0`);
    if (!Array.isArray(p.skills)) err(`person "${p.id}": skills must be a list`);
  }
  const needKeys = new Set<string>();
  problem.coverNeeds.forEach((n, i) => {
    const at = `cover need ${i} (day ${n.day}, ${n.shiftTypeId})`;
    if (!dayOk(n.day)) err(`${at}: day is outside the period 0…${D - 1}`);
    if (!shiftIds.has(n.shiftTypeId)) err(`${at}: unknown shift type`);
    if (!isCount(n.min) || !isCount(n.target)) err(`${at}: min and target must be whole numbers ≥ 0`);
    else if (n.min > n.target) err(`${at}: min ${n.min} is above target ${n.target}`);
    const key = `${n.day}|${n.shiftTypeId}|${n.skillId}`;
    if (needKeys.has(key)) err(`${at}: a need for this day, shift type and skill is given twice`);
    needKeys.add(key);
    for (const k of ['weightUnderMin', 'weightUnderTarget', 'weightOver'] as const) {
      if (n[k] !== undefined && !isNonNeg(n[k])) err(`${at}: ${k} must be a number ≥ 0`);
    }
    const wMin = n.weightUnderMin ?? problem.weights?.coverUnderMin ?? DEFAULT_WEIGHTS.coverUnderMin;
    const wTarget =
      n.weightUnderTarget ?? problem.weights?.coverUnderTarget ?? DEFAULT_WEIGHTS.coverUnderTarget;
    if (n.min > 0 && n.target > n.min && wMin < wTarget) {
      err(
        `${at}: a person short of the minimum (${wMin}) may not cost less than one short of the target (${wTarget})`,
      );
    }
  });
  problem.requests.forEach((r, i) => {
    const at = `request ${i} (${r.personId}, day ${r.day})`;
    if (!personIds.has(r.personId)) err(`${at}: unknown person`);
    if (!dayOk(r.day)) err(`${at}: day is outside the period 0…${D - 1}`);
    if (!['shiftOn', 'shiftOff', 'dayOff'].includes(r.kind)) err(`${at}: unknown kind "${r.kind}"`);
    if (r.kind !== 'dayOff' && (r.shiftTypeId === undefined || !shiftIds.has(r.shiftTypeId))) {
      err(`${at}: ${r.kind} needs a known shift type (got "${r.shiftTypeId}")`);
    }
    if (!isNonNeg(r.weight)) err(`${at}: weight must be a number ≥ 0`);
  });
  problem.absences.forEach((a, i) => {
    const at = `absence ${i} (${a.personId}, day ${a.day})`;
    if (!personIds.has(a.personId)) err(`${at}: unknown person`);
    if (!dayOk(a.day)) err(`${at}: day is outside the period 0…${D - 1}`);
    if (!['leave', 'unavailable', 'fixedDayOff'].includes(a.kind)) err(`${at}: unknown kind "${a.kind}"`);
    for (const id of a.shiftTypeIds ?? []) if (!shiftIds.has(id)) err(`${at}: unknown shift type "${id}"`);
  });
  problem.forbiddenSuccessions.forEach((f, i) => {
    if (!shiftIds.has(f.from) || !shiftIds.has(f.to))
      err(`forbidden succession ${i}: unknown shift type ("${f.from}" → "${f.to}")`);
  });
  const pinKeys = new Set<string>();
  problem.pins.forEach((p, i) => {
    const at = `pin ${i} (${p.personId}, day ${p.day})`;
    if (!personIds.has(p.personId)) err(`${at}: unknown person`);
    if (!dayOk(p.day)) err(`${at}: day is outside the period 0…${D - 1}`);
    if (p.shiftTypeId !== null && !shiftIds.has(p.shiftTypeId))
      err(`${at}: unknown shift type "${p.shiftTypeId}"`);
    const key = `${p.personId}|${p.day}`;
    if (pinKeys.has(key)) err(`${at}: the same cell is pinned twice`);
    pinKeys.add(key);
  });
  for (const [k, v] of Object.entries(problem.weights ?? {})) {
    if (!(k in DEFAULT_WEIGHTS)) err(`weights: unknown goal "${k}"`);
    else if (!isNonNeg(v)) err(`weights.${k} must be a number ≥ 0 (got ${v})`);
  }
  for (const d of problem.weekendDays ?? []) {
    if (!Number.isInteger(d) || d < 0 || d > 6) err(`weekendDays: ${d} is not a weekday number 0…6`);
  }
  for (const [id, cells] of Object.entries(problem.published ?? {})) {
    if (!personIds.has(id)) continue; // people who left since publication are ignored
    cells.forEach((c, d) => {
      if (c !== null && c !== '' && !shiftIds.has(c))
        err(`published roster: ${id} day ${d} has unknown shift type "${c}"`);
    });
  }
  return errors;
}
