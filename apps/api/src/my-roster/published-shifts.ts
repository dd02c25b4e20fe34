import { Injectable } from '@nestjs/common';
import { type RosterPeriodStatus, type ShiftColour } from '@rotaplex/contracts';
import { shiftInterval } from '@rotaplex/roster-model';
import { DataSource, type EntityManager } from 'typeorm';
import { PeriodWriter } from '../roster-periods/period-writer';
import { ShiftTypesService } from '../shift-types/shift-types.service';
import { StaffService } from '../staff/staff.service';
import { UnitsService } from '../units/units.service';

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

/**
 * Worked shifts of visible rosters, for some staff members or for everyone in some units, optionally
 * limited to days in [from, to]. Ordered by start. The cells come from the period writer and the
 * people, shift types and units from their modules' services by id (four queries, not one a row),
 * all in `em`'s transaction or read connection.
 */
@Injectable()
export class PublishedShifts {
  constructor(
    private readonly dataSource: DataSource,
    private readonly writer: PeriodWriter,
    private readonly staff: StaffService,
    private readonly shiftTypes: ShiftTypesService,
    private readonly units: UnitsService,
  ) {}

  async of(
    filter: { staffMemberIds?: string[]; unitIds?: string[]; from?: string; to?: string },
    em: EntityManager = this.dataSource.manager,
  ): Promise<PublishedShift[]> {
    const cells = await this.writer.shiftCellsOf({ statuses: VISIBLE_PERIOD_STATUSES, ...filter }, em);
    if (cells.length === 0) return [];
    const ids = (key: 'staffMemberId' | 'shiftTypeId' | 'unitId') => [...new Set(cells.map((c) => c[key]))];
    const [people, types, units] = await Promise.all([
      this.staff.byIds(ids('staffMemberId'), em),
      this.shiftTypes.byIds(ids('shiftTypeId'), em),
      this.units.byIds(ids('unitId'), em),
    ]);
    const personOf = new Map(people.map((p) => [p.id, p]));
    const typeOf = new Map(types.map((t) => [t.id, t]));
    const unitOf = new Map(units.map((u) => [u.id, u]));
    const shifts: PublishedShift[] = [];
    for (const c of cells) {
      const person = personOf.get(c.staffMemberId);
      const type = typeOf.get(c.shiftTypeId);
      const unit = unitOf.get(c.unitId);
      if (!person || !type || !unit) continue; // as the inner joins before: a cell names all three
      const { start, end } = shiftInterval({ startDate: c.date, timeZone: unit.timeZone }, 0, {
        start: type.start,
        end: type.end,
      });
      shifts.push({
        staffMemberId: c.staffMemberId,
        staffName: person.name,
        unitId: unit.id,
        unitName: unit.name,
        timeZone: unit.timeZone,
        date: c.date,
        shiftCode: type.code,
        shiftName: type.name,
        colour: type.colour,
        startTime: type.start,
        endTime: type.end,
        paidMinutes: Number(type.paidMinutes),
        start,
        end,
      });
    }
    return shifts.sort((a, b) => a.start - b.start || a.staffName.localeCompare(b.staffName));
  }
}
