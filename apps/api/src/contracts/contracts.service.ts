import {
  BadRequestException,
  ConflictException,
  ForbiddenException,
  Injectable,
  NotFoundException,
} from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import {
  CONTRACT_RULE_FIELDS,
  contractCautions,
  type ContractDto,
  type ContractRules,
  GUARD_RAIL_DEFERRAL,
} from '@rotaplex/contracts';
import { Brackets, DataSource, type EntityManager, In, Repository } from 'typeorm';
import { type AuthUser } from '../common/auth-user';
import { assertUnitAccess, visibleUnitIds } from '../common/unit-scope';
import { UnitsService } from '../units/units.service';
import { ContractEntity } from './contract.entity';
import { type ContractQueryDto, type CreateContractDto, type UpdateContractDto } from './dto/contract.dto';

@Injectable()
export class ContractsService {
  constructor(
    @InjectRepository(ContractEntity) private readonly contracts: Repository<ContractEntity>,
    private readonly units: UnitsService,
    private readonly dataSource: DataSource,
  ) {}

  /** Contracts by id, any unit (for other services; unknown ids left out). */
  async byIds(ids: string[], em: EntityManager = this.dataSource.manager): Promise<ContractEntity[]> {
    return ids.length ? em.findBy(ContractEntity, { id: In(ids) }) : [];
  }

  /** Organisation-wide contracts and those of the units the caller may see. */
  async list(user: AuthUser, query: ContractQueryDto): Promise<ContractDto[]> {
    if (query.unitId) await this.units.get(user, query.unitId);
    const qb = this.contracts
      .createQueryBuilder('c')
      .where('c.organisationId = :org', { org: user.organisationId });
    const visible = visibleUnitIds(user);
    qb.andWhere(
      new Brackets((w) => {
        w.where('c.unitId IS NULL');
        if (query.unitId) w.orWhere('c.unitId = :unitId', { unitId: query.unitId });
        else if (visible === null) w.orWhere('c.unitId IS NOT NULL');
        else if (visible.length) w.orWhere('c.unitId IN (:...visible)', { visible });
      }),
    );
    const rows = await qb.orderBy('c.name', 'ASC').addOrderBy('c.id', 'ASC').getMany();
    return rows.map(toContractDto);
  }

  async get(user: AuthUser, id: string): Promise<ContractDto> {
    return toContractDto(await this.load(user, id));
  }

  async create(user: AuthUser, body: CreateContractDto): Promise<ContractDto> {
    const unitId = body.unitId ?? null;
    await this.assertMayWrite(user, unitId);
    const rules = pickRules(body);
    assertConsistent({ ...emptyRules(), ...rules });
    const entity = this.contracts.create({
      ...emptyRules(),
      ...rules,
      organisationId: user.organisationId,
      unitId,
      name: body.name,
    });
    return toContractDto(await this.contracts.save(entity));
  }

  async update(user: AuthUser, id: string, body: UpdateContractDto): Promise<ContractDto> {
    const contract = await this.load(user, id);
    await this.assertMayWrite(user, contract.unitId);
    const rules = pickRules(body);
    assertConsistent({ ...rulesOf(contract), ...rules });
    Object.assign(contract, rules);
    if (body.name !== undefined) contract.name = body.name;
    return toContractDto(await this.contracts.save(contract));
  }

  /** Refuses (409) while staff members hold the contract. */
  async remove(user: AuthUser, id: string): Promise<void> {
    const contract = await this.load(user, id);
    await this.assertMayWrite(user, contract.unitId);
    await this.dataSource.transaction(async (em) => {
      const [{ n }] = await em.query(`SELECT COUNT(*) AS n FROM staff_members WHERE "contractId" = ?`, [id]);
      if (Number(n) > 0) {
        throw new ConflictException(
          `Contract "${contract.name}" is held by ${n} staff member(s): give them another contract first`,
        );
      }
      await em.delete(ContractEntity, { id });
    });
  }

  /** A contract usable by staff of `unitId` (its own or organisation-wide); 400 naming `field` otherwise. */
  async findUsable(
    organisationId: string,
    unitId: string,
    id: string,
    field = 'contractId',
  ): Promise<ContractEntity> {
    const c = await this.contracts.findOneBy({ id, organisationId });
    if (!c || (c.unitId !== null && c.unitId !== unitId)) {
      throw new BadRequestException([
        `${field} must be a contract of this unit or of the whole organisation`,
      ]);
    }
    return c;
  }

  /** Contracts usable in a unit, for look-up by name (CSV). */
  async usableInUnit(organisationId: string, unitId: string): Promise<ContractEntity[]> {
    return this.contracts
      .createQueryBuilder('c')
      .where('c.organisationId = :organisationId', { organisationId })
      .andWhere('(c.unitId IS NULL OR c.unitId = :unitId)', { unitId })
      .getMany();
  }

  private async load(user: AuthUser, id: string): Promise<ContractEntity> {
    const c = await this.contracts.findOneBy({ id, organisationId: user.organisationId });
    if (!c) throw new NotFoundException('Contract not found');
    if (c.unitId) assertUnitAccess(user, c.unitId);
    return c;
  }

  /** Unit contracts: planners of that unit; organisation-wide contracts: admins only. */
  private async assertMayWrite(user: AuthUser, unitId: string | null): Promise<void> {
    if (unitId === null) {
      if (user.role !== 'admin') {
        throw new ForbiddenException('Only an admin may change organisation-wide contracts');
      }
      return;
    }
    await this.units.get(user, unitId);
  }
}

function emptyRules(): ContractRules {
  return Object.fromEntries(CONTRACT_RULE_FIELDS.map((f) => [f, null])) as unknown as ContractRules;
}

function rulesOf(c: ContractEntity): ContractRules {
  return Object.fromEntries(CONTRACT_RULE_FIELDS.map((f) => [f, c[f]])) as unknown as ContractRules;
}

function pickRules(body: Partial<ContractRules>): Partial<ContractRules> {
  return Object.fromEntries(
    CONTRACT_RULE_FIELDS.filter((f) => body[f] !== undefined).map((f) => [f, body[f]]),
  ) as Partial<ContractRules>;
}

/** Cross-field checks: minima not above maxima, the target between them. */
function assertConsistent(r: ContractRules): void {
  const errors: string[] = [];
  const le = (a: keyof ContractRules, b: keyof ContractRules) => {
    const x = r[a];
    const y = r[b];
    if (typeof x === 'number' && typeof y === 'number' && x > y) errors.push(`${a} must not exceed ${b}`);
  };
  le('minPaidMinutes', 'maxPaidMinutes');
  le('minPaidMinutes', 'targetPaidMinutes');
  le('targetPaidMinutes', 'maxPaidMinutes');
  le('minConsecutiveWorkDays', 'maxConsecutiveWorkDays');
  if (errors.length) throw new BadRequestException(errors);
}

export function toContractDto(c: ContractEntity): ContractDto {
  const rules = rulesOf(c);
  const cautions = contractCautions(rules);
  return {
    id: c.id,
    unitId: c.unitId,
    name: c.name,
    ...rules,
    cautions: cautions.length ? [...cautions, GUARD_RAIL_DEFERRAL] : [],
  };
}
