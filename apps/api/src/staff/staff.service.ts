import {
  BadRequestException,
  ConflictException,
  ForbiddenException,
  Injectable,
  NotFoundException,
} from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import {
  type CsvImportResult,
  type CsvRowError,
  type Page,
  STAFF_CSV_COLUMNS,
  type StaffMemberDto,
} from '@rotaplex/contracts';
import { isEmail } from 'class-validator';
import { DataSource, type EntityManager, In, Not, Repository } from 'typeorm';
import { type AuthUser } from '../common/auth-user';
import { likePattern, toPage } from '../common/pagination';
import { assertUnitAccess, visibleUnitIds } from '../common/unit-scope';
import { ContractsService } from '../contracts/contracts.service';
import { type SkillEntity } from '../skills/skill.entity';
import { SkillsService } from '../skills/skills.service';
import { UnitsService } from '../units/units.service';
import { UsersService } from '../users/users.service';
import { parseCsv, toCsv } from '../common/csv';
import {
  type CreateStaffMemberDto,
  type StaffImportQueryDto,
  type StaffQueryDto,
  type UpdateStaffMemberDto,
} from './dto/staff.dto';
import { StaffMemberEntity } from './staff-member.entity';

@Injectable()
export class StaffService {
  constructor(
    @InjectRepository(StaffMemberEntity) private readonly staff: Repository<StaffMemberEntity>,
    private readonly dataSource: DataSource,
    private readonly units: UnitsService,
    private readonly skills: SkillsService,
    private readonly contracts: ContractsService,
    private readonly users: UsersService,
  ) {}

  /** Staff of the units the caller plans (admins: every unit), searchable by name and e-mail. */
  async list(user: AuthUser, query: StaffQueryDto): Promise<Page<StaffMemberDto>> {
    if (query.unitId) await this.units.get(user, query.unitId);
    const qb = this.staff
      .createQueryBuilder('s')
      .innerJoin('s.unit', 'unit')
      .leftJoinAndSelect('s.skills', 'skill')
      .where('unit.organisationId = :org', { org: user.organisationId });
    const visible = visibleUnitIds(user);
    if (visible !== null) {
      if (!visible.length) return toPage([], 0, query);
      qb.andWhere('s.unitId IN (:...visible)', { visible });
    }
    if (query.unitId) qb.andWhere('s.unitId = :unitId', { unitId: query.unitId });
    if (query.q) {
      qb.andWhere(`(LOWER(s.name) LIKE LOWER(:q) ESCAPE '\\' OR LOWER(s.email) LIKE LOWER(:q) ESCAPE '\\')`, {
        q: likePattern(query.q),
      });
    }
    if (query.active !== undefined) qb.andWhere('s.active = :active', { active: query.active });
    if (query.skill) {
      qb.andWhere(
        `EXISTS (SELECT 1 FROM staff_member_skills fs JOIN skills fk ON fk.id = fs."skillId"
                 WHERE fs."staffMemberId" = s.id AND fk.code = :skill)`,
        { skill: query.skill },
      );
    }
    qb.orderBy(`s.${query.sort}`, query.order === 'desc' ? 'DESC' : 'ASC')
      .addOrderBy('s.id', 'ASC')
      .skip((query.page - 1) * query.pageSize)
      .take(query.pageSize);
    const [rows, total] = await qb.getManyAndCount();
    return toPage(rows.map(toStaffMemberDto), total, query);
  }

  /** Planners see the staff of their units; a staff member sees only their own record (403 otherwise). */
  async get(user: AuthUser, id: string): Promise<StaffMemberDto> {
    const member = await this.loadInOrganisation(user, id);
    if (user.role === 'staff') {
      if (member.userId !== user.id) throw new ForbiddenException('You may only see your own staff record');
    } else {
      assertUnitAccess(user, member.unitId);
    }
    return toStaffMemberDto(member);
  }

  async create(user: AuthUser, body: CreateStaffMemberDto): Promise<StaffMemberDto> {
    await this.units.get(user, body.unitId);
    const skills = await this.skills.findByCodes(user.organisationId, body.skills);
    if (body.contractId) await this.contracts.findUsable(user.organisationId, body.unitId, body.contractId);
    if (body.userId) await this.assertUserLinkable(user, body.unitId, body.userId);
    const saved = await this.staff.save(
      this.staff.create({
        unitId: body.unitId,
        userId: body.userId ?? null,
        name: body.name,
        email: body.email ?? null,
        contractId: body.contractId ?? null,
        hourlyCost: body.hourlyCost ?? null,
        active: body.active ?? true,
        skills,
      }),
    );
    return toStaffMemberDto(saved);
  }

  async update(user: AuthUser, id: string, body: UpdateStaffMemberDto): Promise<StaffMemberDto> {
    const member = await this.loadInOrganisation(user, id);
    assertUnitAccess(user, member.unitId);
    if (body.skills !== undefined)
      member.skills = await this.skills.findByCodes(user.organisationId, body.skills);
    if (body.contractId !== undefined) {
      if (body.contractId)
        await this.contracts.findUsable(user.organisationId, member.unitId, body.contractId);
      member.contractId = body.contractId;
    }
    if (body.userId !== undefined) {
      if (body.userId) await this.assertUserLinkable(user, member.unitId, body.userId, member.id);
      member.userId = body.userId;
    }
    if (body.name !== undefined) member.name = body.name;
    if (body.email !== undefined) member.email = body.email;
    if (body.hourlyCost !== undefined) member.hourlyCost = body.hourlyCost;
    if (body.active !== undefined) member.active = body.active;
    // Relations loaded with the entity would be written back as they were read; drop them.
    delete member.contract;
    delete member.user;
    return toStaffMemberDto(await this.staff.save(member));
  }

  async remove(user: AuthUser, id: string): Promise<void> {
    const member = await this.loadInOrganisation(user, id);
    assertUnitAccess(user, member.unitId);
    await this.staff.delete({ id });
  }

  /**
   * Checks every row of a staff CSV (columns STAFF_CSV_COLUMNS) and, unless a dry run, saves all
   * rows in one transaction. Any bad row: nothing is saved and the answer is 400 with every error.
   */
  async importCsv(user: AuthUser, query: StaffImportQueryDto, text: unknown): Promise<CsvImportResult> {
    if (typeof text !== 'string') {
      throw new BadRequestException(['body must be CSV text sent with Content-Type: text/csv']);
    }
    await this.units.get(user, query.unitId);
    const parsed = parseCsv(text, STAFF_CSV_COLUMNS, ['name']);
    const errors: CsvRowError[] = [...parsed.errors];
    const skillsByCode = new Map(
      (await this.skills.ofOrganisation(user.organisationId)).map((s) => [s.code, s]),
    );
    const contractsByName = new Map(
      (await this.contracts.usableInUnit(user.organisationId, query.unitId)).map((c) => [
        c.name.toLowerCase(),
        c,
      ]),
    );
    const members: StaffMemberEntity[] = [];
    for (const { line, cells } of parsed.rows) {
      const err = (field: string, message: string) => errors.push({ line, field, message });
      const name = cells.name ?? '';
      if (!name) err('name', 'name is required');
      else if (name.length > 200) err('name', 'name must be at most 200 characters');
      const email = (cells.email ?? '').toLowerCase();
      if (email && (!isEmail(email) || email.length > 254))
        err('email', `"${cells.email}" is not an e-mail address`);
      const skills: SkillEntity[] = [];
      for (const code of (cells.skills ?? '').split(/[\s;]+/).filter(Boolean)) {
        const skill = skillsByCode.get(code.toUpperCase());
        if (skill) skills.push(skill);
        else err('skills', `unknown skill code "${code}"`);
      }
      let contractId: string | null = null;
      if (cells.contract) {
        const c = contractsByName.get(cells.contract.toLowerCase());
        if (c) contractId = c.id;
        else err('contract', `no contract named "${cells.contract}" in this unit or the organisation`);
      }
      let hourlyCost: number | null = null;
      if (cells.hourlyCost) {
        const n = Number(cells.hourlyCost);
        if (!/^\d+(\.\d{1,2})?$/.test(cells.hourlyCost) || !Number.isFinite(n) || n > 100000) {
          err('hourlyCost', `"${cells.hourlyCost}" is not an amount (e.g. 18.50)`);
        } else hourlyCost = n;
      }
      let active = true;
      if (cells.active) {
        const v = cells.active.toLowerCase();
        if (['true', 'yes', '1'].includes(v)) active = true;
        else if (['false', 'no', '0'].includes(v)) active = false;
        else err('active', `"${cells.active}" must be true or false`);
      }
      members.push(
        this.staff.create({
          unitId: query.unitId,
          userId: null,
          name,
          email: email || null,
          contractId,
          hourlyCost,
          active,
          skills: [...new Map(skills.map((s) => [s.id, s])).values()],
        }),
      );
    }
    if (!errors.length && !parsed.rows.length)
      errors.push({ line: 2, field: 'file', message: 'no data rows' });
    const result: CsvImportResult = { dryRun: query.dryRun, rows: parsed.rows.length, saved: 0, errors };
    if (query.dryRun) return result;
    if (errors.length) {
      throw new BadRequestException({
        statusCode: 400,
        error: 'Bad Request',
        message: errors.map((e) => `line ${e.line}, ${e.field}: ${e.message}`),
        ...result,
      });
    }
    await this.dataSource.transaction(async (em) => {
      for (const m of members) await em.save(m);
    });
    return { ...result, saved: members.length };
  }

  /** CSV of the staff the caller plans (or one unit), formula cells neutralised. */
  async exportCsv(user: AuthUser, unitId?: string): Promise<string> {
    if (unitId) await this.units.get(user, unitId);
    const qb = this.staff
      .createQueryBuilder('s')
      .innerJoin('s.unit', 'unit')
      .leftJoinAndSelect('s.skills', 'skill')
      .leftJoinAndSelect('s.contract', 'contract')
      .where('unit.organisationId = :org', { org: user.organisationId });
    const visible = visibleUnitIds(user);
    if (visible !== null) {
      // No unit: no rows (an empty IN list is not SQL, and '' is not a uuid on PostgreSQL).
      if (visible.length) qb.andWhere('s.unitId IN (:...visible)', { visible });
      else qb.andWhere('1 = 0');
    }
    if (unitId) qb.andWhere('s.unitId = :unitId', { unitId });
    const rows = await qb.orderBy('s.name', 'ASC').addOrderBy('s.id', 'ASC').getMany();
    return toCsv(
      STAFF_CSV_COLUMNS,
      rows.map((s) => [
        s.name,
        s.email,
        s.skills
          .map((k) => k.code)
          .sort()
          .join(' '),
        s.contract?.name ?? '',
        s.hourlyCost,
        s.active,
      ]),
    );
  }

  // Reads for other modules, without access checks (the caller has made them). Each runs in the
  // caller's transaction when given its EntityManager, else on the main connection.

  /** A staff member by id, or null. */
  byId(id: string, em: EntityManager = this.dataSource.manager): Promise<StaffMemberEntity | null> {
    return em.findOneBy(StaffMemberEntity, { id });
  }

  /** A staff member by id; TypeORM's EntityNotFoundError when there is none. */
  byIdOrFail(id: string, em: EntityManager = this.dataSource.manager): Promise<StaffMemberEntity> {
    return em.findOneByOrFail(StaffMemberEntity, { id });
  }

  /** Staff members by id (unknown ids left out). */
  async byIds(ids: string[], em: EntityManager = this.dataSource.manager): Promise<StaffMemberEntity[]> {
    return ids.length ? em.findBy(StaffMemberEntity, { id: In(ids) }) : [];
  }

  /** The staff members a user signs in as (in every unit), by name; with `activeOnly`, the active ones. */
  ofUser(
    userId: string,
    em: EntityManager = this.dataSource.manager,
    activeOnly = false,
  ): Promise<StaffMemberEntity[]> {
    return em.find(StaffMemberEntity, {
      where: { userId, ...(activeOnly ? { active: true } : {}) },
      order: { name: 'ASC' },
    });
  }

  /** Ids of the staff members (of any unit) who have the skill. */
  async idsWithSkill(skillId: string, em: EntityManager = this.dataSource.manager): Promise<string[]> {
    const rows = await em
      .createQueryBuilder(StaffMemberEntity, 's')
      .innerJoin('s.skills', 'k', 'k.id = :skillId', { skillId })
      .select(['s.id'])
      .getMany();
    return rows.map((s) => s.id);
  }

  /** The staff members of the units. */
  async ofUnits(
    unitIds: string[],
    em: EntityManager = this.dataSource.manager,
  ): Promise<StaffMemberEntity[]> {
    return unitIds.length ? em.findBy(StaffMemberEntity, { unitId: In(unitIds) }) : [];
  }

  private async loadInOrganisation(user: AuthUser, id: string): Promise<StaffMemberEntity> {
    const member = await this.staff
      .createQueryBuilder('s')
      .innerJoin('s.unit', 'unit')
      .leftJoinAndSelect('s.skills', 'skill')
      .where('s.id = :id AND unit.organisationId = :org', { id, org: user.organisationId })
      .getOne();
    if (!member) throw new NotFoundException('Staff member not found');
    return member;
  }

  /** The user must belong to the unit and not be another staff member of it already. */
  private async assertUserLinkable(caller: AuthUser, unitId: string, userId: string, exceptId?: string) {
    const target = await this.users.inOrganisationWithUnits(userId, caller.organisationId);
    if (!target || !target.units.some((u) => u.id === unitId)) {
      throw new BadRequestException(['userId must be a user of this unit']);
    }
    if (await this.staff.existsBy({ unitId, userId, ...(exceptId ? { id: Not(exceptId) } : {}) })) {
      throw new ConflictException('This user is already a staff member of the unit');
    }
  }
}

export function toStaffMemberDto(s: StaffMemberEntity): StaffMemberDto {
  return {
    id: s.id,
    unitId: s.unitId,
    userId: s.userId,
    name: s.name,
    email: s.email,
    skills: (s.skills ?? []).map((k) => k.code).sort(),
    contractId: s.contractId,
    hourlyCost: s.hourlyCost,
    active: s.active,
  };
}
