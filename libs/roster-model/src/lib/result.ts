/** What a solve and the independent checker report about a roster. */
import type { PersonId, Roster, ShiftTypeId } from './problem';

/** Names of the hard rules; each is one module under rules/. */
export type HardRuleName =
  | 'oneShiftPerDay'
  | 'absence'
  | 'pin'
  | 'minRest'
  | 'forbiddenSuccession'
  | 'maxShiftsPerType'
  | 'minPaidMinutes'
  | 'maxPaidMinutes'
  | 'maxConsecutiveWorkDays'
  | 'minConsecutiveWorkDays'
  | 'minConsecutiveDaysOff'
  | 'maxWeekends'
  | 'maxConsecutiveNights'
  | 'unknownShiftType';

/** Names of the soft goals; each is one module under goals/ and one term of the objective. */
export type ObjectiveTermName =
  | 'coverUnderMin'
  | 'coverUnderTarget'
  | 'coverOver'
  | 'requests'
  | 'fairNights'
  | 'fairWeekends'
  | 'hoursDeviation'
  | 'labourCost'
  | 'changes';

export interface Violation {
  rule: HardRuleName;
  personId: PersonId;
  /** Days involved (first day of a run, the two days of a succession, …). */
  days: number[];
  /** How far past the limit, in the rule's own unit (days, shifts, minutes, weekends); for ranking and search. */
  amount?: number;
  /** Plain words for a manager, e.g. "Ada Byrne: 7 working days in a row from day 3 (at most 6)". */
  message: string;
}

export type ObjectiveBreakdown = Record<ObjectiveTermName, number>;

export interface CheckResult {
  violations: Violation[];
  /** Weighted value of each soft goal. */
  terms: ObjectiveBreakdown;
  /** Sum of the terms. */
  objective: number;
}

export type SolveStatus = 'optimal' | 'feasible' | 'infeasible' | 'timeLimit' | 'interrupted' | 'error';

export interface SolveProgress {
  elapsedSeconds: number;
  /** Best objective found so far (null before the first roster). */
  objective: number | null;
  /** Proven lower bound (null before the solver has one). */
  bound: number | null;
  /** Relative gap (0.012 = 1.2%), null when unknown. */
  gap: number | null;
}

export interface UnmetNeedExplanation {
  day: number;
  shiftTypeId: ShiftTypeId;
  skillId: string | null;
  short: number;
  /** Plain-words reasons, e.g. "2 of the 5 people with skill RN are on leave". */
  reasons: string[];
}

export interface RequestExplanation {
  personId: PersonId;
  day: number;
  kind: string;
  reasons: string[];
}

export interface ConflictExplanation {
  /** Rule names (rows of the irreducible infeasible subsystem) in plain words. */
  rules: string[];
  summary: string;
}

/** How far a roster falls below minimum cover, and whether any roster could do better (safety/staffing.ts). */
export interface StaffingSafety {
  /** People short of a need's minimum, summed over the needs. */
  peopleShort: number;
  /** Shifts (day and shift type) with any need below its minimum. */
  shiftsShort: number;
  /** Needs with a required skill that have nobody with it. */
  noneOfSkill: number;
  /** Fewest people short any roster can have with these people, leave and rules; null when unknown. */
  fewestPossible: number | null;
  /** Whether fewestPossible is proved (a roster with that many exists and none can have fewer). */
  proven: boolean;
}

export interface SolveResult {
  status: SolveStatus;
  roster: Roster | null;
  objective: number | null;
  bound: number | null;
  gap: number | null;
  seconds: number;
  /** Seconds until the final objective was first reached. */
  secondsToBest: number | null;
  check: CheckResult | null;
  /** One-sentence quality statement for a manager. */
  quality: string;
  unmetNeeds: UnmetNeedExplanation[];
  requestsNotHonoured: RequestExplanation[];
  conflicts: ConflictExplanation | null;
  /** Shortfall below minimum cover and the fewest possible (with explanations; null without a roster). */
  staffing?: StaffingSafety | null;
  /** The staffing safety in plain words with the usual advice ('' when nothing is below minimum). */
  staffingStatement?: string;
}
