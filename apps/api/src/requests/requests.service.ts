import {
  BadRequestException,
  ConflictException,
  ForbiddenException,
  Injectable,
  NotFoundException,
} from '@nestjs/common';
import {
  type AvailabilityDto,
  type DateRequestDto,
  hasPermission,
  type LeaveDto,
  MAX_LEAVE_DAYS,
  type MyRequestsDto,
  type Page,
  type PeriodRequestsDto,
  type RequestPeriodDto,
  type RequestRowDto,
} from '@rotaplex/contracts';
import { DataSource, type EntityManager, In } from 'typeorm';
import { type AuthUser } from '../common/auth-user';
import { toPage } from '../common/pagination';
import { canAccessUnit, visibleUnitIds } from '../common/unit-scope';
import { RosterPeriodEntity } from '../roster-periods/roster-period.entity';
import { addDays } from '../roster-periods/roster-periods.service';
import { ShiftTypeEntity } from '../shift-types/shift-type.entity';
import { StaffMemberEntity } from '../staff/staff-member.entity';
import { UnitEntity } from '../units/unit.entity';
import { dateInWords, dateRangeInWords } from '../common/text/date-words';
import { localDate } from '../common/dates';
import { UserEntity } from '../users/user.entity';
import {
  type CreateDateRequestDto,
  type CreateLeaveDto,
  type DateRequestQueryDto,
  type LeaveQueryDto,
  type ReplaceAvailabilityDto,
  type RequestListQueryDto,
  type UpdateDateRequestDto,
} from './dto/requests.dto';
import { AvailabilityCellEntity, DateRequestEntity, LeaveRequestEntity } from './requests.entities';

/** A real calendar date "YYYY-MM-DD" (not 2030-02-30). */
export function isRealDate(date: string): boolean {
  const d = new Date(`${date}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === date;
}

/** Days from `a` to `b` ("YYYY-MM-DD"), b - a. */
export function daysBetween(a: string, b: string): number {
  return Math.round((Date.parse(`${b}T00:00:00Z`) - Date.parse(`${a}T00:00:00Z`)) / 86_400_000);
}

const iso = (d: Date | null): string | null => (d ? d.toISOString() : null);
const cleanNote = (note: string | null | undefined): string | null => {
  const t = note?.trim();
  return t ? t : null;
};

/**
 * Availability, date requests and leave. A staff member sees and changes only their own (the staff
 * members whose userId is the caller); managers read everything of their units and decide leave.
 */
@Injectable()
export class RequestsService {
  constructor(private readonly dataSource: DataSource) {}

  private get m(): EntityManager {
    return this.dataSource.manager;
  }

  // ------------------------------------------------------------ who is who

  /** Whether the caller reads other people's requests in the units they manage. */
  private isApprover(user: AuthUser): boolean {
    return hasPermission(user.role, 'requests:approve');
  }

  private async staffOrFail(id: string): Promise<StaffMemberEntity> {
    const staff = await this.m.findOneBy(StaffMemberEntity, { id });
    if (!staff) throw new NotFoundException('Staff member not found');
    return staff;
  }

  /** The caller's own staff member `id`; 403 for anyone else's. */
  private async ownStaff(user: AuthUser, id: string): Promise<StaffMemberEntity> {
    const staff = await this.staffOrFail(id);
    if (staff.userId !== user.id) throw new ForbiddenException('You can only change your own requests');
    return staff;
  }

  /** Readable by the person themselves, or by an approver with access to the unit. */
  private async readableStaff(user: AuthUser, id: string): Promise<StaffMemberEntity> {
    const staff = await this.staffOrFail(id);
    if (staff.userId === user.id) return staff;
    if (this.isApprover(user) && canAccessUnit(user, staff.unitId) && (await this.inOrg(user, staff.unitId)))
      return staff;
    throw new ForbiddenException("You cannot see this person's requests");
  }

  private async inOrg(user: AuthUser, unitId: string): Promise<boolean> {
    return (await this.m.countBy(UnitEntity, { id: unitId, organisationId: user.organisationId })) > 0;
  }

  /** The caller's own active staff memberships (an inactive one takes no new requests). */
  private async myStaff(user: AuthUser): Promise<StaffMemberEntity[]> {
    return this.m.find(StaffMemberEntity, {
      where: { userId: user.id, active: true },
      order: { name: 'ASC' },
    });
  }

  /** Staff member ids whose requests the caller may read (null: none beyond the unit filter). */
  private async readableStaffIds(user: AuthUser, unitId?: string): Promise<string[]> {
    if (unitId && !canAccessUnit(user, unitId))
      throw new ForbiddenException('You do not have access to this unit');
    if (!this.isApprover(user)) {
      return (await this.myStaff(user)).filter((s) => !unitId || s.unitId === unitId).map((s) => s.id);
    }
    const visible = visibleUnitIds(user);
    const units = await this.m.findBy(UnitEntity, {
      organisationId: user.organisationId,
      ...(unitId ? { id: unitId } : visible !== null ? { id: In(visible) } : {}),
    });
    if (!units.length) return [];
    const staff = await this.m.findBy(StaffMemberEntity, { unitId: In(units.map((u) => u.id)) });
    return staff.map((s) => s.id);
  }

  private async periodOrFail(id: string): Promise<RosterPeriodEntity> {
    const period = await this.m.findOneBy(RosterPeriodEntity, { id });
    if (!period) throw new NotFoundException('Roster period not found');
    return period;
  }

  /** A period of a unit the caller manages (planners and approvers). */
  private async managedPeriod(user: AuthUser, id: string): Promise<RosterPeriodEntity> {
    const period = await this.periodOrFail(id);
    if (!canAccessUnit(user, period.unitId) || !(await this.inOrg(user, period.unitId))) {
      throw new ForbiddenException('You do not have access to this unit');
    }
    return period;
  }

  // ------------------------------------------------------------ the caller's own

  async mine(user: AuthUser): Promise<MyRequestsDto> {
    const staff = await this.myStaff(user);
    const ids = staff.map((s) => s.id);
    const unitIds = [...new Set(staff.map((s) => s.unitId))];
    const units = unitIds.length ? await this.m.findBy(UnitEntity, { id: In(unitIds) }) : [];
    const unitById = new Map(units.map((u) => [u.id, u]));
    const periods = unitIds.length
      ? await this.m.find(RosterPeriodEntity, {
          where: { unitId: In(unitIds), status: In(['draft', 'published']) },
          order: { startDate: 'ASC' },
        })
      : [];
    return {
      staffMembers: staff.map((s) => ({
        id: s.id,
        name: s.name,
        unitId: s.unitId,
        unitName: unitById.get(s.unitId)?.name ?? '',
        timeZone: unitById.get(s.unitId)?.timeZone ?? 'UTC',
      })),
      periods: periods.map(toPeriodDto),
      dateRequests: ids.length
        ? await this.dateRequestDtos(
            await this.m.find(DateRequestEntity, {
              where: { staffMemberId: In(ids) },
              order: { date: 'ASC' },
            }),
          )
        : [],
      leave: ids.length
        ? await this.leaveDtos(
            await this.m.find(LeaveRequestEntity, {
              where: { staffMemberId: In(ids) },
              order: { startDate: 'ASC' },
            }),
          )
        : [],
    };
  }

  // ------------------------------------------------------------ availability

  async getAvailability(user: AuthUser, staffMemberId: string): Promise<AvailabilityDto> {
    await this.readableStaff(user, staffMemberId);
    return this.availabilityOf(staffMemberId);
  }

  private async availabilityOf(staffMemberId: string): Promise<AvailabilityDto> {
    const cells = await this.m.find(AvailabilityCellEntity, {
      where: { staffMemberId },
      order: { weekday: 'ASC', part: 'ASC' },
    });
    return {
      staffMemberId,
      cells: cells.map((c) => ({ weekday: c.weekday, part: c.part, status: c.status })),
    };
  }

  async replaceAvailability(
    user: AuthUser,
    staffMemberId: string,
    body: ReplaceAvailabilityDto,
  ): Promise<AvailabilityDto> {
    await this.ownStaff(user, staffMemberId);
    const seen = new Set<string>();
    for (const c of body.cells) {
      const key = `${c.weekday}|${c.part}`;
      if (seen.has(key)) {
        throw new BadRequestException([`cells has weekday ${c.weekday}, part ${c.part} more than once`]);
      }
      seen.add(key);
    }
    await this.dataSource.transaction(async (em) => {
      await em.delete(AvailabilityCellEntity, { staffMemberId });
      const rows = body.cells.filter((c) => c.status !== 'available');
      if (rows.length) {
        await em.insert(
          AvailabilityCellEntity,
          rows.map((c) => ({ staffMemberId, weekday: c.weekday, part: c.part, status: c.status })),
        );
      }
    });
    return this.availabilityOf(staffMemberId);
  }

  // ------------------------------------------------------------ date requests

  async listDateRequests(user: AuthUser, query: DateRequestQueryDto): Promise<Page<DateRequestDto>> {
    let ids = await this.readableStaffIds(user, query.unitId);
    if (query.staffMemberId) ids = ids.filter((id) => id === query.staffMemberId);
    if (!ids.length) return emptyPage(query);
    const [rows, total] = await this.m.findAndCount(DateRequestEntity, {
      where: {
        staffMemberId: In(ids),
        ...(query.rosterPeriodId ? { rosterPeriodId: query.rosterPeriodId } : {}),
      },
      order: { date: 'ASC', createdAt: 'ASC', id: 'ASC' },
      skip: (query.page - 1) * query.pageSize,
      take: query.pageSize,
    });
    return { items: await this.dateRequestDtos(rows), total, page: query.page, pageSize: query.pageSize };
  }

  async createDateRequest(user: AuthUser, body: CreateDateRequestDto): Promise<DateRequestDto> {
    const period = await this.periodOrFail(body.rosterPeriodId);
    const staff = (await this.myStaff(user)).find((s) => s.unitId === period.unitId);
    if (!staff)
      throw new ForbiddenException(
        'You are not on the roster of this unit, so you cannot make requests for it',
      );
    const shiftTypeId = await this.validateDateRequest(
      period,
      body.date,
      body.kind,
      body.shiftTypeId ?? null,
      true,
    );
    const saved = await this.dataSource.transaction(async (em) => {
      const fresh = await em.findOneByOrFail(RosterPeriodEntity, { id: period.id });
      assertDraft(fresh);
      const used = await em.countBy(DateRequestEntity, {
        rosterPeriodId: period.id,
        staffMemberId: staff.id,
      });
      if (used >= fresh.requestLimit) {
        throw new ConflictException(
          `You have reached the limit of ${fresh.requestLimit} date request${fresh.requestLimit === 1 ? '' : 's'} for this period; change or delete one of yours first`,
        );
      }
      await assertFreeDate(em, period.id, staff.id, body.date);
      return em.save(
        em.create(DateRequestEntity, {
          rosterPeriodId: period.id,
          staffMemberId: staff.id,
          date: body.date,
          kind: body.kind,
          shiftTypeId,
          note: cleanNote(body.note),
        }),
      );
    });
    return (await this.dateRequestDtos([saved]))[0];
  }

  async updateDateRequest(user: AuthUser, id: string, body: UpdateDateRequestDto): Promise<DateRequestDto> {
    const row = await this.m.findOneBy(DateRequestEntity, { id });
    if (!row) throw new NotFoundException('Date request not found');
    await this.ownStaff(user, row.staffMemberId);
    const period = await this.periodOrFail(row.rosterPeriodId);
    const date = body.date ?? row.date;
    const kind = body.kind ?? row.kind;
    const shift =
      body.shiftTypeId !== undefined ? body.shiftTypeId : body.kind === 'dayOff' ? null : row.shiftTypeId;
    const shiftTypeId = await this.validateDateRequest(period, date, kind, shift, date !== row.date);
    const saved = await this.dataSource.transaction(async (em) => {
      assertDraft(await em.findOneByOrFail(RosterPeriodEntity, { id: period.id }));
      if (date !== row.date) await assertFreeDate(em, period.id, row.staffMemberId, date);
      row.date = date;
      row.kind = kind;
      row.shiftTypeId = shiftTypeId;
      if (body.note !== undefined) row.note = cleanNote(body.note);
      return em.save(row);
    });
    return (await this.dateRequestDtos([saved]))[0];
  }

  async deleteDateRequest(user: AuthUser, id: string): Promise<void> {
    const row = await this.m.findOneBy(DateRequestEntity, { id });
    if (!row) throw new NotFoundException('Date request not found');
    await this.ownStaff(user, row.staffMemberId);
    await this.dataSource.transaction(async (em) => {
      assertDraft(await em.findOneByOrFail(RosterPeriodEntity, { id: row.rosterPeriodId }));
      await em.delete(DateRequestEntity, { id });
    });
  }

  /** Today in the unit's time zone, "YYYY-MM-DD". */
  private async unitToday(unitId: string): Promise<string> {
    const unit = await this.m.findOneBy(UnitEntity, { id: unitId });
    return localDate(new Date(), unit?.timeZone ?? 'UTC');
  }

  /** Checks the date lies in the period and the shift type fits the kind; returns the shift type id to store. */
  private async validateDateRequest(
    period: RosterPeriodEntity,
    date: string,
    kind: string,
    shiftTypeId: string | null,
    newDate: boolean,
  ): Promise<string | null> {
    assertDraft(period);
    const errors: string[] = [];
    const last = addDays(period.startDate, period.days - 1);
    if (!isRealDate(date)) errors.push('date must be a real calendar date');
    else if (date < period.startDate || date > last) {
      errors.push(`date must be a day of the period (${dateRangeInWords(period.startDate, last)})`);
    } else if (newDate) {
      const today = await this.unitToday(period.unitId);
      if (date < today)
        errors.push(`date is in the past: requests are for today (${dateInWords(today)}) or later`);
    }
    if (kind === 'dayOff') {
      if (shiftTypeId) errors.push('shiftTypeId must be empty for a day-off request');
    } else if (!shiftTypeId) {
      errors.push(`shiftTypeId is required for a ${kind === 'shiftOn' ? 'shift-on' : 'shift-off'} request`);
    } else if (!(await this.m.countBy(ShiftTypeEntity, { id: shiftTypeId, unitId: period.unitId }))) {
      errors.push('shiftTypeId must be a shift type of this unit');
    }
    if (errors.length) throw new BadRequestException(errors);
    return kind === 'dayOff' ? null : shiftTypeId;
  }

  private async dateRequestDtos(rows: DateRequestEntity[]): Promise<DateRequestDto[]> {
    const staff = await this.staffByIds(rows.map((r) => r.staffMemberId));
    const shiftIds = [...new Set(rows.map((r) => r.shiftTypeId).filter((s): s is string => s !== null))];
    const shifts = new Map(
      (shiftIds.length ? await this.m.findBy(ShiftTypeEntity, { id: In(shiftIds) }) : []).map((s) => [
        s.id,
        s,
      ]),
    );
    return rows.map((r) => ({
      id: r.id,
      rosterPeriodId: r.rosterPeriodId,
      staffMemberId: r.staffMemberId,
      staffName: staff.get(r.staffMemberId)?.name ?? '',
      unitId: staff.get(r.staffMemberId)?.unitId ?? '',
      date: r.date,
      kind: r.kind,
      shiftTypeId: r.shiftTypeId,
      shiftTypeCode: r.shiftTypeId ? (shifts.get(r.shiftTypeId)?.code ?? null) : null,
      note: r.note,
      createdAt: r.createdAt.toISOString(),
    }));
  }

  private async staffByIds(ids: string[]): Promise<Map<string, StaffMemberEntity>> {
    const unique = [...new Set(ids)];
    return new Map(
      (unique.length ? await this.m.findBy(StaffMemberEntity, { id: In(unique) }) : []).map((s) => [s.id, s]),
    );
  }

  // ------------------------------------------------------------ leave

  async listLeave(user: AuthUser, query: LeaveQueryDto): Promise<Page<LeaveDto>> {
    let ids = await this.readableStaffIds(user, query.unitId);
    if (query.staffMemberId) ids = ids.filter((id) => id === query.staffMemberId);
    if (!ids.length) return emptyPage(query);
    const [rows, total] = await this.m.findAndCount(LeaveRequestEntity, {
      where: { staffMemberId: In(ids), ...(query.status ? { status: query.status } : {}) },
      order: { startDate: 'ASC', createdAt: 'ASC', id: 'ASC' },
      skip: (query.page - 1) * query.pageSize,
      take: query.pageSize,
    });
    return { items: await this.leaveDtos(rows), total, page: query.page, pageSize: query.pageSize };
  }

  async createLeave(user: AuthUser, body: CreateLeaveDto): Promise<LeaveDto> {
    let staff: StaffMemberEntity;
    if (body.staffMemberId) staff = await this.ownStaff(user, body.staffMemberId);
    else {
      const mine = await this.myStaff(user);
      if (!mine.length)
        throw new ForbiddenException('You are not on any roster, so you cannot request leave');
      if (mine.length > 1) {
        throw new BadRequestException([
          'staffMemberId is required: you are on the roster of more than one unit',
        ]);
      }
      staff = mine[0];
    }
    const errors: string[] = [];
    if (!isRealDate(body.startDate)) errors.push('startDate must be a real calendar date');
    if (!isRealDate(body.endDate)) errors.push('endDate must be a real calendar date');
    if (!errors.length) {
      const length = daysBetween(body.startDate, body.endDate) + 1;
      if (length < 1) errors.push('endDate must be on or after startDate');
      else if (length > MAX_LEAVE_DAYS) errors.push(`leave may be at most ${MAX_LEAVE_DAYS} days long`);
      const today = await this.unitToday(staff.unitId);
      if (body.startDate < today) {
        errors.push(`startDate is in the past: leave can start today (${dateInWords(today)}) or later`);
      }
    }
    if (errors.length) throw new BadRequestException(errors);
    const saved = await this.dataSource.transaction(async (em) => {
      const overlapping = await em
        .createQueryBuilder(LeaveRequestEntity, 'l')
        .where('l.staffMemberId = :staff', { staff: staff.id })
        .andWhere('l.status IN (:...open)', { open: ['pending', 'approved'] })
        .andWhere('l.startDate <= :end AND l.endDate >= :start', { start: body.startDate, end: body.endDate })
        .getOne();
      if (overlapping) {
        throw new ConflictException(
          `This leave overlaps your ${overlapping.status} leave from ${dateRangeInWords(overlapping.startDate, overlapping.endDate)}`,
        );
      }
      return em.save(
        em.create(LeaveRequestEntity, {
          staffMemberId: staff.id,
          startDate: body.startDate,
          endDate: body.endDate,
          type: body.type,
          status: 'pending',
          note: cleanNote(body.note),
          decisionNote: null,
          decidedById: null,
          decidedAt: null,
        }),
      );
    });
    return (await this.leaveDtos([saved]))[0];
  }

  /** The staff member withdraws their own pending or approved leave. */
  async cancelLeave(user: AuthUser, id: string): Promise<LeaveDto> {
    const row = await this.m.findOneBy(LeaveRequestEntity, { id });
    if (!row) throw new NotFoundException('Leave request not found');
    await this.ownStaff(user, row.staffMemberId);
    const saved = await this.dataSource.transaction(async (em) => {
      const fresh = await em.findOneByOrFail(LeaveRequestEntity, { id });
      if (fresh.status !== 'pending' && fresh.status !== 'approved') {
        throw new ConflictException(`This leave is already ${fresh.status}`);
      }
      fresh.status = 'cancelled';
      return em.save(fresh);
    });
    return (await this.leaveDtos([saved]))[0];
  }

  async decideLeave(user: AuthUser, id: string, approve: boolean, note?: string | null): Promise<LeaveDto> {
    const row = await this.m.findOneBy(LeaveRequestEntity, { id });
    if (!row) throw new NotFoundException('Leave request not found');
    const staff = await this.staffOrFail(row.staffMemberId);
    if (!canAccessUnit(user, staff.unitId) || !(await this.inOrg(user, staff.unitId))) {
      throw new ForbiddenException('You do not have access to this unit');
    }
    const saved = await this.dataSource.transaction(async (em) => {
      const fresh = await em.findOneByOrFail(LeaveRequestEntity, { id });
      if (fresh.status !== 'pending') {
        throw new ConflictException(`Only pending leave can be decided; this one is ${fresh.status}`);
      }
      fresh.status = approve ? 'approved' : 'declined';
      fresh.decisionNote = cleanNote(note);
      fresh.decidedById = user.id;
      fresh.decidedAt = new Date();
      return em.save(fresh);
    });
    return (await this.leaveDtos([saved]))[0];
  }

  private async leaveDtos(rows: LeaveRequestEntity[]): Promise<LeaveDto[]> {
    const staff = await this.staffByIds(rows.map((r) => r.staffMemberId));
    const deciderIds = [...new Set(rows.map((r) => r.decidedById).filter((s): s is string => s !== null))];
    const deciders = new Map(
      (deciderIds.length ? await this.m.findBy(UserEntity, { id: In(deciderIds) }) : []).map((u) => [
        u.id,
        u.displayName,
      ]),
    );
    return rows.map((r) => ({
      id: r.id,
      staffMemberId: r.staffMemberId,
      staffName: staff.get(r.staffMemberId)?.name ?? '',
      unitId: staff.get(r.staffMemberId)?.unitId ?? '',
      startDate: r.startDate,
      endDate: r.endDate,
      type: r.type,
      status: r.status,
      note: r.note,
      decisionNote: r.decisionNote,
      decidedAt: iso(r.decidedAt),
      decidedBy: r.decidedById ? (deciders.get(r.decidedById) ?? null) : null,
      createdAt: r.createdAt.toISOString(),
    }));
  }

  // ------------------------------------------------------------ managers

  async periodRequests(user: AuthUser, periodId: string): Promise<PeriodRequestsDto> {
    const period = await this.managedPeriod(user, periodId);
    const staff = await this.m.findBy(StaffMemberEntity, { unitId: period.unitId });
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
      dateRequests: await this.dateRequestDtos(
        await this.m.find(DateRequestEntity, {
          where: { rosterPeriodId: period.id },
          order: { date: 'ASC' },
        }),
      ),
      leave: await this.leaveDtos(leave),
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
    await this.managedPeriod(user, periodId);
    const saved = await this.dataSource.transaction(async (em) => {
      const period = await em.findOneByOrFail(RosterPeriodEntity, { id: periodId });
      if (period.status !== 'draft') {
        throw new ConflictException(
          `The request limit can only be changed on a draft period; this one is ${period.status}`,
        );
      }
      period.requestLimit = requestLimit;
      return em.save(period);
    });
    return toPeriodDto(saved);
  }

  /** The managers' table: date requests and leave of their units, filtered, sorted and paged. */
  async listRequests(user: AuthUser, query: RequestListQueryDto): Promise<Page<RequestRowDto>> {
    let period: RosterPeriodEntity | null = null;
    if (query.rosterPeriodId) period = await this.managedPeriod(user, query.rosterPeriodId);
    const ids = await this.readableStaffIds(user, query.unitId ?? period?.unitId);
    const rows: RequestRowDto[] = [];
    if (ids.length && query.type !== 'leave' && (!query.status || query.status === 'submitted')) {
      const dates = await this.dateRequestDtos(
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
      const leave = await this.leaveDtos(await qb.getMany());
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

function toPeriodDto(p: RosterPeriodEntity): RequestPeriodDto {
  return {
    id: p.id,
    unitId: p.unitId,
    startDate: p.startDate,
    days: p.days,
    status: p.status,
    requestLimit: p.requestLimit,
  };
}

function assertDraft(period: RosterPeriodEntity): void {
  if (period.status !== 'draft') {
    throw new ConflictException(`Only a draft period takes requests; this one is ${period.status}`);
  }
}

async function assertFreeDate(em: EntityManager, periodId: string, staffMemberId: string, date: string) {
  if (await em.countBy(DateRequestEntity, { rosterPeriodId: periodId, staffMemberId, date })) {
    throw new ConflictException(
      `You already have a request for ${dateInWords(date)}; change or delete it instead`,
    );
  }
}

function emptyPage<T>(query: { page: number; pageSize: number }): Page<T> {
  return { items: [], total: 0, page: query.page, pageSize: query.pageSize };
}
