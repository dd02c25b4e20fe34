import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import {
  GUARD_RAIL_DEFERRAL,
  type ShiftTypeDto,
  shiftLengthMinutes,
  shiftTypeCautions,
} from '@rotaplex/contracts';
import { DataSource, type EntityManager, In, Not, Repository } from 'typeorm';
import { type AuthUser } from '../common/auth-user';
import { UnitsService } from '../units/units.service';
import { type CreateShiftTypeDto, type UpdateShiftTypeDto } from './dto/shift-type.dto';
import { ShiftTypeEntity } from './shift-type.entity';

@Injectable()
export class ShiftTypesService {
  constructor(
    @InjectRepository(ShiftTypeEntity) private readonly shiftTypes: Repository<ShiftTypeEntity>,
    private readonly units: UnitsService,
    private readonly dataSource: DataSource,
  ) {}

  async list(user: AuthUser, unitId: string): Promise<ShiftTypeDto[]> {
    await this.units.get(user, unitId); // 404 outside the organisation, 403 outside the caller's units
    const rows = await this.shiftTypes.find({ where: { unitId }, order: { start: 'ASC', code: 'ASC' } });
    return rows.map(toShiftTypeDto);
  }

  async get(user: AuthUser, unitId: string, id: string): Promise<ShiftTypeDto> {
    return toShiftTypeDto(await this.load(user, unitId, id));
  }

  async create(user: AuthUser, unitId: string, body: CreateShiftTypeDto): Promise<ShiftTypeDto> {
    await this.units.get(user, unitId);
    assertPaidWithinLength(body.start, body.end, body.paidMinutes);
    await this.assertCodeFree(unitId, body.code);
    const created = this.shiftTypes.create({ unitId, ...body, night: body.night ?? null });
    return toShiftTypeDto(await this.shiftTypes.save(created));
  }

  async update(user: AuthUser, unitId: string, id: string, body: UpdateShiftTypeDto): Promise<ShiftTypeDto> {
    const shift = await this.load(user, unitId, id);
    const next = { ...shift, ...stripUndefined(body) };
    assertPaidWithinLength(next.start, next.end, next.paidMinutes);
    if (next.code !== shift.code) await this.assertCodeFree(unitId, next.code, id);
    Object.assign(shift, stripUndefined(body));
    return toShiftTypeDto(await this.shiftTypes.save(shift));
  }

  /** Refuses (409) while cover needs use the shift type. */
  async remove(user: AuthUser, unitId: string, id: string): Promise<void> {
    await this.load(user, unitId, id);
    await this.dataSource.transaction(async (em) => {
      const [{ n }] = await em.query(
        `SELECT (SELECT COUNT(*) FROM cover_pattern_rows WHERE "shiftTypeId" = ?)
              + (SELECT COUNT(*) FROM cover_overrides WHERE "shiftTypeId" = ?) AS n`,
        [id, id],
      );
      if (Number(n) > 0) {
        throw new ConflictException('The shift type is used by cover needs: remove those needs first');
      }
      await em.delete(ShiftTypeEntity, { id });
    });
  }

  /** Shift types of a unit by id (for other services). */
  async findForUnit(unitId: string): Promise<ShiftTypeEntity[]> {
    return this.shiftTypes.findBy({ unitId });
  }

  /** Shift types of a unit in the order of the day: by start time, then code (for other services). */
  async inDayOrder(unitId: string): Promise<ShiftTypeEntity[]> {
    return this.shiftTypes.find({ where: { unitId }, order: { start: 'ASC', code: 'ASC' } });
  }

  /** Whether the shift type is one of the unit's (for other services). */
  async isOfUnit(id: string, unitId: string, em: EntityManager = this.dataSource.manager): Promise<boolean> {
    return (await em.countBy(ShiftTypeEntity, { id, unitId })) > 0;
  }

  /** Shift types by id, any unit (for other services; unknown ids left out). */
  async byIds(ids: string[], em: EntityManager = this.dataSource.manager): Promise<ShiftTypeEntity[]> {
    return ids.length ? em.findBy(ShiftTypeEntity, { id: In(ids) }) : [];
  }

  private async load(user: AuthUser, unitId: string, id: string): Promise<ShiftTypeEntity> {
    await this.units.get(user, unitId);
    const shift = await this.shiftTypes.findOneBy({ id, unitId });
    if (!shift) throw new NotFoundException('Shift type not found');
    return shift;
  }

  private async assertCodeFree(unitId: string, code: string, exceptId?: string): Promise<void> {
    if (await this.shiftTypes.existsBy({ unitId, code, ...(exceptId ? { id: Not(exceptId) } : {}) })) {
      throw new ConflictException(`The unit already has a shift type with the code ${code}`);
    }
  }
}

function assertPaidWithinLength(start: string, end: string, paidMinutes: number): void {
  const length = shiftLengthMinutes(start, end);
  if (paidMinutes > length) {
    throw new BadRequestException([
      `paidMinutes must be at most the shift length (${length} minutes from ${start} to ${end})`,
    ]);
  }
}

function stripUndefined<T extends object>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;
}

export function toShiftTypeDto(s: ShiftTypeEntity): ShiftTypeDto {
  return {
    id: s.id,
    unitId: s.unitId,
    code: s.code,
    name: s.name,
    start: s.start,
    end: s.end,
    paidMinutes: s.paidMinutes,
    colour: s.colour,
    night: s.night,
    cautions: cautionsOf(s),
  };
}

function cautionsOf(s: Pick<ShiftTypeEntity, 'start' | 'end'>): string[] {
  const cautions = shiftTypeCautions(s);
  return cautions.length ? [...cautions, GUARD_RAIL_DEFERRAL] : [];
}
