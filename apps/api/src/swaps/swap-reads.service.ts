import { ConflictException, ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import {
  hasPermission,
  type Page,
  type SwapAction,
  type SwapOptionsDto,
  type SwapRequestDto,
} from '@rotaplex/contracts';
import { DataSource, type EntityManager } from 'typeorm';
import { type AuthUser } from '../common/auth-user';
import { localDate } from '../common/dates';
import { assertUnitAccess, canAccessUnit } from '../common/unit-scope';
import { PeriodWriter } from '../roster-periods/period-writer';
import { type RosterInput, RosterInputService } from '../roster-input/roster-input.service';
import { ShiftTypesService } from '../shift-types/shift-types.service';
import { type StaffMemberEntity } from '../staff/staff-member.entity';
import { StaffService } from '../staff/staff.service';
import { UnitsService } from '../units/units.service';
import { type SwapListQuery } from './dto/swap.dto';
import { changeDto } from './swap-evaluation';
import { type StoredCellChange, SwapRequestEntity } from './swap-request.entity';

/** Whoever reads a request: enough of a user to work out which actions they have. */
export type SwapReader = AuthUser;

/**
 * Reading swaps, offers and claims: the options a staff member has on a published roster, the
 * paged list, one request, and who may see which request. Changes nothing.
 */
@Injectable()
export class SwapReads {
  constructor(
    private readonly dataSource: DataSource,
    private readonly input: RosterInputService,
    private readonly units: UnitsService,
    private readonly shiftTypes: ShiftTypesService,
    private readonly staff: StaffService,
    private readonly cells: PeriodWriter,
  ) {}

  async options(user: AuthUser, periodId: string): Promise<SwapOptionsDto> {
    const input = await this.publishedInput(periodId);
    assertUnitAccess(user, input.period.unitId);
    const me = this.staffOf(user, input);
    const rows = await this.cells.rowsOf(periodId);
    const today = this.today(input);
    const shiftsOf = (staffId: string) =>
      rows
        .filter((r) => r.staffMemberId === staffId && r.shiftTypeId !== null && r.date >= today)
        .sort((a, b) => a.date.localeCompare(b.date))
        .map((r) => ({
          date: r.date,
          shiftTypeId: r.shiftTypeId!,
          shiftCode: input.shiftTypes.find((s) => s.id === r.shiftTypeId)?.code ?? '',
        }));
    return {
      rosterPeriodId: periodId,
      myStaffMemberId: me.id,
      myShifts: shiftsOf(me.id),
      colleagues: input.staff
        .filter((s) => s.id !== me.id && s.userId !== null)
        .map((s) => ({ staffMemberId: s.id, name: s.name, shifts: shiftsOf(s.id) })),
    };
  }

  /**
   * A page of the requests the caller takes part in (staff) or manages, newest first; with
   * `waitingForMe`, only those waiting for the caller's answer (staff: to accept; managers: to approve).
   */
  async list(user: AuthUser, query: SwapListQuery): Promise<Page<SwapRequestDto>> {
    const m = this.dataSource.manager;
    const empty = { items: [], total: 0, page: query.page, pageSize: query.pageSize };
    const qb = m.createQueryBuilder(SwapRequestEntity, 'r').orderBy('r.createdAt', 'DESC').addOrderBy('r.id');
    if (user.role === 'staff') {
      const mine = (await this.staff.ofUser(user.id, m)).map((s) => s.id);
      if (!mine.length) return empty;
      if (query.waitingForMe) {
        qb.where(`r.colleagueStaffMemberId IN (:...mine) AND r.status = 'proposed'`, { mine });
      } else {
        qb.where('(r.proposerStaffMemberId IN (:...mine) OR r.colleagueStaffMemberId IN (:...mine))', {
          mine,
        });
      }
    } else if (user.role === 'manager') {
      if (!user.unitIds.length) return empty;
      qb.where('r.unitId IN (:...units)', { units: user.unitIds });
    } else {
      const units = (await this.units.list(user)).map((u) => u.id);
      if (!units.length) return empty;
      qb.where('r.unitId IN (:...units)', { units });
    }
    if (query.waitingForMe && user.role !== 'staff') {
      if (!hasPermission(user.role, 'requests:approve')) return empty;
      qb.andWhere(`r.status = 'accepted'`);
    }
    if (query.status) qb.andWhere('r.status = :status', { status: query.status });
    const [rows, total] = await qb
      .skip((query.page - 1) * query.pageSize)
      .take(query.pageSize)
      .getManyAndCount();
    return { items: await this.toDtos(m, rows, user), total, page: query.page, pageSize: query.pageSize };
  }

  async get(user: AuthUser, id: string): Promise<SwapRequestDto> {
    const m = this.dataSource.manager;
    const row = await this.visibleRequest(m, user, id);
    return (await this.toDtos(m, [row], user))[0];
  }

  /** One request as `reader` sees it (with the actions open to them). */
  async dtoOf(em: EntityManager, row: SwapRequestEntity, reader: SwapReader): Promise<SwapRequestDto> {
    return (await this.toDtos(em, [row], reader))[0];
  }

  /** Today in the unit of the roster, "YYYY-MM-DD". */
  today(input: RosterInput): string {
    return localDate(new Date(), input.unit.timeZone);
  }

  /** The roster of a published period (409 for a draft or archived one). */
  async publishedInput(periodId: string, em?: EntityManager): Promise<RosterInput> {
    const input = await this.input.load(periodId, {}, em);
    if (input.period.status !== 'published') {
      throw new ConflictException(
        `Swaps and open shifts are for published rosters; this period is ${input.period.status}`,
      );
    }
    return input;
  }

  /** The caller's staff member on the period's unit (403 when they are not on its roster). */
  staffOf(user: AuthUser, input: RosterInput): StaffMemberEntity {
    const me = input.staff.find((s) => s.userId === user.id);
    if (!me || user.role !== 'staff') throw new ForbiddenException('Only staff on this roster can do this');
    return me;
  }

  /** A request the caller may see (404 otherwise, so its existence is not given away). */
  async visibleRequest(em: EntityManager, user: AuthUser, id: string): Promise<SwapRequestEntity> {
    const row = await em.findOneBy(SwapRequestEntity, { id });
    if (!row) throw new NotFoundException('Swap request not found');
    if (user.role === 'staff') {
      const ids = [row.proposerStaffMemberId, row.colleagueStaffMemberId].filter((x): x is string => !!x);
      const mine = (await this.staff.byIds(ids, em)).some((s) => s.userId === user.id);
      if (!mine) throw new NotFoundException('Swap request not found');
    } else {
      if ((await this.units.organisationOf(row.unitId)) !== user.organisationId)
        throw new NotFoundException('Swap request not found');
      assertUnitAccess(user, row.unitId);
    }
    return row;
  }

  private async toDtos(
    em: EntityManager,
    rows: SwapRequestEntity[],
    user: SwapReader,
  ): Promise<SwapRequestDto[]> {
    const staffIds = [
      ...new Set(
        rows.flatMap((r) => [
          r.proposerStaffMemberId,
          ...(r.colleagueStaffMemberId ? [r.colleagueStaffMemberId] : []),
          ...(JSON.parse(r.changes) as StoredCellChange[]).map((c) => c.staffMemberId),
        ]),
      ),
    ];
    const staff = await this.staff.byIds(staffIds, em);
    const names = new Map(staff.map((s) => [s.id, s.name]));
    const shiftTypes = (
      await Promise.all([...new Set(rows.map((r) => r.unitId))].map((u) => this.shiftTypes.findForUnit(u)))
    ).flat();
    const lookup = { staff, shiftTypes } as unknown as Pick<RosterInput, 'staff' | 'shiftTypes'>;
    return rows.map((r) => {
      const proposer = staff.find((s) => s.id === r.proposerStaffMemberId);
      const colleague = staff.find((s) => s.id === r.colleagueStaffMemberId);
      const actions: SwapAction[] = [];
      const pending = r.status === 'proposed' || r.status === 'accepted';
      if (pending && proposer?.userId === user.id) actions.push('cancel');
      if (r.status === 'proposed' && colleague?.userId === user.id) actions.push('accept', 'decline');
      if (
        r.status === 'accepted' &&
        hasPermission(user.role, 'requests:approve') &&
        canAccessUnit(user, r.unitId)
      )
        actions.push('approve', 'refuse');
      return {
        id: r.id,
        kind: r.kind,
        status: r.status,
        rosterPeriodId: r.rosterPeriodId,
        unitId: r.unitId,
        proposerStaffMemberId: r.proposerStaffMemberId,
        proposerName: names.get(r.proposerStaffMemberId) ?? '',
        colleagueStaffMemberId: r.colleagueStaffMemberId,
        colleagueName: r.colleagueStaffMemberId ? (names.get(r.colleagueStaffMemberId) ?? '') : null,
        changes: (JSON.parse(r.changes) as StoredCellChange[]).map((c) => changeDto(lookup, c, names)),
        note: r.note,
        outcome: r.outcome,
        createdAt: r.createdAt.toISOString(),
        updatedAt: r.updatedAt.toISOString(),
        actions,
      };
    });
  }
}
