import {
  type ChangeInitiator,
  type LateChangeDto,
  type PredictabilityPayOwedDto,
  type RosterChangeKind,
} from '@rotaplex/contracts';
import { randomUUID } from 'node:crypto';
import { type EntityManager, In } from 'typeorm';
import { daysBetween, localDate } from '../common/dates';
import { dateInWords } from '../common/text/date-words';
import { OrganisationEntity } from '../organisation/organisation.entity';
import { ShiftTypeEntity } from '../shift-types/shift-type.entity';
import { StaffMemberEntity } from '../staff/staff-member.entity';
import { UnitEntity } from '../units/unit.entity';
import { LateChangeEntity } from './late-change.entity';
import { RosterPeriodEntity } from './roster-period.entity';

/** One cell whose shift changed: before and after (null: day off). */
export interface ShiftChange {
  staffMemberId: string;
  date: string;
  before: string | null;
  after: string | null;
}

/** Kinds of change a person asks for themselves: their own swap or give-away, a claim of an open shift. */
const EMPLOYEE_KINDS: ReadonlySet<RosterChangeKind> = new Set(['swap', 'open-shift-claim']);

const KIND_WORDS: Record<RosterChangeKind, string> = {
  edit: 'a manual edit',
  pin: 'a pin',
  unpin: 'an unpin',
  generate: 'a new roster',
  repair: 'a repair',
  swap: 'a swap the person asked for',
  'open-shift-claim': 'an open shift the person claimed',
};

/**
 * Whether a change to a shift on `date`, made `today` (both in the unit's calendar), is inside a
 * notice window of `windowDays`: fewer whole days of notice than the window. Fair-workweek laws ask
 * for schedules 14 days ahead (Seattle SMC 14.22, Oregon SB 828, Chicago, Philadelphia, New York
 * City); a change with 14 or more days' notice is outside, 13 or fewer inside. Days already past
 * are records of what happened, not changes with notice: never inside.
 */
export function insideNoticeWindow(today: string, date: string, windowDays: number): boolean {
  const notice = daysBetween(today, date);
  return notice >= 0 && notice < windowDays;
}

/** Who a change came from: the person for their own requests and for their own approved leave. */
export function initiatorOf(kind: RosterChangeKind, ownLeave: boolean): ChangeInitiator {
  return EMPLOYEE_KINDS.has(kind) || ownLeave ? 'employee' : 'employer';
}

/**
 * Records the cells of a published period changed inside the organisation's notice window, in the
 * caller's transaction (the one that writes the cells): one `late_changes` row per cell, with
 * predictability pay for employer-initiated changes when the organisation records it. Answers the
 * rows written. Nothing for a period that is not published or a window of 0 days.
 *
 * `leaveCells` holds "staffMemberId|date" of cells the person is on approved leave: a shift taken
 * off for the person's own leave counts as asked for by them.
 */
export async function recordLateChanges(
  em: EntityManager,
  periodId: string,
  version: number,
  changes: readonly ShiftChange[],
  by: { kind: RosterChangeKind; actorName: string; leaveCells?: ReadonlySet<string> },
  now = new Date(),
): Promise<LateChangeEntity[]> {
  if (changes.length === 0) return [];
  const period = await em.findOneByOrFail(RosterPeriodEntity, { id: periodId });
  if (period.status !== 'published') return [];
  const unit = await em.findOneByOrFail(UnitEntity, { id: period.unitId });
  const org = await em.findOneByOrFail(OrganisationEntity, { id: unit.organisationId });
  const windowDays = org.noticeWindowDays;
  const today = localDate(now, unit.timeZone);
  const late = changes.filter((c) => insideNoticeWindow(today, c.date, windowDays));
  if (late.length === 0) return [];
  const staffIds = [...new Set(late.map((c) => c.staffMemberId))];
  const shiftIds = [...new Set(late.flatMap((c) => [c.before, c.after]).filter((s): s is string => !!s))];
  const staff = new Map(
    (await em.find(StaffMemberEntity, { where: { id: In(staffIds) }, select: { id: true, name: true } })).map(
      (s) => [s.id, s.name],
    ),
  );
  const shifts = new Map(
    (shiftIds.length
      ? await em.find(ShiftTypeEntity, { where: { id: In(shiftIds) }, select: { id: true, name: true } })
      : []
    ).map((s) => [s.id, s.name]),
  );
  const rows = late.map((c): LateChangeEntity => {
    const daysNotice = daysBetween(today, c.date);
    const ownLeave = c.after === null && (by.leaveCells?.has(`${c.staffMemberId}|${c.date}`) ?? false);
    const initiatedBy = initiatorOf(by.kind, ownLeave);
    const pay = org.recordPredictabilityPay && initiatedBy === 'employer';
    const days = `${daysNotice} ${daysNotice === 1 ? "day's" : "days'"} notice`;
    const reason = [
      `Changed by ${KIND_WORDS[by.kind]} with ${days}, inside the ${windowDays}-day notice window.`,
      initiatedBy === 'employee'
        ? ownLeave
          ? 'The shift was taken off for the person’s own approved leave: commonly exempt from predictability pay.'
          : 'Asked for by the person: commonly exempt from predictability pay.'
        : org.recordPredictabilityPay
          ? `Made by the employer: predictability pay recorded (${org.predictabilityPayHours} h).`
          : 'Made by the employer.',
    ].join(' ');
    return Object.assign(new LateChangeEntity(), {
      id: randomUUID(),
      rosterPeriodId: periodId,
      version,
      kind: by.kind,
      initiatedBy,
      staffMemberId: c.staffMemberId,
      staffName: (staff.get(c.staffMemberId) ?? 'a person removed since').slice(0, 200),
      date: c.date,
      shiftBefore: c.before ? (shifts.get(c.before) ?? 'a shift type removed since').slice(0, 200) : null,
      shiftAfter: c.after ? (shifts.get(c.after) ?? 'a shift type removed since').slice(0, 200) : null,
      daysNotice,
      noticeWindowDays: windowDays,
      payHours: pay ? org.predictabilityPayHours : null,
      payRule: pay ? org.predictabilityPayRule.trim() || null : null,
      reason: reason.slice(0, 500),
      actorName: by.actorName.slice(0, 200),
      at: now,
    });
  });
  for (let i = 0; i < rows.length; i += 100) await em.insert(LateChangeEntity, rows.slice(i, i + 100));
  return rows;
}

export function toLateChangeDto(r: LateChangeEntity): LateChangeDto {
  return {
    id: r.id,
    version: r.version,
    kind: r.kind,
    initiatedBy: r.initiatedBy,
    staffMemberId: r.staffMemberId,
    staffName: r.staffName,
    date: r.date,
    shiftBefore: r.shiftBefore,
    shiftAfter: r.shiftAfter,
    daysNotice: r.daysNotice,
    noticeWindowDays: r.noticeWindowDays,
    payHours: r.payHours,
    payRule: r.payRule,
    reason: r.reason,
    actorName: r.actorName,
    at: r.at.toISOString(),
  };
}

/** Pay recorded per person (rows with pay only), most hours first, then by name. */
export function owedPerPerson(rows: readonly LateChangeEntity[]): PredictabilityPayOwedDto[] {
  const out = new Map<string, PredictabilityPayOwedDto>();
  for (const r of rows) {
    if (r.payHours === null) continue;
    const o = out.get(r.staffMemberId) ?? {
      staffMemberId: r.staffMemberId,
      staffName: r.staffName,
      changes: 0,
      hours: 0,
    };
    o.changes++;
    o.hours += r.payHours;
    out.set(r.staffMemberId, o);
  }
  return [...out.values()].sort((a, b) => b.hours - a.hours || a.staffName.localeCompare(b.staffName));
}

/**
 * The late changes a change of cells made (the version `PeriodWriter` answered), for the audit entry
 * and e-mails of the change: `lateSummary` and `lateNotes`. Read in the change's transaction.
 */
export function lateChangesOf(
  em: EntityManager,
  periodId: string,
  version: number,
): Promise<LateChangeEntity[]> {
  return em.findBy(LateChangeEntity, { rosterPeriodId: periodId, version });
}

/**
 * The audit summary's words on a change's cells inside the notice window: how many, how many asked
 * for by the person, and the predictability pay recorded.
 */
export function lateSummary(late: readonly LateChangeEntity[]): string {
  if (late.length === 0) return '';
  const window = late[0].noticeWindowDays;
  const employee = late.filter((l) => l.initiatedBy === 'employee').length;
  const paid = late.filter((l) => l.payHours !== null);
  const hours = paid.reduce((n, l) => n + (l.payHours ?? 0), 0);
  return (
    `; ${late.length} ${late.length === 1 ? 'change is' : 'changes are'} inside the ${window}-day notice window` +
    (employee > 0 ? ` (${employee} asked for by the person, commonly exempt)` : '') +
    (paid.length > 0
      ? `; predictability pay recorded: ${hours} h for ${paid.length} ${paid.length === 1 ? 'change' : 'changes'}`
      : '')
  );
}

/** Per person, the e-mail's line on their late changes. */
export function lateNotes(late: readonly LateChangeEntity[]): Map<string, string> {
  const out = new Map<string, string>();
  for (const person of new Set(late.map((l) => l.staffMemberId))) {
    const mine = late.filter((l) => l.staffMemberId === person);
    const days = [...new Set(mine.map((l) => l.date))].sort().map(dateInWords);
    out.set(
      person,
      `This is a late change: ${days.join(', ')} ${days.length === 1 ? 'is' : 'are'} less than ` +
        `${mine[0].noticeWindowDays} days away. Where a notice-window law or agreement applies, ` +
        'it decides what this means for you; ask your manager or payroll team.',
    );
  }
  return out;
}
