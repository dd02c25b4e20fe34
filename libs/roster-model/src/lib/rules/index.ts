/** Every hard rule, in the order the model builds them. */
import type { RuleModule } from '../model/context';
import { absence } from './absence';
import { forbiddenSuccession } from './forbidden-succession';
import { maxConsecutiveNights } from './max-consecutive-nights';
import { maxConsecutiveWorkDays } from './max-consecutive-work-days';
import { maxPaidMinutes } from './max-paid-minutes';
import { maxShiftsPerType } from './max-shifts-per-type';
import { maxWeekends } from './max-weekends';
import { minConsecutiveDaysOff } from './min-consecutive-days-off';
import { minConsecutiveWorkDays } from './min-consecutive-work-days';
import { minPaidMinutes } from './min-paid-minutes';
import { minRest } from './min-rest';
import { oneShiftPerDay } from './one-shift-per-day';
import { pin } from './pin';

export const RULES: readonly RuleModule[] = [
  oneShiftPerDay,
  absence,
  pin,
  minRest,
  forbiddenSuccession,
  maxShiftsPerType,
  minPaidMinutes,
  maxPaidMinutes,
  maxConsecutiveWorkDays,
  minConsecutiveWorkDays,
  minConsecutiveDaysOff,
  maxWeekends,
  maxConsecutiveNights,
];

export {
  absence,
  forbiddenSuccession,
  maxConsecutiveNights,
  maxConsecutiveWorkDays,
  maxPaidMinutes,
  maxShiftsPerType,
  maxWeekends,
  minConsecutiveDaysOff,
  minConsecutiveWorkDays,
  minPaidMinutes,
  minRest,
  oneShiftPerDay,
  pin,
};
