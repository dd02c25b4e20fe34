import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import {
  type LateChangesDto,
  NOTICE_WINDOW_CAUTION,
  type Page,
  type RosterPeriodDto,
} from '@rotaplex/contracts';
import { DataSource, type EntityManager, In, Not, Repository } from 'typeorm';
import { type AuthUser } from '../common/auth-user';
import { assertUnitAccess, visibleUnitIds } from '../common/unit-scope';
import { addDays, isRealDate } from '../common/dates';
import { OrganisationService } from '../organisation/organisation.service';
import { UnitEntity } from '../units/unit.entity';
import { UnitsService } from '../units/units.service';
import {
  type CreateRosterPeriodDto,
  type RosterPeriodQueryDto,
  type UpdateRosterPeriodDto,
} from './dto/roster-period.dto';
import { LateChangeEntity } from './late-change.entity';
import { owedPerPerson, toLateChangeDto } from './notice-window';
import { RosterPeriodEntity } from './roster-period.entity';

/** Staff see only published and archived periods; drafts are for planners. */
const STAFF_STATUSES = ['published', 'archived'] as const;

@Injectable()
export class RosterPeriodsService {
  constructor(
    @InjectRepository(RosterPeriodEntity) private readonly periods: Repository<RosterPeriodEntity>,
    private readonly units: UnitsService,
    private readonly dataSource: DataSource,
    private readonly organisation: OrganisationService,
  ) {}

  /** A page of the periods the caller may see, newest first. */
  async list(user: AuthUser, query: RosterPeriodQueryDto): Promise<Page<RosterPeriodDto>> {
    if (query.unitId) await this.units.get(user, query.unitId);
    const qb = this.periods
      .createQueryBuilder('p')
      .innerJoin(UnitEntity, 'unit', 'unit.id = p.unitId')
      .where('unit.organisationId = :org', { org: user.organisationId });
    const visible = visibleUnitIds(user);
    if (visible !== null) {
      if (!visible.length) return { items: [], total: 0, page: query.page, pageSize: query.pageSize };
      qb.andWhere('p.unitId IN (:...visible)', { visible });
    }
    if (query.unitId) qb.andWhere('p.unitId = :unitId', { unitId: query.unitId });
    if (query.status) qb.andWhere('p.status = :status', { status: query.status });
    if (user.role === 'staff') qb.andWhere('p.status IN (:...staff)', { staff: STAFF_STATUSES });
    const [rows, total] = await qb
      .orderBy('p.startDate', 'DESC')
      .addOrderBy('p.id', 'ASC')
      .skip((query.page - 1) * query.pageSize)
      .take(query.pageSize)
      .getManyAndCount();
    return { items: rows.map(toRosterPeriodDto), total, page: query.page, pageSize: query.pageSize };
  }

  async get(user: AuthUser, id: string): Promise<RosterPeriodDto> {
    return toRosterPeriodDto(await this.load(user, id));
  }

  /** A period by id, with no access check (the caller checks), read in `em`'s transaction when given. */
  byId(id: string, em: EntityManager = this.dataSource.manager): Promise<RosterPeriodEntity | null> {
    return em.findOneBy(RosterPeriodEntity, { id });
  }

  /** A period by id; TypeORM's EntityNotFoundError when there is none. */
  byIdOrFail(id: string, em: EntityManager = this.dataSource.manager): Promise<RosterPeriodEntity> {
    return em.findOneByOrFail(RosterPeriodEntity, { id });
  }

  /**
   * The organisation's published periods that start on or after `earliest`, of the given units
   * (`unitIds` null: every unit), or only the period `periodId` when given; by start date, then id.
   */
  publishedOfOrganisation(
    organisationId: string,
    filter: { earliest: string; unitIds: readonly string[] | null; periodId?: string },
    em: EntityManager = this.dataSource.manager,
  ): Promise<RosterPeriodEntity[]> {
    if (filter.unitIds?.length === 0) return Promise.resolve([]);
    const qb = em
      .createQueryBuilder(RosterPeriodEntity, 'p')
      .innerJoin(UnitEntity, 'unit', 'unit.id = p.unitId')
      .where('unit.organisationId = :org AND p.status = :published', {
        org: organisationId,
        published: 'published',
      })
      .andWhere('p.startDate >= :earliest', { earliest: filter.earliest });
    if (filter.unitIds) qb.andWhere('p.unitId IN (:...visible)', { visible: filter.unitIds });
    if (filter.periodId) qb.andWhere('p.id = :periodId', { periodId: filter.periodId });
    return qb.orderBy('p.startDate', 'ASC').addOrderBy('p.id', 'ASC').getMany();
  }

  /**
   * Marks the draft period published at `publishedAt`, in `em`'s transaction, if it is still a
   * draft at `version`; answers whether it did (no access or content checks: the publisher makes them).
   */
  async markPublished(em: EntityManager, id: string, version: number, publishedAt: Date): Promise<boolean> {
    const updated = await em
      .createQueryBuilder()
      .update(RosterPeriodEntity)
      .set({ status: 'published', publishedAt })
      .where(`id = :id AND version = :version AND status = 'draft'`, { id, version })
      .execute();
    return updated.affected === 1;
  }

  /**
   * Sets how many date requests each person may make in the period (no access check: the caller
   * checks), in `em`'s transaction when given, else in one of its own; 409 unless the period is a
   * draft. Answers the saved period.
   */
  async setRequestLimit(id: string, requestLimit: number, em?: EntityManager): Promise<RosterPeriodEntity> {
    if (!em) return this.dataSource.transaction((tx) => this.setRequestLimit(id, requestLimit, tx));
    const period = await em.findOneByOrFail(RosterPeriodEntity, { id });
    if (period.status !== 'draft') {
      throw new ConflictException(
        `The request limit can only be changed on a draft period; this one is ${period.status}`,
      );
    }
    period.requestLimit = requestLimit;
    return em.save(period);
  }

  /** The draft and published periods of the given units, earliest first. */
  async openOfUnits(
    unitIds: string[],
    em: EntityManager = this.dataSource.manager,
  ): Promise<RosterPeriodEntity[]> {
    if (!unitIds.length) return [];
    return em.find(RosterPeriodEntity, {
      where: { unitId: In(unitIds), status: In(['draft', 'published']) },
      order: { startDate: 'ASC' },
    });
  }

  /**
   * The period's changes made inside the notice window after publishing, newest first, with the
   * predictability pay recorded per person and the organisation's setting as it is now.
   */
  async lateChanges(user: AuthUser, id: string): Promise<LateChangesDto> {
    const period = await this.load(user, id); // 404 / 403 by unit
    const em = this.dataSource.manager;
    const rows = await em.find(LateChangeEntity, {
      where: { rosterPeriodId: period.id },
      order: { version: 'DESC', date: 'ASC', staffName: 'ASC', id: 'ASC' },
    });
    return {
      rosterPeriodId: period.id,
      settings: await this.organisation.noticeWindow(user.organisationId),
      changes: rows.map(toLateChangeDto),
      owed: owedPerPerson(rows),
      caution: NOTICE_WINDOW_CAUTION,
    };
  }

  async create(user: AuthUser, body: CreateRosterPeriodDto): Promise<RosterPeriodDto> {
    await this.units.get(user, body.unitId);
    assertRealDate(body.startDate);
    const saved = await this.dataSource.transaction(async (em) => {
      await assertNoOverlap(em, body.unitId, body.startDate, body.days);
      return em.save(
        em.create(RosterPeriodEntity, {
          unitId: body.unitId,
          startDate: body.startDate,
          days: body.days,
          status: 'draft',
          publishedAt: null,
        }),
      );
    });
    return toRosterPeriodDto(saved);
  }

  /** Changes dates of a draft only; `version`, when given, must match (optimistic locking). */
  async update(user: AuthUser, id: string, body: UpdateRosterPeriodDto): Promise<RosterPeriodDto> {
    await this.load(user, id);
    if (body.startDate !== undefined) assertRealDate(body.startDate);
    const saved = await this.dataSource.transaction(async (em) => {
      const period = await em.findOneByOrFail(RosterPeriodEntity, { id });
      if (period.status !== 'draft') {
        throw new ConflictException(`Only a draft period can be changed; this one is ${period.status}`);
      }
      if (body.version !== undefined && body.version !== period.version) {
        throw new ConflictException(
          `The period was changed meanwhile (version ${period.version}, not ${body.version}): reload it`,
        );
      }
      const startDate = body.startDate ?? period.startDate;
      const days = body.days ?? period.days;
      await assertNoOverlap(em, period.unitId, startDate, days, id);
      period.startDate = startDate;
      period.days = days;
      return em.save(period);
    });
    return toRosterPeriodDto(saved);
  }

  async archive(user: AuthUser, id: string): Promise<RosterPeriodDto> {
    const period = await this.load(user, id);
    if (period.status === 'archived') throw new ConflictException('The period is already archived');
    period.status = 'archived';
    return toRosterPeriodDto(await this.periods.save(period));
  }

  /** Deletes a draft; published and archived periods stay on record (409). */
  async remove(user: AuthUser, id: string): Promise<void> {
    const period = await this.load(user, id);
    if (period.status !== 'draft') {
      throw new ConflictException(`Only a draft period can be deleted; this one is ${period.status}`);
    }
    await this.periods.delete({ id });
  }

  private async load(user: AuthUser, id: string): Promise<RosterPeriodEntity> {
    const period = await this.periods
      .createQueryBuilder('p')
      .innerJoin(UnitEntity, 'unit', 'unit.id = p.unitId')
      .where('p.id = :id AND unit.organisationId = :org', { id, org: user.organisationId })
      .getOne();
    if (!period) throw new NotFoundException('Roster period not found');
    assertUnitAccess(user, period.unitId);
    if (user.role === 'staff' && period.status === 'draft')
      throw new NotFoundException('Roster period not found');
    return period;
  }
}

function assertRealDate(date: string): void {
  if (!isRealDate(date)) throw new BadRequestException(['startDate must be a real calendar date']);
}

/** Refuses (409) a period that shares a day with another non-archived period of the unit. */
async function assertNoOverlap(
  em: EntityManager,
  unitId: string,
  startDate: string,
  days: number,
  exceptId?: string,
): Promise<void> {
  const end = addDays(startDate, days); // exclusive
  const others = await em.findBy(RosterPeriodEntity, {
    unitId,
    status: In(['draft', 'published']),
    ...(exceptId ? { id: Not(exceptId) } : {}),
  });
  const clash = others.find((o) => o.startDate < end && startDate < addDays(o.startDate, o.days));
  if (clash) {
    throw new ConflictException(
      `The period overlaps the ${clash.status} period from ${clash.startDate} to ${addDays(clash.startDate, clash.days - 1)}`,
    );
  }
}

export function toRosterPeriodDto(p: RosterPeriodEntity): RosterPeriodDto {
  return {
    id: p.id,
    unitId: p.unitId,
    startDate: p.startDate,
    days: p.days,
    status: p.status,
    createdAt: p.createdAt.toISOString(),
    publishedAt: p.publishedAt ? p.publishedAt.toISOString() : null,
    version: p.version,
  };
}
