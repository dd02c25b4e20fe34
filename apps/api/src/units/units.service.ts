import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { PUBLISH_LEAD_DAYS_DEFAULT, type UnitDto } from '@rotaplex/contracts';
import { DataSource, type EntityManager, In, Repository } from 'typeorm';
import { type AuthUser } from '../common/auth-user';
import { assertUnitAccess, visibleUnitIds } from '../common/unit-scope';
import { type CreateUnitDto, type UpdateUnitDto } from './dto/unit.dto';
import { UnitEntity } from './unit.entity';

@Injectable()
export class UnitsService {
  constructor(
    @InjectRepository(UnitEntity) private readonly units: Repository<UnitEntity>,
    private readonly dataSource: DataSource,
  ) {}

  /** Units the caller may see: all for admins, their own for managers and staff. */
  async list(user: AuthUser): Promise<UnitDto[]> {
    const visible = visibleUnitIds(user);
    const rows = await this.units.find({
      where: { organisationId: user.organisationId, ...(visible ? { id: In(visible) } : {}) },
      order: { name: 'ASC' },
    });
    return rows.map(toUnitDto);
  }

  async get(user: AuthUser, id: string): Promise<UnitDto> {
    return toUnitDto(await this.load(user, id));
  }

  async create(user: AuthUser, body: CreateUnitDto): Promise<UnitDto> {
    await this.assertNameFree(user.organisationId, body.name);
    const unit = this.units.create({
      organisationId: user.organisationId,
      name: body.name,
      timeZone: body.timeZone,
      publishLeadDays: body.publishLeadDays ?? PUBLISH_LEAD_DAYS_DEFAULT,
    });
    return toUnitDto(await this.units.save(unit));
  }

  async update(user: AuthUser, id: string, body: UpdateUnitDto): Promise<UnitDto> {
    const unit = await this.load(user, id);
    if (body.name !== undefined && body.name !== unit.name) {
      await this.assertNameFree(user.organisationId, body.name);
      unit.name = body.name;
    }
    if (body.timeZone !== undefined) unit.timeZone = body.timeZone;
    if (body.publishLeadDays !== undefined) unit.publishLeadDays = body.publishLeadDays;
    return toUnitDto(await this.units.save(unit));
  }

  /** Deletes an empty unit; a unit that still has people is refused with 409. */
  async remove(user: AuthUser, id: string): Promise<void> {
    await this.dataSource.transaction(async (em) => {
      const unit = await em.findOneBy(UnitEntity, { id, organisationId: user.organisationId });
      if (!unit) throw new NotFoundException('Unit not found');
      const [{ n }] = await em.query(`SELECT COUNT(*) AS n FROM user_units WHERE "unitId" = ?`, [id]);
      if (Number(n) > 0) {
        throw new ConflictException(
          `Unit "${unit.name}" still has ${n} ${Number(n) === 1 ? 'person' : 'people'}: move them to another unit before deleting it`,
        );
      }
      await em.delete(UnitEntity, { id });
    });
  }

  /** The organisation a unit belongs to (null for an unknown unit), for other modules' access checks. */
  async organisationOf(unitId: string): Promise<string | null> {
    const unit = await this.units.findOne({
      where: { id: unitId },
      select: { id: true, organisationId: true },
    });
    return unit?.organisationId ?? null;
  }

  /** The IANA time zone of a unit (UTC for an unknown unit): the calendar its people live in. */
  async timeZoneOf(unitId: string): Promise<string> {
    const unit = await this.units.findOne({ where: { id: unitId }, select: { id: true, timeZone: true } });
    return unit?.timeZone ?? 'UTC';
  }

  /** Every IANA time zone some unit lives in (for the scheduled expiry of other modules). */
  async timeZonesInUse(): Promise<string[]> {
    const rows = await this.units
      .createQueryBuilder('u')
      .select('DISTINCT u.timeZone', 'timeZone')
      .getRawMany<{ timeZone: string }>();
    return rows.map((r) => r.timeZone);
  }

  /** Units by id, any organisation (for other modules; unknown ids left out). */
  async byIds(ids: string[], em: EntityManager = this.dataSource.manager): Promise<UnitEntity[]> {
    return ids.length ? em.findBy(UnitEntity, { id: In(ids) }) : [];
  }

  /** The units of an organisation, all or only the given ids (for other modules). */
  async ofOrganisation(organisationId: string, ids: string[] | null = null): Promise<UnitEntity[]> {
    return this.units.findBy({ organisationId, ...(ids ? { id: In(ids) } : {}) });
  }

  /** Checks that every id is a unit of the organisation (400 naming unitIds otherwise); returns the entities. */
  async findAllOrFail(organisationId: string, ids: string[]): Promise<UnitEntity[]> {
    const unique = [...new Set(ids)];
    if (!unique.length) return [];
    const rows = await this.units.findBy({ organisationId, id: In(unique) });
    if (rows.length !== unique.length) {
      const known = new Set(rows.map((r) => r.id));
      throw new BadRequestException(
        `unitIds contains an unknown unit: ${unique.filter((i) => !known.has(i)).join(', ')}`,
      );
    }
    return rows;
  }

  private async load(user: AuthUser, id: string): Promise<UnitEntity> {
    const unit = await this.units.findOneBy({ id, organisationId: user.organisationId });
    if (!unit) throw new NotFoundException('Unit not found');
    assertUnitAccess(user, unit.id);
    return unit;
  }

  private async assertNameFree(organisationId: string, name: string): Promise<void> {
    if (await this.units.existsBy({ organisationId, name })) {
      throw new ConflictException(`A unit named "${name}" already exists`);
    }
  }
}

export function toUnitDto(u: UnitEntity): UnitDto {
  return {
    id: u.id,
    name: u.name,
    timeZone: u.timeZone,
    publishLeadDays: u.publishLeadDays,
    createdAt: u.createdAt.toISOString(),
  };
}
