import { type RosterPeriodStatus, type ShiftColour } from '@rotaplex/contracts';
import { shiftInterval } from '@rotaplex/roster-model';
import { type EntityManager } from 'typeorm';
import { AssignmentEntity } from '../assignments/assignment.entity';
import { RosterPeriodEntity } from '../roster-periods/roster-period.entity';
import { ShiftTypeEntity } from '../shift-types/shift-type.entity';
import { StaffMemberEntity } from '../staff/staff-member.entity';
import { UnitEntity } from '../units/unit.entity';

/**
 * Periods whose roster staff see: published, and archived (a published roster whose period has
 * closed; its shifts stay in calendars rather than being cancelled).
 */
export const VISIBLE_PERIOD_STATUSES: readonly RosterPeriodStatus[] = ['published', 'archived'];

/** One worked shift of a visible roster, with real start and end instants. */
export interface PublishedShift {
  staffMemberId: string;
  staffName: string;
  unitId: string;
  unitName: string;
  timeZone: string;
  date: string;
  shiftCode: string;
  shiftName: string;
  colour: ShiftColour;
  /** Wall-clock "HH:mm" in the unit's zone. */
  startTime: string;
  endTime: string;
  paidMinutes: number;
  /** Epoch milliseconds. */
  start: number;
  end: number;
}

interface ShiftRow {
  staffMemberId: string;
  staffName: string;
  unitId: string;
  unitName: string;
  timeZone: string;
  date: string;
  shiftCode: string;
  shiftName: string;
  colour: ShiftColour;
  startTime: string;
  endTime: string;
  paidMinutes: number;
}

/**
 * Worked shifts of visible rosters, for some staff members or for everyone in some units, optionally
 * limited to days in [from, to]. Ordered by start.
 */
export async function publishedShifts(
  em: EntityManager,
  filter: { staffMemberIds?: string[]; unitIds?: string[]; from?: string; to?: string },
): Promise<PublishedShift[]> {
  if (filter.staffMemberIds?.length === 0 || filter.unitIds?.length === 0) return [];
  const qb = em
    .createQueryBuilder(AssignmentEntity, 'a')
    .innerJoin(RosterPeriodEntity, 'p', 'p.id = a.rosterPeriodId')
    .innerJoin(StaffMemberEntity, 's', 's.id = a.staffMemberId')
    .innerJoin(ShiftTypeEntity, 't', 't.id = a.shiftTypeId')
    .innerJoin(UnitEntity, 'u', 'u.id = p.unitId')
    .select('a.staffMemberId', 'staffMemberId')
    .addSelect('s.name', 'staffName')
    .addSelect('u.id', 'unitId')
    .addSelect('u.name', 'unitName')
    .addSelect('u.timeZone', 'timeZone')
    .addSelect('a.date', 'date')
    .addSelect('t.code', 'shiftCode')
    .addSelect('t.name', 'shiftName')
    .addSelect('t.colour', 'colour')
    .addSelect('t.start', 'startTime')
    .addSelect('t.end', 'endTime')
    .addSelect('t.paidMinutes', 'paidMinutes')
    .where('p.status IN (:...statuses)', { statuses: VISIBLE_PERIOD_STATUSES })
    .andWhere('a.shiftTypeId IS NOT NULL');
  if (filter.staffMemberIds) qb.andWhere('a.staffMemberId IN (:...staff)', { staff: filter.staffMemberIds });
  if (filter.unitIds) qb.andWhere('p.unitId IN (:...units)', { units: filter.unitIds });
  if (filter.from) qb.andWhere('a.date >= :from', { from: filter.from });
  if (filter.to) qb.andWhere('a.date <= :to', { to: filter.to });
  const rows = await qb.getRawMany<ShiftRow>();
  return rows
    .map((r) => {
      const { start, end } = shiftInterval({ startDate: r.date, timeZone: r.timeZone }, 0, {
        start: r.startTime,
        end: r.endTime,
      });
      return { ...r, paidMinutes: Number(r.paidMinutes), start, end };
    })
    .sort((a, b) => a.start - b.start || a.staffName.localeCompare(b.staffName));
}
