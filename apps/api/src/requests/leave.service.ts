import {
  BadRequestException,
  ConflictException,
  ForbiddenException,
  Injectable,
  NotFoundException,
} from '@nestjs/common';
import { type LeaveDto, MAX_LEAVE_DAYS, type Page } from '@rotaplex/contracts';
import { DataSource, type EntityManager, In } from 'typeorm';
import { type AuthUser } from '../common/auth-user';
import { daysBetween, isRealDate } from '../common/dates';
import { canAccessUnit } from '../common/unit-scope';
import { dateInWords, dateRangeInWords } from '../common/text/date-words';
import { type StaffMemberEntity } from '../staff/staff-member.entity';
import { type CreateLeaveDto, type LeaveQueryDto } from './dto/requests.dto';
import { RequestAccess } from './request-access';
import { cleanNote, emptyPage, RequestDtos } from './request-dtos';
import { LeaveRequestEntity } from './requests.entities';

/** Leave: asked for by the staff member (no overlap, today or later), withdrawn by them, decided by a manager. */
@Injectable()
export class LeaveService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly access: RequestAccess,
    private readonly dtos: RequestDtos,
  ) {}

  private get m(): EntityManager {
    return this.dataSource.manager;
  }

  async list(user: AuthUser, query: LeaveQueryDto): Promise<Page<LeaveDto>> {
    let ids = await this.access.readableStaffIds(user, query.unitId);
    if (query.staffMemberId) ids = ids.filter((id) => id === query.staffMemberId);
    if (!ids.length) return emptyPage(query);
    const [rows, total] = await this.m.findAndCount(LeaveRequestEntity, {
      where: { staffMemberId: In(ids), ...(query.status ? { status: query.status } : {}) },
      order: { startDate: 'ASC', createdAt: 'ASC', id: 'ASC' },
      skip: (query.page - 1) * query.pageSize,
      take: query.pageSize,
    });
    return { items: await this.dtos.leave(rows), total, page: query.page, pageSize: query.pageSize };
  }

  async create(user: AuthUser, body: CreateLeaveDto): Promise<LeaveDto> {
    let staff: StaffMemberEntity;
    if (body.staffMemberId) staff = await this.access.ownStaff(user, body.staffMemberId);
    else {
      const mine = await this.access.myStaff(user);
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
      const today = await this.access.unitToday(staff.unitId);
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
    return (await this.dtos.leave([saved]))[0];
  }

  /** The staff member withdraws their own pending or approved leave. */
  async cancel(user: AuthUser, id: string): Promise<LeaveDto> {
    const row = await this.m.findOneBy(LeaveRequestEntity, { id });
    if (!row) throw new NotFoundException('Leave request not found');
    await this.access.ownStaff(user, row.staffMemberId);
    const saved = await this.dataSource.transaction(async (em) => {
      const fresh = await em.findOneByOrFail(LeaveRequestEntity, { id });
      if (fresh.status !== 'pending' && fresh.status !== 'approved') {
        throw new ConflictException(`This leave is already ${fresh.status}`);
      }
      fresh.status = 'cancelled';
      return em.save(fresh);
    });
    return (await this.dtos.leave([saved]))[0];
  }

  async decide(user: AuthUser, id: string, approve: boolean, note?: string | null): Promise<LeaveDto> {
    const row = await this.m.findOneBy(LeaveRequestEntity, { id });
    if (!row) throw new NotFoundException('Leave request not found');
    const staff = await this.access.staffOrFail(row.staffMemberId);
    if (!canAccessUnit(user, staff.unitId) || !(await this.access.inOrg(user, staff.unitId))) {
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
    return (await this.dtos.leave([saved]))[0];
  }
}
