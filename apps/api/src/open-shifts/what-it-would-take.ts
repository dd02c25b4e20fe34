import {
  type CandidateDto,
  GUARD_RAIL_DEFERRAL,
  OVERRIDE_REASON_RULES,
  REST_RULE_WARNING,
  type RosterViolationDto,
  type RuleBreakDto,
} from '@rotaplex/contracts';
import { type CheckResult } from '@rotaplex/roster-model';
import { type AssignmentEntity } from '../roster-periods/assignment.entity';
import { checkerWords } from './open-shift-words';
import { type RosterInput } from '../roster-input/roster-input.service';
import { evaluateChanges } from '../swaps/swap-evaluation';
import { type StoredCellChange } from '../swaps/swap-request.entity';

type Cell = Pick<AssignmentEntity, 'staffMemberId' | 'date' | 'shiftTypeId'>;

const SERIOUS: readonly string[] = OVERRIDE_REASON_RULES;

/** Rules the product asks a reason for, then the rest (roster model rule names). */
const RULE_LABEL: Record<string, string> = {
  minRest: 'Rest between shifts',
  forbiddenSuccession: 'Shift order',
  maxPaidMinutes: 'Hours',
  minPaidMinutes: 'Hours',
  maxConsecutiveWorkDays: 'Days in a row',
  minConsecutiveWorkDays: 'Days in a row',
  minConsecutiveDaysOff: 'Days off in a row',
  maxConsecutiveNights: 'Nights in a row',
  maxWeekends: 'Weekends',
  maxShiftsPerType: 'Shifts of this kind',
  absence: 'Leave or unavailability',
  oneShiftPerDay: 'One shift a day',
  pin: 'A fixed shift',
};

/**
 * A checker finding in a manager's words: the person's name kept, dates in words, shift codes with
 * their names ("Late (L) on Mon 7 Jan 2030"), prefixed with what the rule protects.
 */
export function breakInWords(v: Pick<RosterViolationDto, 'rule' | 'message'>, input: RosterInput): string {
  let message = v.message;
  for (const s of input.shiftTypes) {
    message = message.replace(
      new RegExp(`(^|[\\s(])${s.code.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')} on (\\d{4}-\\d{2}-\\d{2})`, 'g'),
      (_all, lead: string, date: string) => `${lead}${s.name} (${s.code}) on ${date}`,
    );
  }
  return `${RULE_LABEL[v.rule] ?? 'A rule of the contract'}: ${checkerWords(message)}`;
}

/**
 * For one open shift: every person of the unit with the skill it needs who is not on leave, unavailable
 * or off by contract that day, with each rule that taking it would break anew (the same check as the
 * open-shift list and claims: `evaluateChanges`, the roster model's checker), nearest first: fewest
 * breaks of the rules a manual edit needs a reason for, then fewest breaks, then name. Someone already
 * on another shift that day is shown with what moving them would break, after the others with as many.
 */
export function whatItWouldTake(
  input: RosterInput,
  rows: Cell[],
  shift: { date: string; shiftTypeId: string; skillId: string | null },
): { candidates: CandidateDto[]; absent: number; cautions: string[] } {
  const day = input.dates.indexOf(shift.date);
  const cache: { before?: CheckResult } = {};
  const candidates: CandidateDto[] = [];
  let absent = 0;
  for (const person of input.staff) {
    if (shift.skillId && !person.skills.some((k) => k.id === shift.skillId)) continue;
    const away = input.problem.absences.some(
      (a) =>
        a.personId === person.id &&
        a.day === day &&
        (!a.shiftTypeIds || a.shiftTypeIds.includes(shift.shiftTypeId)),
    );
    if (away) {
      absent++;
      continue;
    }
    const current =
      rows.find((r) => r.staffMemberId === person.id && r.date === shift.date)?.shiftTypeId ?? null;
    if (current === shift.shiftTypeId) continue; // already on it, counted in the cover
    const change: StoredCellChange = {
      staffMemberId: person.id,
      date: shift.date,
      before: current,
      after: shift.shiftTypeId,
    };
    const findings = evaluateChanges(input, rows, [change], cache);
    const breaks: RuleBreakDto[] = findings.violations
      .filter((v) => v.isNew)
      .map((v) => ({ rule: v.rule, serious: SERIOUS.includes(v.rule), words: breakInWords(v, input) }));
    const other = current ? input.shiftTypes.find((s) => s.id === current) : undefined;
    candidates.push({
      staffMemberId: person.id,
      name: person.name,
      breaks,
      alreadyWorks: current ? (other ? `${other.name} (${other.code})` : 'another shift') : null,
    });
  }
  const weight = (c: CandidateDto) => (c.alreadyWorks ? 1 : 0);
  candidates.sort(
    (a, b) =>
      a.breaks.filter((x) => x.serious).length +
        weight(a) -
        (b.breaks.filter((x) => x.serious).length + weight(b)) ||
      a.breaks.length + weight(a) - (b.breaks.length + weight(b)) ||
      a.name.localeCompare(b.name),
  );
  return { candidates, absent, cautions: cautionsFor(candidates) };
}

/** The usual cautions where the manager weighs asking someone beyond their contract. */
function cautionsFor(candidates: CandidateDto[]): string[] {
  const out = [
    'Asking someone to work beyond the limits of their contract raises the risk of fatigue and mistakes; ' +
      'working-time law (for example the 11 hours of daily rest and 48-hour average week of the EU Working ' +
      'Time Directive 2003/88/EC) may not allow it at all.',
  ];
  if (candidates.some((c) => c.breaks.some((b) => b.rule === 'minRest'))) out.push(REST_RULE_WARNING);
  out.push(
    'Bank or agency staff must hold the skill and registration the shift needs; who may work it is for licensed practice and local policy to decide.',
  );
  out.push(GUARD_RAIL_DEFERRAL);
  return out;
}

/** How a manager changes a published roster in the product (no override exists there). */
export const HOW_TO_CHANGE_PUBLISHED =
  'A published roster changes through a claim, a swap or a repair, and each of them keeps every rule of ' +
  'the contracts: Rotaplex does not give a published shift to someone against a rule of theirs. On a draft ' +
  'roster, a manual edit on the planning board may break a rule with a written reason, which is kept in ' +
  'the audit trail. Where local policy allows an exception on a published roster, it is agreed with the ' +
  'person and the person responsible outside Rotaplex; otherwise offer the shift outside the roster or ' +
  'escalate as local policy says.';
