import { ConflictException, ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { type Page, type UserDto, WEB_PATHS } from '@rotaplex/contracts';
import { GenerationCache, WriteGeneration } from '../database/write-generation';
import { DataSource, type EntityManager, In, Repository } from 'typeorm';
import { OneTimeTokensService } from './credentials/one-time-tokens.service';
import { RefreshTokensService } from './credentials/refresh-tokens.service';
import { type AuthUser } from '../common/auth-user';
import { likePattern, toPage } from '../common/pagination';
import { canSeeUser, visibleUnitIds } from '../common/unit-scope';
import { AppConfig } from '../config/app-config';
import { MailService } from '../mail/mail.service';
import { invitationMail } from '../mail/templates';
import { OrganisationService } from '../organisation/organisation.service';
import { UnitsService } from '../units/units.service';
import { type InviteUserDto, type UpdateUserDto, type UsersQueryDto } from './dto/user.dto';
import { UserEntity } from './user.entity';

@Injectable()
export class UsersService {
  /** The signed-in caller per user id (see findActiveAuthUser). */
  private readonly authUsers: GenerationCache<AuthUser | null>;

  constructor(
    @InjectRepository(UserEntity) private readonly users: Repository<UserEntity>,
    private readonly dataSource: DataSource,
    private readonly units: UnitsService,
    private readonly oneTimeTokens: OneTimeTokensService,
    private readonly refreshTokens: RefreshTokensService,
    private readonly mail: MailService,
    private readonly config: AppConfig,
    private readonly organisation: OrganisationService,
    writes: WriteGeneration,
  ) {
    this.authUsers = new GenerationCache(writes, { maxEntries: 1024, maxAgeMs: 1000 });
  }

  /** Users the caller may see: everyone for admins, people sharing a unit for managers. */
  async list(caller: AuthUser, query: UsersQueryDto): Promise<Page<UserDto>> {
    const qb = this.users
      .createQueryBuilder('u')
      .leftJoinAndSelect('u.units', 'unit')
      .where('u.organisationId = :org', { org: caller.organisationId });
    const visible = visibleUnitIds(caller);
    if (visible !== null) {
      if (!visible.length) return toPage([], 0, query);
      qb.andWhere(
        'EXISTS (SELECT 1 FROM user_units vu WHERE vu."userId" = u.id AND vu."unitId" IN (:...visible))',
        {
          visible,
        },
      );
    }
    if (query.q) {
      qb.andWhere(
        `(LOWER(u.email) LIKE LOWER(:q) ESCAPE '\\' OR LOWER(u.displayName) LIKE LOWER(:q) ESCAPE '\\')`,
        {
          q: likePattern(query.q),
        },
      );
    }
    if (query.role) qb.andWhere('u.role = :role', { role: query.role });
    if (query.active !== undefined) qb.andWhere('u.active = :active', { active: query.active });
    if (query.unitId) {
      qb.andWhere('EXISTS (SELECT 1 FROM user_units fu WHERE fu."userId" = u.id AND fu."unitId" = :unitId)', {
        unitId: query.unitId,
      });
    }
    const order = query.order === 'desc' ? 'DESC' : 'ASC';
    qb.orderBy(`u.${query.sort}`, order)
      .addOrderBy('u.id', 'ASC')
      .skip((query.page - 1) * query.pageSize)
      .take(query.pageSize);
    const [rows, total] = await qb.getManyAndCount();
    return toPage(rows.map(toUserDto), total, query);
  }

  async get(caller: AuthUser, id: string): Promise<UserDto> {
    return toUserDto(await this.loadVisible(caller, id));
  }

  /** Creates the user without a password and e-mails a single-use invitation link. */
  async invite(caller: AuthUser, body: InviteUserDto): Promise<UserDto> {
    const units = await this.units.findAllOrFail(caller.organisationId, body.unitIds);
    if (await this.users.existsBy({ email: body.email })) {
      throw new ConflictException(`A user with the e-mail ${body.email} already exists`);
    }
    const { user, token } = await this.dataSource.transaction(async (em) => {
      const created = await em.save(
        em.create(UserEntity, {
          organisationId: caller.organisationId,
          email: body.email,
          displayName: body.displayName,
          role: body.role,
          passwordHash: null,
          active: true,
          units,
        }),
      );
      return { user: created, token: await this.oneTimeTokens.create(em, created.id, 'invitation') };
    });
    await this.sendInvitation(caller, user, token);
    return toUserDto(user);
  }

  async resendInvitation(caller: AuthUser, id: string): Promise<void> {
    const user = await this.loadInOrganisation(caller, id);
    if (user.passwordHash) throw new ConflictException('This user has already accepted the invitation');
    if (!user.active) throw new ConflictException('This user is deactivated: reactivate them first');
    const token = await this.dataSource.transaction((em) =>
      this.oneTimeTokens.create(em, user.id, 'invitation'),
    );
    await this.sendInvitation(caller, user, token);
  }

  async update(caller: AuthUser, id: string, body: UpdateUserDto): Promise<UserDto> {
    const user = await this.loadInOrganisation(caller, id);
    if (body.role !== undefined && body.role !== user.role && user.id === caller.id) {
      throw new ConflictException('You cannot change your own role: ask another admin');
    }
    if (body.displayName !== undefined) user.displayName = body.displayName;
    if (body.role !== undefined) user.role = body.role;
    if (body.unitIds !== undefined)
      user.units = await this.units.findAllOrFail(caller.organisationId, body.unitIds);
    return toUserDto(await this.users.save(user));
  }

  /** Deactivation ends every session at once: refresh tokens are revoked and access tokens stop working. */
  async setActive(caller: AuthUser, id: string, active: boolean): Promise<UserDto> {
    const user = await this.loadInOrganisation(caller, id);
    if (!active && user.id === caller.id) throw new ConflictException('You cannot deactivate yourself');
    if (user.active !== active) {
      await this.dataSource.transaction(async (em) => {
        await em.update(UserEntity, { id: user.id }, { active });
        if (!active) await this.refreshTokens.revokeAllForUser(user.id);
      });
      user.active = active;
    }
    return toUserDto(user);
  }

  /**
   * The caller as the guards see them, behind a valid token; null when missing or deactivated (a
   * deactivated user is refused at once). Repeated requests are served from a cache that any write
   * to the data and one second of age both invalidate.
   */
  async findActiveAuthUser(id: string): Promise<AuthUser | null> {
    const found = await this.authUsers.get(id, async () => {
      const user = await this.users.findOne({ where: { id }, relations: { units: true } });
      return user && user.active ? toAuthUser(user) : null;
    });
    return found && { ...found, unitIds: [...found.unitIds] };
  }

  // Reads for other modules, without access checks (the caller has made them). Each runs in the
  // caller's transaction when given its EntityManager, else on the main connection.

  /** A user by id, or null. */
  byId(id: string, em: EntityManager = this.dataSource.manager): Promise<UserEntity | null> {
    return em.findOneBy(UserEntity, { id });
  }

  /** A user by id; TypeORM's EntityNotFoundError when there is none. */
  byIdOrFail(id: string, em: EntityManager = this.dataSource.manager): Promise<UserEntity> {
    return em.findOneByOrFail(UserEntity, { id });
  }

  /** Users by id (unknown ids left out). */
  async byIds(ids: string[], em: EntityManager = this.dataSource.manager): Promise<UserEntity[]> {
    return ids.length ? em.findBy(UserEntity, { id: In(ids) }) : [];
  }

  /** A user by e-mail (with their units when `withUnits`), or null. */
  byEmail(
    email: string,
    withUnits = false,
    em: EntityManager = this.dataSource.manager,
  ): Promise<UserEntity | null> {
    return em.findOne(UserEntity, { where: { email }, relations: { units: withUnits } });
  }

  /** A user by id with their units; TypeORM's EntityNotFoundError when there is none. */
  withUnitsOrFail(id: string, em: EntityManager = this.dataSource.manager): Promise<UserEntity> {
    return em.findOneOrFail(UserEntity, { where: { id }, relations: { units: true } });
  }

  /** Whether the user exists and is active. */
  isActive(id: string, em: EntityManager = this.dataSource.manager): Promise<boolean> {
    return em.existsBy(UserEntity, { id, active: true });
  }

  /** Stores a new password hash for the user (auth checks the old password or the link first). */
  async setPasswordHash(
    id: string,
    passwordHash: string,
    em: EntityManager = this.dataSource.manager,
  ): Promise<void> {
    await em.update(UserEntity, { id }, { passwordHash });
  }

  /** A user of the organisation with their units, or null. */
  inOrganisationWithUnits(
    id: string,
    organisationId: string,
    em: EntityManager = this.dataSource.manager,
  ): Promise<UserEntity | null> {
    return em.findOne(UserEntity, { where: { id, organisationId }, relations: { units: true } });
  }

  /** A user as the guards see them, read now (no cache); null when missing or deactivated. */
  async activeAuthUserIn(id: string, em: EntityManager = this.dataSource.manager): Promise<AuthUser | null> {
    const user = await em.findOne(UserEntity, { where: { id }, relations: { units: true } });
    return user && user.active ? toAuthUser(user) : null;
  }

  /** The active managers of a unit. */
  activeManagersOf(unitId: string, em: EntityManager = this.dataSource.manager): Promise<UserEntity[]> {
    return em
      .createQueryBuilder(UserEntity, 'u')
      .innerJoin('u.units', 'unit', 'unit.id = :unitId', { unitId })
      .where('u.role = :role AND u.active = :active', { role: 'manager', active: true })
      .getMany();
  }

  /** The active admins of an organisation. */
  activeAdminsOf(organisationId: string, em: EntityManager = this.dataSource.manager): Promise<UserEntity[]> {
    return em.findBy(UserEntity, { organisationId, role: 'admin', active: true });
  }

  private async sendInvitation(caller: AuthUser, user: UserEntity, token: string): Promise<void> {
    const org = await this.organisation.byId(user.organisationId);
    const link = `${this.config.publicUrl}${WEB_PATHS.acceptInvitation}?token=${encodeURIComponent(token)}`;
    const content = invitationMail({
      displayName: user.displayName,
      organisationName: org?.name ?? 'your organisation',
      invitedBy: caller.displayName,
      link,
      validDays: Math.round(this.oneTimeTokens.ttlSeconds('invitation') / 86400),
    });
    // Queued in the outbox and retried there: a mail server that is down loses nothing.
    await this.mail.send({ to: user.email, ...content });
  }

  private async loadInOrganisation(caller: AuthUser, id: string): Promise<UserEntity> {
    const user = await this.users.findOne({
      where: { id, organisationId: caller.organisationId },
      relations: { units: true },
    });
    if (!user) throw new NotFoundException('User not found');
    return user;
  }

  private async loadVisible(caller: AuthUser, id: string): Promise<UserEntity> {
    const user = await this.loadInOrganisation(caller, id);
    if (!canSeeUser(caller, { id: user.id, unitIds: user.units.map((u) => u.id) })) {
      throw new ForbiddenException('You may only see people in your own units');
    }
    return user;
  }
}

export function toUserDto(u: UserEntity): UserDto {
  return {
    id: u.id,
    email: u.email,
    displayName: u.displayName,
    role: u.role,
    unitIds: (u.units ?? []).map((x) => x.id).sort(),
    active: u.active,
    activated: u.passwordHash !== null,
    createdAt: u.createdAt.toISOString(),
  };
}

export function toAuthUser(u: UserEntity): AuthUser {
  return {
    id: u.id,
    email: u.email,
    displayName: u.displayName,
    role: u.role,
    organisationId: u.organisationId,
    unitIds: (u.units ?? []).map((x) => x.id),
  };
}
