import { isNightByTimes, minutesOfDay, shiftLengthMinutes, TIME_OF_DAY_PATTERN } from '@rotaplex/contracts';

/** "7 h 30 min", "8 h", "45 min". */
export function formatMinutes(minutes: number): string {
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  if (h === 0) return `${m} min`;
  return m === 0 ? `${h} h` : `${h} h ${m} min`;
}

export interface ShiftTimesSummary {
  lengthMinutes: number;
  crossesMidnight: boolean;
  /** Night by its times (EU Working Time Directive 2003/88/EC, Art. 2; see isNightByTimes). */
  nightByTimes: boolean;
}

/** What the form shows under the times; null while either time is not a valid "HH:mm". */
export function summariseShiftTimes(start: string, end: string): ShiftTimesSummary | null {
  if (!TIME_OF_DAY_PATTERN.test(start) || !TIME_OF_DAY_PATTERN.test(end)) return null;
  return {
    lengthMinutes: shiftLengthMinutes(start, end),
    crossesMidnight: minutesOfDay(end) <= minutesOfDay(start),
    nightByTimes: isNightByTimes(start, end),
  };
}

/** Field errors of a shift type form, worded for people; the server checks the same and more. */
export function shiftTypeFormErrors(values: {
  code: string;
  name: string;
  start: string;
  end: string;
  paidMinutes: string;
}): Partial<Record<'code' | 'name' | 'start' | 'end' | 'paidMinutes', string>> {
  const errors: Partial<Record<'code' | 'name' | 'start' | 'end' | 'paidMinutes', string>> = {};
  if (!/^[A-Z0-9]{1,4}$/.test(values.code.trim().toUpperCase()))
    errors.code = 'Use 1 to 4 letters or digits, for example E, L or N.';
  if (!values.name.trim()) errors.name = 'Give the shift type a name.';
  if (!TIME_OF_DAY_PATTERN.test(values.start)) errors.start = 'Enter a time as HH:mm, for example 07:00.';
  if (!TIME_OF_DAY_PATTERN.test(values.end)) errors.end = 'Enter a time as HH:mm, for example 15:00.';
  const paid = Number(values.paidMinutes);
  if (values.paidMinutes.trim() === '' || !Number.isInteger(paid) || paid < 0) {
    errors.paidMinutes = 'Enter whole minutes, 0 or more.';
  } else if (!errors.start && !errors.end && values.start !== values.end) {
    const length = shiftLengthMinutes(values.start, values.end);
    if (paid > length)
      errors.paidMinutes = `Paid time cannot be longer than the shift (${formatMinutes(length)}).`;
  }
  return errors;
}
