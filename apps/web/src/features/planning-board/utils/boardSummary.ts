import {
  contractForPeriod,
  type AssignmentGridDto,
  type ContractDto,
  type CoverNeedsDto,
  type ShiftTypeDto,
  type SkillDto,
  type StaffMemberDto,
} from '@rotaplex/contracts';

export interface CoverNeed {
  min: number;
  target: number;
}

export interface CoverLine {
  shiftType: ShiftTypeDto;
  /** Skill the counted people must have, or null for anyone on the shift. */
  skill: SkillDto | null;
  /** One entry per date: people on the shift (with the skill) and the need, if any. */
  days: { count: number; need: CoverNeed | null }[];
}

export type CoverState = 'short' | 'belowTarget' | 'met' | 'over' | 'none';

/** Short: below the minimum; below target; met: at the target; over: above the target; none: no need set. */
export function coverState(count: number, need: CoverNeed | null): CoverState {
  if (!need) return 'none';
  if (count < need.min) return 'short';
  if (count < need.target) return 'belowTarget';
  if (count > need.target) return 'over';
  return 'met';
}

/** The need for one date: a date override replaces the weekly pattern's row (weekday 0 = Sunday). */
export function needFor(
  needs: CoverNeedsDto,
  date: string,
  shiftTypeId: string,
  skillId: string | null,
): CoverNeed | null {
  const override = needs.overrides.find(
    (o) => o.date === date && o.shiftTypeId === shiftTypeId && o.skillId === skillId,
  );
  if (override) return { min: override.min, target: override.target };
  const weekday = new Date(`${date}T00:00:00Z`).getUTCDay();
  const row = needs.pattern.find(
    (p) => p.weekday === weekday && p.shiftTypeId === shiftTypeId && p.skillId === skillId,
  );
  return row ? { min: row.min, target: row.target } : null;
}

/** Cover lines: one per shift type (anyone) and one per (shift type, skill) that has a need. */
export function coverLines(
  grid: AssignmentGridDto,
  shiftTypes: ShiftTypeDto[],
  needs: CoverNeedsDto,
  skills: SkillDto[],
  staff: Map<string, StaffMemberDto>,
): CoverLine[] {
  const lines: CoverLine[] = [];
  const skillIdsWithNeeds = new Set(
    [...needs.pattern, ...needs.overrides].map((n) => n.skillId).filter((s): s is string => s !== null),
  );
  for (const shiftType of shiftTypes) {
    const skillOptions: (SkillDto | null)[] = [
      null,
      ...skills.filter(
        (s) =>
          skillIdsWithNeeds.has(s.id) &&
          [...needs.pattern, ...needs.overrides].some(
            (n) => n.shiftTypeId === shiftType.id && n.skillId === s.id,
          ),
      ),
    ];
    for (const skill of skillOptions) {
      lines.push({
        shiftType,
        skill,
        days: grid.dates.map((date, d) => ({
          count: grid.rows.filter(
            (r) =>
              r.cells[d]?.shiftTypeId === shiftType.id &&
              (skill === null || (staff.get(r.staffMemberId)?.skills ?? []).includes(skill.code)),
          ).length,
          need: needFor(needs, date, shiftType.id, skill?.id ?? null),
        })),
      });
    }
  }
  return lines;
}

export interface HoursLine {
  paidMinutes: number;
  min: number | null;
  target: number | null;
  max: number | null;
  /** In words: under, over or within the contract. */
  state: 'under' | 'over' | 'within' | 'noContract';
}

/** Paid minutes of one row against the contract's limits for a period of `days` days. */
export function hoursAgainstContract(
  cells: { shiftTypeId: string | null }[],
  shiftTypes: Map<string, ShiftTypeDto>,
  contract: ContractDto | undefined,
  days: number,
): HoursLine {
  const paidMinutes = cells.reduce(
    (sum, c) => sum + (c.shiftTypeId ? (shiftTypes.get(c.shiftTypeId)?.paidMinutes ?? 0) : 0),
    0,
  );
  if (!contract) return { paidMinutes, min: null, target: null, max: null, state: 'noContract' };
  const rules = contractForPeriod(contract, days);
  const min = rules.minPaidMinutes ?? null;
  const max = rules.maxPaidMinutes ?? null;
  const target = rules.targetPaidMinutes ?? null;
  const state =
    min !== null && paidMinutes < min ? 'under' : max !== null && paidMinutes > max ? 'over' : 'within';
  return { paidMinutes, min, target, max, state };
}

/** "37 h 30 min" from minutes. */
export function hoursText(minutes: number): string {
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  return m === 0 ? `${h} h` : `${h} h ${m} min`;
}
