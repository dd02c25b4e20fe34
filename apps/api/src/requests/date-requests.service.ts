import {
  BadRequestException,
  ConflictException,
  ForbiddenException,
  Injectable,
  NotFoundException,
} from '@nestjs/common';
import { type DateRequestDto, type Page } from '@rotaplex/contracts';
import { DataSource, type EntityManager, In } from 'typeorm';
import { type AuthUser } from '../common/auth-user';
import { addDays, isRealDate } from '../common/dates';
import { dateInWords, dateRangeInWords } from '../common/text/date-words';
import { type RosterPeriodEntity } from '../roster-periods/roster-period.entity';
import { RosterPeriodsService } from '../roster-periods/roster-periods.service';
import { ShiftTypesService } from '../shift-types/shift-types.service';
import {
  type CreateDateRequestDto,
  type DateRequestQueryDto,
  type UpdateDateRequestDto,
} from './dto/requests.dto';
import { RequestAccess } from './request-access';
import { cleanNote, emptyPage, RequestDtos } from './request-dtos';
import { DateRequestEntity } from './requests.entities';

/**
 * Date requests (a day off, a shift on, a shift off) on a draft period: the staff member's own,
 * within the period's limit, one a day, for today or later in the unit's time zone.
 */
@Injectable()
export class DateRequestsService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly access: RequestAccess,
    private readonly dtos: RequestDtos,
    private readonly shiftTypes: ShiftTypesService,
    private readonly periods: RosterPeriodsService,
  ) {}

  private get m(): EntityManager {
    return this.dataSource.manager;
  }

  async list(user: AuthUser, query: DateRequestQueryDto): Promise<Page<DateRequestDto>> {
    let ids = await this.access.readableStaffIds(user, query.unitId);
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
    return { items: await this.dtos.dateRequests(rows), total, page: query.page, pageSize: query.pageSize };
  }

  async create(user: AuthUser, body: CreateDateRequestDto): Promise<DateRequestDto> {
    const period = await this.access.periodOrFail(body.rosterPeriodId);
    const staff = (await this.access.myStaff(user)).find((s) => s.unitId === period.unitId);
    if (!staff)
      throw new ForbiddenException(
        'You are not on the roster of this unit, so you cannot make requests for it',
      );
    const shiftTypeId = await this.validate(period, body.date, body.kind, body.shiftTypeId ?? null, true);
    const saved = await this.dataSource.transaction(async (em) => {
      const fresh = await this.periods.byIdOrFail(period.id, em);
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
    return (await this.dtos.dateRequests([saved]))[0];
  }

  async update(user: AuthUser, id: string, body: UpdateDateRequestDto): Promise<DateRequestDto> {
    const row = await this.m.findOneBy(DateRequestEntity, { id });
    if (!row) throw new NotFoundException('Date request not found');
    await this.access.ownStaff(user, row.staffMemberId);
    const period = await this.access.periodOrFail(row.rosterPeriodId);
    const date = body.date ?? row.date;
    const kind = body.kind ?? row.kind;
    const shift =
      body.shiftTypeId !== undefined ? body.shiftTypeId : body.kind === 'dayOff' ? null : row.shiftTypeId;
    const shiftTypeId = await this.validate(period, date, kind, shift, date !== row.date);
    const saved = await this.dataSource.transaction(async (em) => {
      assertDraft(await this.periods.byIdOrFail(period.id, em));
      if (date !== row.date) await assertFreeDate(em, period.id, row.staffMemberId, date);
      row.date = date;
      row.kind = kind;
      row.shiftTypeId = shiftTypeId;
      if (body.note !== undefined) row.note = cleanNote(body.note);
      return em.save(row);
    });
    return (await this.dtos.dateRequests([saved]))[0];
  }

  async delete(user: AuthUser, id: string): Promise<void> {
    const row = await this.m.findOneBy(DateRequestEntity, { id });
    if (!row) throw new NotFoundException('Date request not found');
    await this.access.ownStaff(user, row.staffMemberId);
    await this.dataSource.transaction(async (em) => {
      assertDraft(await this.periods.byIdOrFail(row.rosterPeriodId, em));
      await em.delete(DateRequestEntity, { id });
    });
  }

  /** Checks the date lies in the period and the shift type fits the kind; returns the shift type id to store. */
  private async validate(
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
      const today = await this.access.unitToday(period.unitId);
      if (date < today)
        errors.push(`date is in the past: requests are for today (${dateInWords(today)}) or later`);
    }
    if (kind === 'dayOff') {
      if (shiftTypeId) errors.push('shiftTypeId must be empty for a day-off request');
    } else if (!shiftTypeId) {
      errors.push(`shiftTypeId is required for a ${kind === 'shiftOn' ? 'shift-on' : 'shift-off'} request`);
    } else if (!(await this.shiftTypes.isOfUnit(shiftTypeId, period.unitId))) {
      errors.push('shiftTypeId must be a shift type of this unit');
    }
    if (errors.length) throw new BadRequestException(errors);
    return kind === 'dayOff' ? null : shiftTypeId;
  }
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
