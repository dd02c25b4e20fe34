import { BadRequestException, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { MY_ROSTER_MAX_DAYS, type MyRosterDto, type MyRosterQuery } from '@rotaplex/contracts';
import { DataSource } from 'typeorm';
import { type AuthUser } from '../common/auth-user';
import { StaffService } from '../staff/staff.service';
import { UnitsService } from '../units/units.service';
import { PublishedShifts } from './published-shifts';

const DAY_MS = 86_400_000;

function dayNumber(date: string): number {
  const ms = Date.parse(`${date}T00:00:00Z`);
  if (Number.isNaN(ms) || new Date(ms).toISOString().slice(0, 10) !== date) {
    throw new BadRequestException(`${date} is not a calendar date`);
  }
  return ms / DAY_MS;
}

/**
 * The caller's published shifts and the published shifts of the units they are on the roster of.
 * Colleagues' shifts carry their name and the shift only: no ids, contact details or anything else.
 */
@Injectable()
export class MyRosterService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly staff: StaffService,
    private readonly units: UnitsService,
    private readonly published: PublishedShifts,
  ) {}

  async shifts(user: AuthUser, query: MyRosterQuery): Promise<MyRosterDto> {
    const days = dayNumber(query.to) - dayNumber(query.from) + 1;
    if (days < 1) throw new BadRequestException('to must not be before from');
    if (days > MY_ROSTER_MAX_DAYS) {
      throw new BadRequestException(`Ask for at most ${MY_ROSTER_MAX_DAYS} days at a time`);
    }
    const em = this.dataSource.manager;
    const records = await this.staff.ofUser(user.id, em);
    const mine = new Set(records.map((r) => r.id));
    // Colleagues: only units where the caller is an active member of the roster.
    const unitIds = [...new Set(records.filter((r) => r.active).map((r) => r.unitId))];
    const units = await this.units.byIds(unitIds, em);
    const [own, team] = await Promise.all([
      this.published.of({ staffMemberIds: [...mine], from: query.from, to: query.to }, em),
      this.published.of({ unitIds, from: query.from, to: query.to }, em),
    ]);
    const seen = new Set<string>();
    const shifts = [...own, ...team]
      .filter((s) => {
        const key = `${s.staffMemberId}/${s.date}`;
        if (seen.has(key)) return false;
        seen.add(key);
        return true;
      })
      .sort((a, b) => a.start - b.start || a.staffName.localeCompare(b.staffName))
      .map((s) => ({
        mine: mine.has(s.staffMemberId),
        name: s.staffName,
        unitId: s.unitId,
        unitName: s.unitName,
        timeZone: s.timeZone,
        date: s.date,
        shiftCode: s.shiftCode,
        shiftName: s.shiftName,
        colour: s.colour,
        start: new Date(s.start).toISOString(),
        end: new Date(s.end).toISOString(),
      }));
    return {
      from: query.from,
      to: query.to,
      units: units
        .map((u) => ({ unitId: u.id, unitName: u.name, timeZone: u.timeZone }))
        .sort((a, b) => a.unitName.localeCompare(b.unitName)),
      shifts,
    };
  }
}
