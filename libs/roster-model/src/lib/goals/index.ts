/** Every soft goal, one term of the objective each. */
import type { GoalModule } from '../model/context';
import { changes } from './changes';
import { coverOver } from './cover-over';
import { coverUnderMin } from './cover-under-min';
import { coverUnderTarget } from './cover-under-target';
import { fairNights } from './fair-nights';
import { fairWeekends } from './fair-weekends';
import { hoursDeviation } from './hours-deviation';
import { labourCost } from './labour-cost';
import { requests } from './requests';

export const GOALS: readonly GoalModule[] = [
  coverUnderMin,
  coverUnderTarget,
  coverOver,
  requests,
  fairNights,
  fairWeekends,
  hoursDeviation,
  labourCost,
  changes,
];

export {
  changes,
  coverOver,
  coverUnderMin,
  coverUnderTarget,
  fairNights,
  fairWeekends,
  hoursDeviation,
  labourCost,
  requests,
};
