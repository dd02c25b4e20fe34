import type { Absence, Person } from './problem';

/**
 * Credits approved leave against contract hours, so the hours rules do not force extra shifts around
 * it: each day of leave on a weekday (Monday to Friday) lowers the period's minimum and target paid
 * minutes by a fifth of their weekly value (a day of leave counts as an average working day of a
 * five-day week: common practice). The maximum is unchanged; nothing goes below 0.
 */
export function creditLeave(people: Person[], absences: Absence[], dates: string[]): Person[] {
  const weeks = dates.length / 7;
  const leaveDays = new Map<string, number>();
  for (const a of absences) {
    if (a.kind !== 'leave' || a.shiftTypeIds) continue;
    const weekday = new Date(`${dates[a.day]}T00:00:00Z`).getUTCDay();
    if (weekday === 0 || weekday === 6) continue;
    leaveDays.set(a.personId, (leaveDays.get(a.personId) ?? 0) + 1);
  }
  if (!weeks) return people;
  return people.map((p) => {
    const n = leaveDays.get(p.id);
    if (!n) return p;
    const contract = { ...p.contract };
    const credit = (periodValue: number) =>
      Math.max(0, Math.round(periodValue - (n * periodValue) / (5 * weeks)));
    if (contract.minPaidMinutes !== undefined) contract.minPaidMinutes = credit(contract.minPaidMinutes);
    if (contract.targetPaidMinutes !== undefined)
      contract.targetPaidMinutes = credit(contract.targetPaidMinutes);
    return { ...p, contract };
  });
}
