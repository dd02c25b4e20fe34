import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { type SkillDto } from '@rotaplex/contracts';
import { DataSource, type EntityManager, In, Not, Repository } from 'typeorm';
import { type AuthUser } from '../common/auth-user';
import { type CreateSkillDto, type UpdateSkillDto } from './dto/skill.dto';
import { SkillEntity } from './skill.entity';

@Injectable()
export class SkillsService {
  constructor(
    @InjectRepository(SkillEntity) private readonly skills: Repository<SkillEntity>,
    private readonly dataSource: DataSource,
  ) {}

  async list(user: AuthUser): Promise<SkillDto[]> {
    const rows = await this.skills.find({
      where: { organisationId: user.organisationId },
      order: { code: 'ASC' },
    });
    return rows.map(toSkillDto);
  }

  async get(user: AuthUser, id: string): Promise<SkillDto> {
    return toSkillDto(await this.load(user, id));
  }

  async create(user: AuthUser, body: CreateSkillDto): Promise<SkillDto> {
    await this.assertCodeFree(user.organisationId, body.code);
    return toSkillDto(
      await this.skills.save(this.skills.create({ organisationId: user.organisationId, ...body })),
    );
  }

  async update(user: AuthUser, id: string, body: UpdateSkillDto): Promise<SkillDto> {
    const skill = await this.load(user, id);
    if (body.code !== undefined && body.code !== skill.code) {
      await this.assertCodeFree(user.organisationId, body.code, id);
      skill.code = body.code;
    }
    if (body.name !== undefined) skill.name = body.name;
    if (body.registered !== undefined) skill.registered = body.registered;
    return toSkillDto(await this.skills.save(skill));
  }

  /** Refuses (409) while staff members or cover needs use the skill. */
  async remove(user: AuthUser, id: string): Promise<void> {
    await this.dataSource.transaction(async (em) => {
      const skill = await em.findOneBy(SkillEntity, { id, organisationId: user.organisationId });
      if (!skill) throw new NotFoundException('Skill not found');
      const [{ n }] = await em.query(
        `SELECT (SELECT COUNT(*) FROM staff_member_skills WHERE "skillId" = ?)
              + (SELECT COUNT(*) FROM cover_pattern_rows WHERE "skillId" = ?)
              + (SELECT COUNT(*) FROM cover_overrides WHERE "skillId" = ?) AS n`,
        [id, id, id],
      );
      if (Number(n) > 0) {
        throw new ConflictException(
          `Skill ${skill.code} is still held by staff members or required by cover needs: remove it there first`,
        );
      }
      await em.delete(SkillEntity, { id });
    });
  }

  /** Every skill of the organisation (for other services). */
  ofOrganisation(
    organisationId: string,
    em: EntityManager = this.dataSource.manager,
  ): Promise<SkillEntity[]> {
    return em.findBy(SkillEntity, { organisationId });
  }

  /** Skills by id, any organisation (for other services; unknown ids left out). */
  async byIds(ids: string[], em: EntityManager = this.dataSource.manager): Promise<SkillEntity[]> {
    return ids.length ? em.findBy(SkillEntity, { id: In(ids) }) : [];
  }

  /** Skills of the organisation by code (upper case); 400 naming `field` for unknown codes. */
  async findByCodes(organisationId: string, codes: string[], field = 'skills'): Promise<SkillEntity[]> {
    const unique = [...new Set(codes.map((c) => c.trim().toUpperCase()))];
    if (!unique.length) return [];
    const rows = await this.skills.findBy({ organisationId, code: In(unique) });
    const known = new Set(rows.map((r) => r.code));
    const unknown = unique.filter((c) => !known.has(c));
    if (unknown.length)
      throw new BadRequestException([`${field} contains an unknown skill: ${unknown.join(', ')}`]);
    return rows;
  }

  private async load(user: AuthUser, id: string): Promise<SkillEntity> {
    const skill = await this.skills.findOneBy({ id, organisationId: user.organisationId });
    if (!skill) throw new NotFoundException('Skill not found');
    return skill;
  }

  private async assertCodeFree(organisationId: string, code: string, exceptId?: string): Promise<void> {
    if (await this.skills.existsBy({ organisationId, code, ...(exceptId ? { id: Not(exceptId) } : {}) })) {
      throw new ConflictException(`A skill with the code ${code} already exists`);
    }
  }
}

export function toSkillDto(s: SkillEntity): SkillDto {
  return { id: s.id, code: s.code, name: s.name, registered: s.registered };
}
