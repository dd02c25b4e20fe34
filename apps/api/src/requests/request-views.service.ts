import { Injectable } from '@nestjs/common';
import {
  type MyRequestsDto,
  type Page,
  type PeriodRequestsDto,
  type RequestPeriodDto,
  type RequestRowDto,
} from '@rotaplex/contracts';
import { DataSource, type EntityManager, In } from 'typeorm';
import { type AuthUser } from '../common/auth-user';
import { toPage } from '../common/pagination';
import { type RosterPeriodEntity } from '../roster-periods/roster-period.entity';
import { addDays } from '../common/dates';
import { RosterPeriodsService } from '../roster-periods/roster-periods.service';
import { StaffService } from '../staff/staff.service';
import { UnitsService } from '../units/units.service';
import { type MyRequestsQueryDto, type RequestListQueryDto } from './dto/requests.dto';
import { RequestAccess } from './request-access';
import { RequestDtos, toPeriodDto } from './request-dtos';
import { AvailabilityCellEntity, DateRequestEntity, LeaveRequestEntity } from './requests.entities';

/**
 * Views over all of a person's or a period's staff input: "My requests" for the signed-in staff
 * member; for managers, a period's requests (the planning board), its request limit and the
 * requests table of their units, filtered, sorted and paged.
 */
@Injectable()
export class RequestViews {
  constructor(
    private readonly dataSource: DataSource,
    private readonly access: RequestAccess,
    private readonly dtos: RequestDtos,
    private readonly units: UnitsService,
    private readonly staff: StaffService,
    private readonly periods: RosterPeriodsService,
  ) {}

  private get m(): EntityManager {
    return this.dataSource.manager;
  }

  /** The caller's staff memberships and open periods, with a page of their date requests and leave. */
  async mine(user: AuthUser, query: MyRequestsQueryDto): Promise<MyRequestsDto> {
    const staff = await this.access.myStaff(user);
    const ids = staff.map((s) => s.id);
    const unitIds = [...new Set(staff.map((s) => s.unitId))];
    const units = unitIds.length ? await this.units.ofOrganisation(user.organisationId, unitIds) : [];
    const unitById = new Map(units.map((u) => [u.id, u]));
    const periods = await this.periods.openOfUnits(unitIds);
    const page = { skip: (query.page - 1) * query.pageSize, take: query.pageSize };
    const [dateRequests, dateRequestsTotal] = ids.length
      ? await this.m.findAndCount(DateRequestEntity, {
          where: { staffMemberId: In(ids) },
          order: { date: 'ASC', createdAt: 'ASC', id: 'ASC' },
          ...page,
        })
      : [[], 0];
    const [leave, leaveTotal] = ids.length
      ? await this.m.findAndCount(LeaveRequestEntity, {
          where: { staffMemberId: In(ids) },
          order: { startDate: 'ASC', createdAt: 'ASC', id: 'ASC' },
          ...page,
        })
      : [[], 0];
    return {
      staffMembers: staff.map((s) => ({
        id: s.id,
        name: s.name,
        unitId: s.unitId,
        unitName: unitById.get(s.unitId)?.name ?? '',
        timeZone: unitById.get(s.unitId)?.timeZone ?? 'UTC',
      })),
      periods: periods.map(toPeriodDto),
      dateRequests: await this.dtos.dateRequests(dateRequests),
      leave: await this.dtos.leave(leave),
      dateRequestsTotal,
      leaveTotal,
      page: query.page,
      pageSize: query.pageSize,
    };
  }

  // ------------------------------------------------------------ managers

  async periodRequests(user: AuthUser, periodId: string): Promise<PeriodRequestsDto> {
    const period = await this.access.managedPeriod(user, periodId);
    const staff = await this.staff.ofUnits([period.unitId]);
    const ids = staff.map((s) => s.id);
    const last = addDays(period.startDate, period.days - 1);
    const leave = ids.length
      ? await this.m
          .createQueryBuilder(LeaveRequestEntity, 'l')
          .where('l.staffMemberId IN (:...ids)', { ids })
          .andWhere('l.startDate <= :last AND l.endDate >= :first', { first: period.startDate, last })
          .orderBy('l.startDate', 'ASC')
          .getMany()
      : [];
    const cells = ids.length
      ? await this.m.find(AvailabilityCellEntity, {
          where: { staffMemberId: In(ids) },
          order: { weekday: 'ASC', part: 'ASC' },
        })
      : [];
    return {
      period: toPeriodDto(period),
      dateRequests: await this.dtos.dateRequests(
        await this.m.find(DateRequestEntity, {
          where: { rosterPeriodId: period.id },
          order: { date: 'ASC' },
        }),
      ),
      leave: await this.dtos.leave(leave),
      availability: ids
        .map((id) => ({
          staffMemberId: id,
          cells: cells
            .filter((c) => c.staffMemberId === id)
            .map((c) => ({ weekday: c.weekday, part: c.part, status: c.status })),
        }))
        .filter((a) => a.cells.length > 0),
    };
  }

  async setRequestLimit(user: AuthUser, periodId: string, requestLimit: number): Promise<RequestPeriodDto> {
    await this.access.managedPeriod(user, periodId);
    return toPeriodDto(await this.periods.setRequestLimit(periodId, requestLimit));
  }

  /** The managers' table: date requests and leave of their units, filtered, sorted and paged. */
  async listRequests(user: AuthUser, query: RequestListQueryDto): Promise<Page<RequestRowDto>> {
    let period: RosterPeriodEntity | null = null;
    if (query.rosterPeriodId) period = await this.access.managedPeriod(user, query.rosterPeriodId);
    const ids = await this.access.readableStaffIds(user, query.unitId ?? period?.unitId);
    const rows: RequestRowDto[] = [];
    if (ids.length && query.type !== 'leave' && (!query.status || query.status === 'submitted')) {
      const dates = await this.dtos.dateRequests(
        await this.m.find(DateRequestEntity, {
          where: { staffMemberId: In(ids), ...(period ? { rosterPeriodId: period.id } : {}) },
        }),
      );
      rows.push(
        ...dates.map((r): RequestRowDto => ({
          id: r.id,
          type: 'date',
          staffMemberId: r.staffMemberId,
          staffName: r.staffName,
          unitId: r.unitId,
          rosterPeriodId: r.rosterPeriodId,
          startDate: r.date,
          endDate: r.date,
          kind: r.kind,
          shiftTypeCode: r.shiftTypeCode,
          note: r.note,
          status: 'submitted',
          createdAt: r.createdAt,
        })),
      );
    }
    if (ids.length && query.type !== 'date' && query.status !== 'submitted') {
      const qb = this.m
        .createQueryBuilder(LeaveRequestEntity, 'l')
        .where('l.staffMemberId IN (:...ids)', { ids });
      if (query.status) qb.andWhere('l.status = :status', { status: query.status });
      if (period) {
        qb.andWhere('l.startDate <= :last AND l.endDate >= :first', {
          first: period.startDate,
          last: addDays(period.startDate, period.days - 1),
        });
      }
      const leave = await this.dtos.leave(await qb.getMany());
      rows.push(
        ...leave.map((l): RequestRowDto => ({
          id: l.id,
          type: 'leave',
          staffMemberId: l.staffMemberId,
          staffName: l.staffName,
          unitId: l.unitId,
          rosterPeriodId: null,
          startDate: l.startDate,
          endDate: l.endDate,
          kind: l.type,
          shiftTypeCode: null,
          note: l.note,
          status: l.status,
          createdAt: l.createdAt,
        })),
      );
    }
    const q = query.q?.toLowerCase();
    const filtered = q
      ? rows.filter((r) => r.staffName.toLowerCase().includes(q) || (r.note ?? '').toLowerCase().includes(q))
      : rows;
    const sort = query.sort ?? 'startDate';
    const dir = query.order === 'desc' ? -1 : 1;
    filtered.sort(
      (a, b) =>
        dir * a[sort].localeCompare(b[sort]) ||
        a.startDate.localeCompare(b.startDate) ||
        a.staffName.localeCompare(b.staffName) ||
        a.id.localeCompare(b.id),
    );
    const start = (query.page - 1) * query.pageSize;
    return toPage(filtered.slice(start, start + query.pageSize), filtered.length, query);
  }
}
