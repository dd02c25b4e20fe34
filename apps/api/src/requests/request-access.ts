import { ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import { hasPermission } from '@rotaplex/contracts';
import { DataSource, type EntityManager } from 'typeorm';
import { type AuthUser } from '../common/auth-user';
import { localDate } from '../common/dates';
import { canAccessUnit, visibleUnitIds } from '../common/unit-scope';
import { type RosterPeriodEntity } from '../roster-periods/roster-period.entity';
import { RosterPeriodsService } from '../roster-periods/roster-periods.service';
import { type StaffMemberEntity } from '../staff/staff-member.entity';
import { StaffService } from '../staff/staff.service';
import { UnitsService } from '../units/units.service';

/**
 * Who is who for staff input: a staff member sees and changes only their own (the staff members
 * whose userId is the caller); managers read everything of their units and decide leave.
 */
@Injectable()
export class RequestAccess {
  constructor(
    private readonly dataSource: DataSource,
    private readonly units: UnitsService,
    private readonly staff: StaffService,
    private readonly periods: RosterPeriodsService,
  ) {}

  private get m(): EntityManager {
    return this.dataSource.manager;
  }

  /** Whether the caller reads other people's requests in the units they manage. */
  isApprover(user: AuthUser): boolean {
    return hasPermission(user.role, 'requests:approve');
  }

  async staffOrFail(id: string): Promise<StaffMemberEntity> {
    const staff = await this.staff.byId(id);
    if (!staff) throw new NotFoundException('Staff member not found');
    return staff;
  }

  /** The caller's own staff member `id`; 403 for anyone else's. */
  async ownStaff(user: AuthUser, id: string): Promise<StaffMemberEntity> {
    const staff = await this.staffOrFail(id);
    if (staff.userId !== user.id) throw new ForbiddenException('You can only change your own requests');
    return staff;
  }

  /** Readable by the person themselves, or by an approver with access to the unit. */
  async readableStaff(user: AuthUser, id: string): Promise<StaffMemberEntity> {
    const staff = await this.staffOrFail(id);
    if (staff.userId === user.id) return staff;
    if (this.isApprover(user) && canAccessUnit(user, staff.unitId) && (await this.inOrg(user, staff.unitId)))
      return staff;
    throw new ForbiddenException("You cannot see this person's requests");
  }

  async inOrg(user: AuthUser, unitId: string): Promise<boolean> {
    return (await this.units.organisationOf(unitId)) === user.organisationId;
  }

  /** The caller's own active staff memberships (an inactive one takes no new requests). */
  async myStaff(user: AuthUser): Promise<StaffMemberEntity[]> {
    return this.staff.ofUser(user.id, this.m, true);
  }

  /** Staff member ids whose requests the caller may read (null: none beyond the unit filter). */
  async readableStaffIds(user: AuthUser, unitId?: string): Promise<string[]> {
    if (unitId && !canAccessUnit(user, unitId))
      throw new ForbiddenException('You do not have access to this unit');
    if (!this.isApprover(user)) {
      return (await this.myStaff(user)).filter((s) => !unitId || s.unitId === unitId).map((s) => s.id);
    }
    const visible = visibleUnitIds(user);
    const units = await this.units.ofOrganisation(user.organisationId, unitId ? [unitId] : visible);
    if (!units.length) return [];
    const staff = await this.staff.ofUnits(units.map((u) => u.id));
    return staff.map((s) => s.id);
  }

  async periodOrFail(id: string): Promise<RosterPeriodEntity> {
    const period = await this.periods.byId(id);
    if (!period) throw new NotFoundException('Roster period not found');
    return period;
  }

  /** A period of a unit the caller manages (planners and approvers). */
  async managedPeriod(user: AuthUser, id: string): Promise<RosterPeriodEntity> {
    const period = await this.periodOrFail(id);
    if (!canAccessUnit(user, period.unitId) || !(await this.inOrg(user, period.unitId))) {
      throw new ForbiddenException('You do not have access to this unit');
    }
    return period;
  }

  /** Today in the unit's time zone, "YYYY-MM-DD". */
  async unitToday(unitId: string): Promise<string> {
    return localDate(new Date(), await this.units.timeZoneOf(unitId));
  }
}
