/** Plain words shared by the explanations: dates, names, rules and goals. */
import type { RosterProblem } from '../problem';
import type { HardRuleName, ObjectiveTermName } from '../result';

const WEEKDAY = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];
const MONTH = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** "Tue 3 Mar" for day index `day` of the period (calendar arithmetic on the start date). */
export function dayLabel(problem: RosterProblem, day: number): string {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(problem.startDate);
  if (!m) return `day ${day + 1}`;
  const date = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]) + day));
  return `${WEEKDAY[date.getUTCDay()]} ${date.getUTCDate()} ${MONTH[date.getUTCMonth()]}`;
}

export function personName(problem: RosterProblem, personId: string | undefined): string {
  if (personId === undefined) return 'someone';
  const person = problem.people.find((p) => p.id === personId);
  return person?.name || personId;
}

export function shiftName(problem: RosterProblem, shiftTypeId: string | undefined): string {
  if (shiftTypeId === undefined) return 'a shift';
  const shift = problem.shiftTypes.find((s) => s.id === shiftTypeId);
  return shift?.name || shiftTypeId;
}

/** Up to three names, then "and N more". */
export function nameList(names: string[]): string {
  if (names.length <= 3) return names.join(', ');
  return `${names.slice(0, 3).join(', ')} and ${names.length - 3} more`;
}

export function plural(count: number, one: string, many: string): string {
  return count === 1 ? one : many;
}

/** What adding one more shift would break, as a verb phrase after "would …" / "N people would …". */
export const RULE_BLOCK_WORDS: Record<HardRuleName, string> = {
  oneShiftPerDay: 'already work another shift that day',
  absence: 'be absent',
  pin: 'break a pinned cell',
  minRest: 'get too little rest next to a shift the day before or after',
  forbiddenSuccession: 'break a forbidden shift sequence with the day before or after',
  maxShiftsPerType: 'go over their contract’s limit for this shift type',
  minPaidMinutes: 'fall below their minimum paid hours',
  maxPaidMinutes: 'go over their maximum paid hours',
  maxConsecutiveWorkDays: 'work too many days in a row',
  minConsecutiveWorkDays: 'work a run of days shorter than their minimum',
  minConsecutiveDaysOff: 'cut a run of days off below their minimum',
  maxWeekends: 'work more weekends than their contract allows',
  maxConsecutiveNights: 'work too many nights in a row',
  unknownShiftType: 'have an unknown shift type',
};

/** What a soft goal stands for, as a noun phrase ("… costs more in: cover elsewhere, …"). */
export const GOAL_WORDS: Record<ObjectiveTermName, string> = {
  coverUnderMin: 'minimum cover of another shift',
  coverUnderTarget: 'target cover of another shift',
  coverOver: 'overstaffing',
  requests: 'staff requests',
  fairNights: 'a fair spread of nights',
  fairWeekends: 'a fair spread of weekends',
  hoursDeviation: 'hours against contract',
  labourCost: 'labour cost',
  changes: 'changes to the published roster',
};

export function hours(minutes: number): string {
  const h = minutes / 60;
  return `${Number.isInteger(h) ? h : h.toFixed(1)} h`;
}
