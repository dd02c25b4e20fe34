/**
 * Guard rails on settings and roster edits: limits beyond the working-time presets, shift types
 * longer than 12 hours, a minimum cover lowered to 0, and the words of each caution. The API adds
 * these cautions to its answers and the web app shows them before a save; neither refuses the
 * setting (local law and agreements may allow it), except where noted.
 */
import { CONTRACT_PRESETS, type ContractRules, shiftLengthMinutes } from './planning';

/** Closes every guard-rail caution: the product's limits are common ones, not the law of any place. */
export const GUARD_RAIL_DEFERRAL =
  'Local law, collective agreements and professional staffing standards decide what is allowed; this is ' +
  'not legal advice. Check it with the person responsible before you rely on it.';

/**
 * The loosest limits of the working-time presets (CONTRACT_PRESETS): a contract beyond any of them
 * is outside the presets. From the EU Working Time Directive 2003/88/EC (Art. 3 daily rest, Art. 5
 * weekly rest, Art. 6 average week) as PRODUCT.md "Trade facts" gives them.
 */
export const PRESET_LIMITS = {
  /** Least daily rest of any preset, minutes (11 h). */
  minRestMinutes: Math.min(...CONTRACT_PRESETS.map((p) => p.rules.minRestMinutes ?? Infinity)),
  /** Most paid minutes a week of any preset (48 h). */
  maxPaidMinutes: Math.max(...CONTRACT_PRESETS.map((p) => p.rules.maxPaidMinutes ?? 0)),
  /** Most working days in a row of any preset (6). */
  maxConsecutiveWorkDays: Math.max(...CONTRACT_PRESETS.map((p) => p.rules.maxConsecutiveWorkDays ?? 0)),
} as const;

/** Shift types longer than this (12 hours) carry a caution. */
export const LONG_SHIFT_MINUTES = 12 * 60;

/** "11 h", "9 h 30 min", "30 min". */
export function hoursAndMinutes(minutes: number): string {
  const m = Math.round(Math.abs(minutes));
  const h = Math.floor(m / 60);
  const r = m % 60;
  if (h === 0) return `${r} min`;
  return r ? `${h} h ${r} min` : `${h} h`;
}

/**
 * Cautions for a contract's rules beyond the working-time presets, each naming the risk; empty when
 * the contract keeps within them. A missing limit is beyond them too.
 */
export function contractCautions(rules: Pick<ContractRules, keyof typeof PRESET_LIMITS>): string[] {
  const out: string[] = [];
  const rest = rules.minRestMinutes;
  if (rest === null) {
    out.push(
      `No minimum rest between shifts: the presets keep at least ${hoursAndMinutes(PRESET_LIMITS.minRestMinutes)}. ` +
        'Short rest between shifts raises the risk of fatigue and mistakes.',
    );
  } else if (rest < PRESET_LIMITS.minRestMinutes) {
    out.push(
      `Rest between shifts of ${hoursAndMinutes(rest)} is less than the ${hoursAndMinutes(PRESET_LIMITS.minRestMinutes)} ` +
        'of the presets. Short rest between shifts raises the risk of fatigue and mistakes.',
    );
  }
  const week = rules.maxPaidMinutes;
  if (week === null) {
    out.push(
      `No limit on paid hours a week: the presets allow at most ${hoursAndMinutes(PRESET_LIMITS.maxPaidMinutes)}. ` +
        'Long working weeks raise the risk of fatigue and ill health.',
    );
  } else if (week > PRESET_LIMITS.maxPaidMinutes) {
    out.push(
      `Up to ${hoursAndMinutes(week)} a week is more than the ${hoursAndMinutes(PRESET_LIMITS.maxPaidMinutes)} ` +
        'of the presets. Long working weeks raise the risk of fatigue and ill health.',
    );
  }
  const run = rules.maxConsecutiveWorkDays;
  if (run === null) {
    out.push(
      `No limit on working days in a row: the presets allow at most ${PRESET_LIMITS.maxConsecutiveWorkDays}, ` +
        'so that each week has a full day of rest. Long runs without a day off raise the risk of fatigue.',
    );
  } else if (run > PRESET_LIMITS.maxConsecutiveWorkDays) {
    out.push(
      `Up to ${run} working days in a row is more than the ${PRESET_LIMITS.maxConsecutiveWorkDays} of the presets, ` +
        'which keep a full day of rest each week. Long runs without a day off raise the risk of fatigue.',
    );
  }
  return out;
}

/** Whether a contract keeps within the working-time presets. */
export function withinPresets(rules: Pick<ContractRules, keyof typeof PRESET_LIMITS>): boolean {
  return contractCautions(rules).length === 0;
}

/** The caution for a shift type longer than 12 hours, or none. */
export function shiftTypeCautions(shift: { start: string; end: string }): string[] {
  const length = shiftLengthMinutes(shift.start, shift.end);
  if (length <= LONG_SHIFT_MINUTES) return [];
  return [
    `This shift lasts ${hoursAndMinutes(length)}, more than ${hoursAndMinutes(LONG_SHIFT_MINUTES)}. ` +
      'Long shifts raise the risk of fatigue and mistakes, most of all at night and when worked in a row.',
  ];
}

/** One cover need as the guard rail compares them. */
export interface CoverMinimumRow {
  shiftTypeId: string;
  skillId: string | null;
  min: number;
  /** Weekday 0-6 of a pattern row, or the date of an override. */
  day: number | string;
}

/**
 * Cautions for needs whose minimum was above 0 and is now 0 (or whose row is gone): a shift that had
 * a safe-staffing floor no longer has one. `label` words a need for the manager.
 */
export function loweredToZeroCautions(
  before: readonly CoverMinimumRow[],
  after: readonly CoverMinimumRow[],
  label: (row: CoverMinimumRow) => string,
): string[] {
  const key = (r: CoverMinimumRow) => `${r.day}|${r.shiftTypeId}|${r.skillId ?? ''}`;
  const now = new Map(after.map((r) => [key(r), r.min]));
  const out: string[] = [];
  for (const r of before) {
    if (r.min <= 0) continue;
    const min = now.get(key(r)) ?? 0;
    if (min > 0) continue;
    out.push(
      `${label(r)} had a minimum of ${r.min} and now has none: nobody is required on it, so it may be ` +
        'published with no one there. Check the safe staffing level for this shift.',
    );
  }
  return out;
}
