import {
  type BelowMinimumShiftDto,
  contractCautions,
  type ContractRules,
  type RedFlagDto,
  shiftRedFlags,
  sortRedFlags,
  shiftTypeCautions,
  type UnhonouredLeaveDto,
} from '@rotaplex/contracts';
import { explainUnmetNeeds, type Roster } from '@rotaplex/roster-model';
import { daysBetween } from '../common/dates';
import { type RosterInput } from '../roster-input/roster-input.service';

/** Explanations are worked out for at most this many shifts below minimum (the rest are listed bare). */
const EXPLAINED_SHIFTS = 40;

/**
 * Shifts of a roster below their minimum cover, worst first: none of the required skill on the
 * shift, then the largest shortfall, then by date. A person counts towards every need whose skill
 * they have (the roster model's rule). With `explain`, each carries the roster model's reasons.
 */
export function belowMinimum(input: RosterInput, roster: Roster, explain: boolean): BelowMinimumShiftDto[] {
  const { problem } = input;
  const shiftById = new Map(input.shiftTypes.map((s) => [s.id, s]));
  const skillsOf = new Map(problem.people.map((p) => [p.id, new Set(p.skills)]));
  const out: (BelowMinimumShiftDto & { day: number })[] = [];
  for (const need of problem.coverNeeds) {
    if (need.min <= 0) continue;
    let onShift = 0;
    for (const [personId, days] of Object.entries(roster)) {
      if (days[need.day] !== need.shiftTypeId) continue;
      if (need.skillId === null || skillsOf.get(personId)?.has(need.skillId)) onShift++;
    }
    if (onShift >= need.min) continue;
    const st = shiftById.get(need.shiftTypeId);
    out.push({
      day: need.day,
      date: input.dates[need.day],
      shiftTypeId: need.shiftTypeId,
      shiftCode: st?.code ?? need.shiftTypeId,
      shiftName: st?.name ?? need.shiftTypeId,
      skillId: need.skillId,
      skillCode: need.skillId === null ? null : (problem.skillNames?.[need.skillId] ?? need.skillId),
      min: need.min,
      onShift,
      none: onShift === 0,
      reasons: [],
    });
  }
  out.sort(
    (a, b) =>
      Number(b.none) - Number(a.none) ||
      b.min - b.onShift - (a.min - a.onShift) ||
      a.date.localeCompare(b.date) ||
      a.shiftCode.localeCompare(b.shiftCode),
  );
  if (explain && out.length > 0) {
    const worst = out.slice(0, EXPLAINED_SHIFTS);
    const wanted = new Set(worst.map((s) => `${s.day}|${s.shiftTypeId}|${s.skillId}`));
    const needs = problem.coverNeeds.filter((n) => wanted.has(`${n.day}|${n.shiftTypeId}|${n.skillId}`));
    const explained = explainUnmetNeeds({ ...problem, coverNeeds: needs }, roster, undefined, {
      maxCostChecksPerNeed: 10,
    });
    const reasons = new Map(explained.map((e) => [`${e.day}|${e.shiftTypeId}|${e.skillId}`, e.reasons]));
    for (const s of worst) {
      // The first reason restates the count, which the list shows already.
      s.reasons = (reasons.get(`${s.day}|${s.shiftTypeId}|${s.skillId}`) ?? []).slice(1);
    }
  }
  return out.map(({ day: _day, ...rest }) => rest);
}

/**
 * Red flags of safe staffing (NICE SG1 2014, quoted in PRODUCT.md; the rule and our reading of it
 * are in contracts' safe-staffing.ts) on the roster's shifts that need a registered skill: counted
 * as belowMinimum counts (a person counts towards every need whose skill they have), by date.
 */
export function redFlags(input: RosterInput, roster: Roster): RedFlagDto[] {
  const registered = new Map(input.skills.filter((k) => k.registered).map((k) => [k.id, k]));
  if (registered.size === 0) return [];
  const shiftById = new Map(input.shiftTypes.map((s) => [s.id, s]));
  const skillsOf = new Map(input.problem.people.map((p) => [p.id, new Set(p.skills)]));
  const out: RedFlagDto[] = [];
  for (const need of input.problem.coverNeeds) {
    const skill = need.skillId === null ? undefined : registered.get(need.skillId);
    const st = shiftById.get(need.shiftTypeId);
    if (!skill || !st || need.min <= 0) continue;
    let onShift = 0;
    for (const [personId, days] of Object.entries(roster)) {
      if (days[need.day] === need.shiftTypeId && skillsOf.get(personId)?.has(skill.id)) onShift++;
    }
    out.push(
      ...shiftRedFlags(
        {
          date: input.dates[need.day],
          shiftTypeId: st.id,
          shiftCode: st.code,
          shiftName: st.name,
          paidMinutes: st.paidMinutes,
        },
        [{ skillId: skill.id, skillCode: skill.code, skillName: skill.name, need: need.min, onShift }],
      ),
    );
  }
  return sortRedFlags(out);
}

/** Shifts on days of approved leave, by date then name. */
export function unhonouredLeave(input: RosterInput, roster: Roster): UnhonouredLeaveDto[] {
  const staffById = new Map(input.staff.map((s) => [s.id, s]));
  const shiftById = new Map(input.shiftTypes.map((s) => [s.id, s]));
  const out: UnhonouredLeaveDto[] = [];
  const seen = new Set<string>();
  for (const a of input.problem.absences) {
    if (a.kind !== 'leave') continue;
    const shiftTypeId = roster[a.personId]?.[a.day] ?? null;
    const key = `${a.personId}|${a.day}`;
    if (shiftTypeId === null || seen.has(key)) continue;
    if (a.shiftTypeIds && !a.shiftTypeIds.includes(shiftTypeId)) continue;
    seen.add(key);
    out.push({
      staffMemberId: a.personId,
      name: staffById.get(a.personId)?.name ?? a.personId,
      date: input.dates[a.day],
      shiftTypeId,
      shiftCode: shiftById.get(shiftTypeId)?.code ?? shiftTypeId,
    });
  }
  return out.sort((a, b) => a.date.localeCompare(b.date) || a.name.localeCompare(b.name));
}

/**
 * A caution when a roster is published with less notice than the unit aims to give: `today` in the
 * unit's time zone, the period's first day, and the unit's publish lead time in days. Null when the
 * notice is enough. Lead times: 6 weeks is a common hospital aim (Drake, J Adv Nurs 2018;74(8):1831-38);
 * fair-workweek laws ask for 14 days (e.g. Seattle SMC 14.22); local law and agreements decide.
 */
export function leadTimeCaution(today: string, startDate: string, leadDays: number): string | null {
  const notice = daysBetween(today, startDate);
  if (notice >= leadDays) return null;
  const given =
    notice <= 0
      ? 'This period has already started'
      : `This roster starts in ${notice} ${notice === 1 ? 'day' : 'days'}`;
  return (
    `${given}: less notice than the ${leadDays} days this unit aims to give. Late rosters make it harder ` +
    'for people to plan their lives and often mean more bank or agency shifts. Where a fair-workweek law or ' +
    'agreement applies, changes inside its notice window may carry predictability pay: local law and ' +
    'agreements decide.'
  );
}

/**
 * Cautions on the settings a roster uses: the contracts of people with shifts on it that go beyond
 * the working-time presets, and shift types on it longer than 12 hours.
 */
export function settingCautions(
  input: RosterInput,
  roster: Roster,
  contracts: Map<string, { name: string } & ContractRules>,
): string[] {
  const out: string[] = [];
  const working = input.staff.filter((s) => (roster[s.id] ?? []).some((c) => c !== null));
  const byContract = new Map<string, string[]>();
  for (const s of working) {
    if (s.contractId === null) continue;
    byContract.set(s.contractId, [...(byContract.get(s.contractId) ?? []), s.name]);
  }
  for (const [id, names] of byContract) {
    const c = contracts.get(id);
    if (!c) continue;
    const cautions = contractCautions(c);
    if (cautions.length === 0) continue;
    const who =
      names.length <= 3 ? names.join(', ') : `${names.slice(0, 3).join(', ')} and ${names.length - 3} more`;
    out.push(`Contract "${c.name}" (${who}) is outside the working-time presets. ${cautions.join(' ')}`);
  }
  const used = new Set(Object.values(roster).flatMap((days) => days.filter((d): d is string => d !== null)));
  for (const st of input.shiftTypes) {
    if (!used.has(st.id)) continue;
    for (const c of shiftTypeCautions(st)) out.push(`${st.name} (${st.code}): ${c}`);
  }
  return out;
}
