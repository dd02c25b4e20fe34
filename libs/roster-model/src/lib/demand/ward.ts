/**
 * Ward staffing from patients: for each skill, people = ceil(sum over acuity levels of
 * patients / patients-per-person), never below the skill's floor per shift.
 *
 * A ratio 1:n means one person cares for at most n patients at once, so with a mix of levels each
 * patient takes 1/n_level of a person; the sum is rounded up to whole people. The floor is a trade
 * minimum (e.g. never fewer than 2 registered nurses on a shift). Both are floors set by local law
 * and professional standards, not targets the product chooses.
 */
import { ACUITY_LEVELS, type AcuityMixDto } from '@rotaplex/contracts';

export interface WardRatio {
  /** Patients one person cares for, per acuity level (each > 0). */
  patientsPerStaff: AcuityMixDto;
  /** People with the skill on every shift whatever the patients. */
  minimumPerShift: number;
}

export interface WardSkillRequirement {
  byRatio: number;
  floor: number;
  required: number;
}

/** People of one skill needed for one shift's patients. */
export function wardRequirement(patients: AcuityMixDto, ratio: WardRatio): WardSkillRequirement {
  let load = 0;
  for (const level of ACUITY_LEVELS) {
    const count = patients[level];
    const perStaff = ratio.patientsPerStaff[level];
    if (!(count >= 0)) throw new RangeError(`patients (${level}) must be at least 0, got ${count}`);
    if (!(perStaff > 0))
      throw new RangeError(`patients per person (${level}) must be above 0, got ${perStaff}`);
    load += count / perStaff;
  }
  // 10 / 5 is exactly 2, but 0.1 + 0.2-style sums can land a hair above a whole number.
  const near = Math.round(load);
  const byRatio = Math.abs(load - near) < 1e-9 ? near : Math.ceil(load);
  const floor = ratio.minimumPerShift;
  return { byRatio, floor, required: Math.max(byRatio, floor) };
}
