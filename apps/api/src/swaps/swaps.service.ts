import {
  BadRequestException,
  ConflictException,
  ForbiddenException,
  GoneException,
  Injectable,
  NotFoundException,
  UnprocessableEntityException,
} from '@nestjs/common';
import {
  hasPermission,
  type Page,
  type ProposeSwapDto,
  SWAP_DECISION_WEB_PATH,
  SWAP_FINAL_STATUSES,
  type SwapAction,
  type SwapDecisionDto,
  type SwapLinkViewDto,
  type SwapOptionsDto,
  type SwapPreviewDto,
  type SwapRequestDto,
  type SwapStatus,
} from '@rotaplex/contracts';
import { DataSource, type EntityManager, In, IsNull } from 'typeorm';
import { AssignmentEntity } from '../assignments/assignment.entity';
import { type AuthUser } from '../common/auth-user';
import { randomToken, sha256 } from '../common/crypto';
import { assertUnitAccess, canAccessUnit } from '../common/unit-scope';
import { AppConfig } from '../config/app-config';
import { AuditService } from '../audit/audit.service';
import { PeriodWriter } from '../roster-periods/period-writer';
import { localDate } from '../common/dates';
import { MailService, type OutgoingMail } from '../mail/mail.service';
import { type RosterInput, RosterInputService } from '../roster-input/roster-input.service';
import { StaffMemberEntity } from '../staff/staff-member.entity';
import { UserEntity } from '../users/user.entity';
import { changeDto, evaluateChanges, staleCells } from './swap-evaluation';
import { EXPIRED_OUTCOME, expiredMessage, isOverdue } from './swap-expiry.service';
import { type SwapListQuery } from './dto/swap.dto';
import { shiftWords, swapMail } from './swap-mails';
import { dateInWords } from '../common/text/date-words';
import {
  type StoredCellChange,
  type SwapLinkRole,
  SwapLinkTokenEntity,
  SwapRequestEntity,
} from './swap-request.entity';

/** What a decision produced: mails (queued in its transaction), and a refusal to report after the commit. */
interface Outcome {
  mails: OutgoingMail[];
  refusal?: { status: 409 | 410 | 422; message: string; findings?: SwapPreviewDto };
}

type Actor = Pick<AuthUser, 'id' | 'role' | 'unitIds' | 'organisationId' | 'displayName' | 'email'>;

/**
 * Swaps, offers and open-shift claims on published rosters: propose (with the checker's preview),
 * the colleague's answer, the manager's approval (in the app or through a single-use e-mail link)
 * and the change itself, applied in one transaction only if the roster still holds the cells
 * recorded at proposal.
 */
@Injectable()
export class SwapsService {
  /** Lifetime of an e-mailed decision link (AppConfig.swapLinkTtl, SWAP_LINK_TTL, default 72 h). */
  readonly linkTtlSeconds: number;

  constructor(
    private readonly dataSource: DataSource,
    private readonly input: RosterInputService,
    private readonly mail: MailService,
    private readonly config: AppConfig,
    private readonly auditTrail: AuditService,
    private readonly writer: PeriodWriter,
  ) {
    this.linkTtlSeconds = config.swapLinkTtl;
  }

  // ---------------------------------------------------------------- reading

  async options(user: AuthUser, periodId: string): Promise<SwapOptionsDto> {
    const input = await this.publishedInput(periodId);
    assertUnitAccess(user, input.period.unitId);
    const me = this.staffOf(user, input);
    const rows = await this.dataSource.manager.findBy(AssignmentEntity, { rosterPeriodId: periodId });
    const today = this.today(input);
    const shiftsOf = (staffId: string) =>
      rows
        .filter((r) => r.staffMemberId === staffId && r.shiftTypeId !== null && r.date >= today)
        .sort((a, b) => a.date.localeCompare(b.date))
        .map((r) => ({
          date: r.date,
          shiftTypeId: r.shiftTypeId!,
          shiftCode: input.shiftTypes.find((s) => s.id === r.shiftTypeId)?.code ?? '',
        }));
    return {
      rosterPeriodId: periodId,
      myStaffMemberId: me.id,
      myShifts: shiftsOf(me.id),
      colleagues: input.staff
        .filter((s) => s.id !== me.id && s.userId !== null)
        .map((s) => ({ staffMemberId: s.id, name: s.name, shifts: shiftsOf(s.id) })),
    };
  }

  /**
   * A page of the requests the caller takes part in (staff) or manages, newest first; with
   * `waitingForMe`, only those waiting for the caller's answer (staff: to accept; managers: to approve).
   */
  async list(user: AuthUser, query: SwapListQuery): Promise<Page<SwapRequestDto>> {
    const m = this.dataSource.manager;
    const empty = { items: [], total: 0, page: query.page, pageSize: query.pageSize };
    const qb = m.createQueryBuilder(SwapRequestEntity, 'r').orderBy('r.createdAt', 'DESC').addOrderBy('r.id');
    if (user.role === 'staff') {
      const mine = (await m.findBy(StaffMemberEntity, { userId: user.id })).map((s) => s.id);
      if (!mine.length) return empty;
      if (query.waitingForMe) {
        qb.where(`r.colleagueStaffMemberId IN (:...mine) AND r.status = 'proposed'`, { mine });
      } else {
        qb.where('(r.proposerStaffMemberId IN (:...mine) OR r.colleagueStaffMemberId IN (:...mine))', {
          mine,
        });
      }
    } else if (user.role === 'manager') {
      if (!user.unitIds.length) return empty;
      qb.where('r.unitId IN (:...units)', { units: user.unitIds });
    } else {
      qb.innerJoin('units', 'u', 'u.id = r.unitId').where('u.organisationId = :org', {
        org: user.organisationId,
      });
    }
    if (query.waitingForMe && user.role !== 'staff') {
      if (!hasPermission(user.role, 'requests:approve')) return empty;
      qb.andWhere(`r.status = 'accepted'`);
    }
    if (query.status) qb.andWhere('r.status = :status', { status: query.status });
    const [rows, total] = await qb
      .skip((query.page - 1) * query.pageSize)
      .take(query.pageSize)
      .getManyAndCount();
    return { items: await this.toDtos(m, rows, user), total, page: query.page, pageSize: query.pageSize };
  }

  async get(user: AuthUser, id: string): Promise<SwapRequestDto> {
    const m = this.dataSource.manager;
    const row = await this.visibleRequest(m, user, id);
    return (await this.toDtos(m, [row], user))[0];
  }

  // ---------------------------------------------------------------- proposing

  async preview(user: AuthUser, body: ProposeSwapDto): Promise<SwapPreviewDto> {
    const { input, changes, rows } = await this.planSwap(this.dataSource.manager, user, body);
    return evaluateChanges(input, rows, changes);
  }

  async propose(user: AuthUser, body: ProposeSwapDto): Promise<SwapRequestDto> {
    const mails: OutgoingMail[] = [];
    const id = await this.dataSource.transaction(async (em) => {
      const { input, changes, rows, me, colleague } = await this.planSwap(em, user, body);
      const findings = evaluateChanges(input, rows, changes);
      if (findings.blocked) {
        throw new UnprocessableEntityException({
          statusCode: 422,
          error: 'Unprocessable Entity',
          message: 'The swap would break a rule: ' + newMessages(findings).join('; '),
          findings,
        });
      }
      const saved = await em.save(
        em.create(SwapRequestEntity, {
          rosterPeriodId: input.period.id,
          unitId: input.period.unitId,
          kind: body.kind,
          status: 'proposed',
          proposerStaffMemberId: me.id,
          colleagueStaffMemberId: colleague.id,
          skillId: null,
          changes: JSON.stringify(changes),
          firstDate: firstDateOf(changes),
          note: body.note?.trim() || null,
          outcome: null,
          decidedById: null,
        }),
      );
      const colleagueUser = await em.findOneByOrFail(UserEntity, { id: colleague.userId! });
      const token = await this.createLink(em, saved.id, colleagueUser.id, 'colleague');
      mails.push(
        swapMail({
          to: colleagueUser.email,
          name: colleague.name,
          subject:
            body.kind === 'swap'
              ? `${me.name} asks to swap a shift with you`
              : `${me.name} offers you a shift`,
          lines: [
            ...describe(input, changes, me, colleague, body.kind),
            ...(saved.note ? [`Their note: "${saved.note}"`] : []),
            'Please accept or decline. A manager approves the change after you accept.',
          ],
          timeZone: input.unit.timeZone,
          place: 'Swaps',
          action: { label: 'Accept or decline', url: this.link(token) },
        }),
      );
      await this.queue(em, mails);
      return saved.id;
    });
    return this.get(user, id);
  }

  /** Builds the cell changes of a proposed swap or offer and checks who may ask for it. */
  private async planSwap(em: EntityManager, user: AuthUser, body: ProposeSwapDto) {
    const input = await this.publishedInput(body.rosterPeriodId, em);
    assertUnitAccess(user, input.period.unitId);
    const me = this.staffOf(user, input);
    const colleague = input.staff.find((s) => s.id === body.colleagueStaffMemberId);
    if (!colleague || colleague.id === me.id) {
      throw new BadRequestException([
        'colleagueStaffMemberId must be another active staff member of the unit',
      ]);
    }
    if (!colleague.userId) {
      throw new BadRequestException([
        'colleagueStaffMemberId: this colleague has no sign-in and cannot accept',
      ]);
    }
    const rows = await em.findBy(AssignmentEntity, { rosterPeriodId: input.period.id });
    const cell = (staffId: string, date: string) =>
      rows.find((r) => r.staffMemberId === staffId && r.date === date)?.shiftTypeId ?? null;
    const today = this.today(input);
    const assertDay = (field: string, date: string) => {
      if (!input.dates.includes(date))
        throw new BadRequestException([`${field} must be a day of the period`]);
      if (date < today) throw new BadRequestException([`${field} is in the past`]);
    };
    assertDay('myDate', body.myDate);
    const mine = cell(me.id, body.myDate);
    if (mine === null)
      throw new BadRequestException([`myDate: you have no shift on ${dateInWords(body.myDate)}`]);

    let changes: StoredCellChange[];
    if (body.kind === 'offer') {
      if (body.theirDate !== undefined) throw new BadRequestException(['theirDate is only for a swap']);
      if (cell(colleague.id, body.myDate) !== null) {
        throw new BadRequestException([
          `colleagueStaffMemberId: ${colleague.name} already works on ${dateInWords(body.myDate)}`,
        ]);
      }
      changes = [
        { staffMemberId: me.id, date: body.myDate, before: mine, after: null },
        { staffMemberId: colleague.id, date: body.myDate, before: null, after: mine },
      ];
    } else {
      if (!body.theirDate) throw new BadRequestException(['theirDate is required for a swap']);
      assertDay('theirDate', body.theirDate);
      const theirs = cell(colleague.id, body.theirDate);
      if (theirs === null) {
        throw new BadRequestException([
          `theirDate: ${colleague.name} has no shift on ${dateInWords(body.theirDate)}`,
        ]);
      }
      if (body.theirDate === body.myDate) {
        if (theirs === mine)
          throw new BadRequestException(['theirDate: you both work the same shift that day']);
        changes = [
          { staffMemberId: me.id, date: body.myDate, before: mine, after: theirs },
          { staffMemberId: colleague.id, date: body.myDate, before: theirs, after: mine },
        ];
      } else {
        if (cell(me.id, body.theirDate) !== null) {
          throw new BadRequestException([`theirDate: you already work on ${dateInWords(body.theirDate)}`]);
        }
        if (cell(colleague.id, body.myDate) !== null) {
          throw new BadRequestException([
            `myDate: ${colleague.name} already works on ${dateInWords(body.myDate)}`,
          ]);
        }
        changes = [
          { staffMemberId: me.id, date: body.myDate, before: mine, after: null },
          { staffMemberId: me.id, date: body.theirDate, before: null, after: theirs },
          { staffMemberId: colleague.id, date: body.theirDate, before: theirs, after: null },
          { staffMemberId: colleague.id, date: body.myDate, before: null, after: mine },
        ];
      }
    }
    return { input, changes, rows, me, colleague };
  }

  /** Creates an open-shift claim (already "accepted": it waits for a manager) and mails the managers. */
  async createClaim(
    em: EntityManager,
    input: RosterInput,
    me: StaffMemberEntity,
    change: StoredCellChange,
    skillId: string | null,
    note: string | null,
  ): Promise<{ id: string; mails: OutgoingMail[] }> {
    const saved = await em.save(
      em.create(SwapRequestEntity, {
        rosterPeriodId: input.period.id,
        unitId: input.period.unitId,
        kind: 'claim',
        status: 'accepted',
        proposerStaffMemberId: me.id,
        colleagueStaffMemberId: null,
        skillId,
        changes: JSON.stringify([change]),
        firstDate: change.date,
        note,
        outcome: null,
        decidedById: null,
      }),
    );
    const mails = await this.managerLinks(em, input, saved, `${me.name} claims an open shift`, [
      `${me.name} claims the open shift ${shiftWords(shiftOf(input, change.after), change.date)}.`,
      ...(note ? [`Their note: "${note}"`] : []),
      'Rotaplex checked their roster with the shift added: it breaks no rule. Please approve or decline.',
    ]);
    return { id: saved.id, mails };
  }

  // ---------------------------------------------------------------- deciding

  async cancel(user: AuthUser, id: string): Promise<SwapRequestDto> {
    const outcome = await this.dataSource.transaction(async (em): Promise<Outcome> => {
      const row = await this.visibleRequest(em, user, id);
      const me = await em.findOneBy(StaffMemberEntity, { id: row.proposerStaffMemberId, userId: user.id });
      if (!me) throw new ForbiddenException('Only the person who asked can cancel this request');
      if (row.status !== 'proposed' && row.status !== 'accepted') {
        throw new ConflictException(`This request is already ${row.status}`);
      }
      const input = await this.input.load(row.rosterPeriodId, {}, em);
      const overdue = await this.expireIfOverdue(em, row, input);
      if (overdue) return overdue;
      await this.setStatus(em, row, 'cancelled', `Cancelled by ${me.name}`, null);
      const mails: OutgoingMail[] = [];
      if (row.colleagueStaffMemberId) {
        mails.push(
          ...(await this.mailPeople(em, input, [row.colleagueStaffMemberId], `${me.name} cancelled a swap`, [
            `${me.name} cancelled their request: ${summary(input, row)}.`,
            'Your roster stays as it was.',
          ])),
        );
      }
      await this.queue(em, mails);
      return { mails };
    });
    await this.finish(outcome);
    return this.get(user, id);
  }

  /** A decision in the app by the signed-in user. */
  async decide(user: AuthUser, id: string, body: SwapDecisionDto): Promise<SwapRequestDto> {
    const outcome = await this.dataSource.transaction(async (em) => {
      const row = await this.visibleRequest(em, user, id);
      const result = await this.decideIn(em, row, user, body);
      await this.queue(em, result.mails);
      return result;
    });
    await this.finish(outcome);
    return this.get(user, id);
  }

  /** What an e-mail link shows before the person confirms. Changes nothing (mail scanners may fetch it). */
  async viewLink(token: string): Promise<SwapLinkViewDto> {
    const m = this.dataSource.manager;
    const link = await this.validLink(m, token);
    const row = await m.findOneByOrFail(SwapRequestEntity, { id: link.swapRequestId });
    const actor = await this.actorOf(m, link.userId);
    const input = await this.input.load(row.rosterPeriodId, {}, m);
    const [dto] = await this.toDtos(m, [row], actor);
    return {
      decisions: link.role === 'colleague' ? ['accept', 'decline'] : ['approve', 'refuse'],
      role: link.role,
      actorName: actor.displayName,
      swap: dto,
      unitName: input.unit.name,
      timeZone: input.unit.timeZone,
    };
  }

  /** A decision made through an e-mail link: uses the token up in the same transaction as the decision. */
  async decideByLink(token: string, body: SwapDecisionDto): Promise<SwapLinkViewDto['swap']> {
    const outcome = await this.dataSource.transaction(async (em) => {
      const link = await this.validLink(em, token);
      const allowed = link.role === 'colleague' ? ['accept', 'decline'] : ['approve', 'refuse'];
      if (!allowed.includes(body.decision)) {
        throw new BadRequestException([`decision: this link can only ${allowed.join(' or ')}`]);
      }
      const { affected } = await em.update(
        SwapLinkTokenEntity,
        { id: link.id, usedAt: IsNull() },
        { usedAt: new Date() },
      );
      if (affected !== 1) throw new GoneException('This link has already been used');
      const row = await em.findOneByOrFail(SwapRequestEntity, { id: link.swapRequestId });
      const actor = await this.actorOf(em, link.userId);
      const result = await this.decideIn(em, row, actor, body);
      await this.queue(em, result.mails);
      return { ...result, id: row.id, actor };
    });
    await this.finish(outcome);
    const m = this.dataSource.manager;
    const row = await m.findOneByOrFail(SwapRequestEntity, { id: outcome.id });
    return (await this.toDtos(m, [row], outcome.actor))[0];
  }

  /** Reports a refusal (recorded in the committed transaction) as an error. */
  private async finish(outcome: Outcome): Promise<void> {
    if (outcome.refusal) {
      const body = { statusCode: outcome.refusal.status, message: outcome.refusal.message };
      if (outcome.refusal.status === 422) {
        throw new UnprocessableEntityException({ ...body, findings: outcome.refusal.findings });
      }
      if (outcome.refusal.status === 410) throw new GoneException(body);
      throw new ConflictException(body);
    }
  }

  private async decideIn(
    em: EntityManager,
    row: SwapRequestEntity,
    actor: Actor,
    body: SwapDecisionDto,
  ): Promise<Outcome> {
    if (row.status === 'expired') throw new GoneException(expiredMessage(row));
    const input = await this.input.load(row.rosterPeriodId, {}, em);
    // Its day may have passed since the last scheduled sweep: decide nothing, record the expiry.
    const overdue = await this.expireIfOverdue(em, row, input);
    if (overdue) return overdue;
    const reason = body.reason?.trim() || null;
    if (body.decision === 'accept' || body.decision === 'decline') {
      const colleague = row.colleagueStaffMemberId
        ? await em.findOneBy(StaffMemberEntity, { id: row.colleagueStaffMemberId })
        : null;
      if (!colleague || colleague.userId !== actor.id) {
        throw new ForbiddenException('Only the colleague asked can accept or decline this request');
      }
      if (row.status !== 'proposed') throw new ConflictException(`This request is already ${row.status}`);
      const proposer = await em.findOneByOrFail(StaffMemberEntity, { id: row.proposerStaffMemberId });
      await this.retireLinks(em, row.id, 'colleague');
      if (body.decision === 'decline') {
        await this.setStatus(
          em,
          row,
          'declined',
          `Declined by ${colleague.name}${reason ? `: ${reason}` : ''}`,
          null,
        );
        return {
          mails: await this.mailPeople(em, input, [proposer.id], `${colleague.name} declined your swap`, [
            `${colleague.name} declined: ${summary(input, row)}.`,
            ...(reason ? [`Their reason: "${reason}"`] : []),
            'Your roster stays as it was.',
          ]),
        };
      }
      await this.setStatus(em, row, 'accepted', null, null);
      const mails = await this.mailPeople(em, input, [proposer.id], `${colleague.name} accepted your swap`, [
        `${colleague.name} accepted: ${summary(input, row)}.`,
        'A manager of the unit now approves or declines it; you will hear the result.',
      ]);
      mails.push(
        ...(await this.managerLinks(
          em,
          input,
          row,
          `Swap to approve: ${proposer.name} and ${colleague.name}`,
          [
            `${proposer.name} and ${colleague.name} agreed: ${summary(input, row)}.`,
            'When it was proposed, Rotaplex checked both rosters after the change: it broke no rule. Approving checks again. Please approve or decline.',
          ],
        )),
      );
      return { mails };
    }

    // approve / refuse: a manager of the unit (or an admin of the organisation)
    if (!hasPermission(actor.role, 'requests:approve') || !canAccessUnit(actor, row.unitId)) {
      throw new ForbiddenException('Only a manager of the unit can approve or decline this request');
    }
    if (row.status !== 'accepted') {
      throw new ConflictException(
        row.status === 'proposed'
          ? 'The colleague has not accepted this request yet'
          : `This request is already ${row.status}`,
      );
    }
    await this.retireLinks(em, row.id, 'manager');
    const involved = [
      row.proposerStaffMemberId,
      ...(row.colleagueStaffMemberId ? [row.colleagueStaffMemberId] : []),
    ];
    const what = summary(input, row);
    const refuse = async (outcome: string, refusal: Outcome['refusal']): Promise<Outcome> => {
      await this.setStatus(em, row, 'refused', outcome, actor.id);
      const mails = await this.mailPeople(em, input, involved, 'A roster change was declined', [
        `Not approved: ${what}.`,
        outcome,
        'Your roster stays as it was.',
      ]);
      mails.push(
        this.managerNote(input, actor, 'A roster change was declined', [`Not approved: ${what}.`, outcome]),
      );
      return { mails, refusal };
    };
    if (body.decision === 'refuse') {
      return refuse(`Declined by ${actor.displayName}${reason ? `: ${reason}` : ''}`, undefined);
    }

    // Approve: optimistic lock on the cells, the period still published, the rules still hold.
    if (input.period.status !== 'published') {
      const message = `The roster period is no longer published (it is ${input.period.status}): nothing was changed`;
      return refuse(message, { status: 409, message });
    }
    const changes = JSON.parse(row.changes) as StoredCellChange[];
    const rows = await em.findBy(AssignmentEntity, { rosterPeriodId: row.rosterPeriodId });
    const stale = staleCells(rows, changes);
    if (stale.length) {
      const cells = stale
        .map((c) => `${staffName(input, c.staffMemberId)} on ${dateInWords(c.date)}`)
        .join(', ');
      const message = `The roster changed since this was asked (${cells}): nothing was changed`;
      return refuse(message, { status: 409, message });
    }
    if (row.kind === 'claim') {
      const c = changes[0];
      const day = input.dates.indexOf(c.date);
      const need = input.problem.coverNeeds.find(
        (n) => n.day === day && n.shiftTypeId === c.after && n.skillId === row.skillId,
      );
      const have = rows.filter(
        (r) =>
          r.date === c.date &&
          r.shiftTypeId === c.after &&
          (row.skillId === null ||
            input.staff.find((s) => s.id === r.staffMemberId)?.skills.some((k) => k.id === row.skillId)),
      ).length;
      if (!need || have >= need.target) {
        const message = 'The open shift has been filled meanwhile: nothing was changed';
        return refuse(message, { status: 409, message });
      }
    }
    const findings = evaluateChanges(input, rows, changes);
    if (findings.blocked) {
      const message = 'The change would now break a rule: ' + newMessages(findings).join('; ');
      return refuse(message, { status: 422, message, findings });
    }
    // Through the period's writer: the cells and the period's version change together.
    const cells = changes.map((c) => ({
      staffMemberId: c.staffMemberId,
      date: c.date,
      shiftTypeId: c.after,
      pinned:
        c.after !== null &&
        (rows.find((r) => r.staffMemberId === c.staffMemberId && r.date === c.date)?.pinned ?? false),
    }));
    await this.writer.writeCells(em, row.rosterPeriodId, cells, {
      kind: row.kind === 'claim' ? 'open-shift-claim' : 'swap',
      actorUserId: actor.id,
    });
    await this.setStatus(em, row, 'approved', `Approved by ${actor.displayName}`, actor.id);
    {
      await this.auditTrail.record(em, {
        rosterPeriodId: row.rosterPeriodId,
        actorUserId: actor.id,
        kind: row.kind === 'claim' ? 'open-shift-claim' : 'swap',
        summary: `${row.kind === 'claim' ? 'Open shift claim' : row.kind === 'swap' ? 'Swap' : 'Shift given away'}: ${what}`,
        before: changes.map((c) => ({ staffMemberId: c.staffMemberId, date: c.date, shiftTypeId: c.before })),
        after: changes.map((c) => ({ staffMemberId: c.staffMemberId, date: c.date, shiftTypeId: c.after })),
      });
    }
    const mails = await this.mailPeople(em, input, involved, 'Your roster has changed', [
      `Approved by ${actor.displayName}: ${what}.`,
      'Your roster and calendar now show the change.',
    ]);
    mails.push(this.managerNote(input, actor, 'You approved a roster change', [`Approved: ${what}.`]));
    return { mails };
  }

  // ---------------------------------------------------------------- helpers

  /**
   * A pending request whose first day has passed (in the unit's time zone) expires now, in the
   * caller's transaction; the refusal (410) is reported after the commit.
   */
  private async expireIfOverdue(
    em: EntityManager,
    row: SwapRequestEntity,
    input: RosterInput,
  ): Promise<Outcome | null> {
    if (!isOverdue(row, this.today(input))) return null;
    await this.setStatus(em, row, 'expired', EXPIRED_OUTCOME, null);
    return { mails: [], refusal: { status: 410, message: expiredMessage(row) } };
  }

  private today(input: RosterInput): string {
    return localDate(new Date(), input.unit.timeZone);
  }

  private async publishedInput(periodId: string, em?: EntityManager): Promise<RosterInput> {
    const input = await this.input.load(periodId, {}, em);
    if (input.period.status !== 'published') {
      throw new ConflictException(
        `Swaps and open shifts are for published rosters; this period is ${input.period.status}`,
      );
    }
    return input;
  }

  /** The caller's staff member on the period's unit (403 when they are not on its roster). */
  staffOf(user: AuthUser, input: RosterInput): StaffMemberEntity {
    const me = input.staff.find((s) => s.userId === user.id);
    if (!me || user.role !== 'staff') throw new ForbiddenException('Only staff on this roster can do this');
    return me;
  }

  private async visibleRequest(em: EntityManager, user: AuthUser, id: string): Promise<SwapRequestEntity> {
    const row = await em.findOneBy(SwapRequestEntity, { id });
    if (!row) throw new NotFoundException('Swap request not found');
    if (user.role === 'staff') {
      const ids = [row.proposerStaffMemberId, row.colleagueStaffMemberId].filter((x): x is string => !!x);
      const mine = await em.countBy(StaffMemberEntity, { id: In(ids), userId: user.id });
      if (!mine) throw new NotFoundException('Swap request not found');
    } else {
      const unit = (await em.query(`SELECT "organisationId" FROM "units" WHERE "id" = ?`, [row.unitId])) as {
        organisationId: string;
      }[];
      if (unit[0]?.organisationId !== user.organisationId)
        throw new NotFoundException('Swap request not found');
      assertUnitAccess(user, row.unitId);
    }
    return row;
  }

  private async setStatus(
    em: EntityManager,
    row: SwapRequestEntity,
    status: SwapStatus,
    outcome: string | null,
    decidedById: string | null,
  ): Promise<void> {
    // Optimistic: only from the status read in this transaction (a racing decision makes this 0 rows).
    const { affected } = await em.update(
      SwapRequestEntity,
      { id: row.id, status: row.status, version: row.version },
      { status, outcome, decidedById: decidedById ?? row.decidedById, version: row.version + 1 },
    );
    if (affected !== 1) throw new ConflictException('This request was decided meanwhile: reload it');
    if (SWAP_FINAL_STATUSES.includes(status)) {
      await em.update(
        SwapLinkTokenEntity,
        { swapRequestId: row.id, usedAt: IsNull() },
        { usedAt: new Date() },
      );
    }
    row.status = status;
    row.version += 1;
  }

  private async createLink(em: EntityManager, requestId: string, userId: string, role: SwapLinkRole) {
    const token = randomToken();
    await em.insert(SwapLinkTokenEntity, {
      swapRequestId: requestId,
      userId,
      role,
      tokenHash: sha256(token),
      expiresAt: new Date(Date.now() + this.linkTtlSeconds * 1000),
      usedAt: null,
    });
    return token;
  }

  private async retireLinks(em: EntityManager, requestId: string, role: SwapLinkRole): Promise<void> {
    await em.update(
      SwapLinkTokenEntity,
      { swapRequestId: requestId, role, usedAt: IsNull() },
      { usedAt: new Date() },
    );
  }

  /** The stored link for a token, or a clear refusal (unknown or tampered, used, expired). Changes nothing. */
  private async validLink(em: EntityManager, token: string): Promise<SwapLinkTokenEntity> {
    if (typeof token !== 'string' || !/^[A-Za-z0-9_-]{20,100}$/.test(token)) {
      throw new BadRequestException(['token: this link is not valid (it may have been cut or changed)']);
    }
    const link = await em.findOneBy(SwapLinkTokenEntity, { tokenHash: sha256(token) });
    if (!link)
      throw new BadRequestException(['token: this link is not valid (it may have been cut or changed)']);
    if (link.usedAt) {
      throw new GoneException('This link has already been used, or the decision was made another way');
    }
    if (link.expiresAt.getTime() <= Date.now()) {
      throw new GoneException(
        `This link has expired: please decide in Rotaplex under ${link.role === 'manager' ? 'Swap approvals' : 'Swaps'}`,
      );
    }
    return link;
  }

  private async actorOf(em: EntityManager, userId: string): Promise<Actor> {
    const user = await em.findOne(UserEntity, { where: { id: userId }, relations: { units: true } });
    if (!user || !user.active)
      throw new ForbiddenException('The account this link was sent to is no longer active');
    return {
      id: user.id,
      role: user.role,
      unitIds: user.units.map((u) => u.id),
      organisationId: user.organisationId,
      displayName: user.displayName,
      email: user.email,
    };
  }

  /** Active managers of the unit (admins of the organisation when the unit has none). */
  private async approvers(em: EntityManager, input: RosterInput): Promise<UserEntity[]> {
    const managers = await em
      .createQueryBuilder(UserEntity, 'u')
      .innerJoin('u.units', 'unit', 'unit.id = :unitId', { unitId: input.unit.id })
      .where('u.role = :role AND u.active = :active', { role: 'manager', active: true })
      .getMany();
    if (managers.length) return managers;
    return em.findBy(UserEntity, { organisationId: input.unit.organisationId, role: 'admin', active: true });
  }

  private async managerLinks(
    em: EntityManager,
    input: RosterInput,
    row: SwapRequestEntity,
    subject: string,
    lines: string[],
  ): Promise<OutgoingMail[]> {
    const mails: OutgoingMail[] = [];
    for (const m of await this.approvers(em, input)) {
      const token = await this.createLink(em, row.id, m.id, 'manager');
      mails.push(
        swapMail({
          to: m.email,
          name: m.displayName,
          subject,
          lines,
          timeZone: input.unit.timeZone,
          place: 'Swap approvals',
          action: { label: 'Approve or decline', url: this.link(token) },
        }),
      );
    }
    return mails;
  }

  private managerNote(input: RosterInput, actor: Actor, subject: string, lines: string[]): OutgoingMail {
    return swapMail({
      to: actor.email,
      name: actor.displayName,
      subject,
      lines,
      timeZone: input.unit.timeZone,
      place: 'Swap approvals',
    });
  }

  private async mailPeople(
    em: EntityManager,
    input: RosterInput,
    staffIds: string[],
    subject: string,
    lines: string[],
  ): Promise<OutgoingMail[]> {
    const mails: OutgoingMail[] = [];
    for (const s of await em.findBy(StaffMemberEntity, { id: In(staffIds) })) {
      const user = s.userId ? await em.findOneBy(UserEntity, { id: s.userId }) : null;
      const to = user?.email ?? s.email;
      if (!to) continue;
      mails.push(
        swapMail({ to, name: s.name, subject, lines, timeZone: input.unit.timeZone, place: 'Swaps' }),
      );
    }
    return mails;
  }

  private link(token: string): string {
    return `${this.config.publicUrl ?? ''}${SWAP_DECISION_WEB_PATH}?token=${encodeURIComponent(token)}`;
  }

  /** Queues the mails in the outbox inside the change's transaction: they go only if it commits. */
  async queue(em: EntityManager, mails: OutgoingMail[]): Promise<void> {
    for (const mail of mails) await this.mail.send(mail, em);
  }

  private async toDtos(em: EntityManager, rows: SwapRequestEntity[], user: Actor): Promise<SwapRequestDto[]> {
    const staffIds = [
      ...new Set(
        rows.flatMap((r) => [
          r.proposerStaffMemberId,
          ...(r.colleagueStaffMemberId ? [r.colleagueStaffMemberId] : []),
          ...(JSON.parse(r.changes) as StoredCellChange[]).map((c) => c.staffMemberId),
        ]),
      ),
    ];
    const staff = staffIds.length ? await em.findBy(StaffMemberEntity, { id: In(staffIds) }) : [];
    const names = new Map(staff.map((s) => [s.id, s.name]));
    const shiftTypes = await em
      .query(`SELECT "id", "code" FROM "shift_types"`)
      .then((r: { id: string; code: string }[]) => r);
    const lookup = { staff, shiftTypes } as unknown as Pick<RosterInput, 'staff' | 'shiftTypes'>;
    return rows.map((r) => {
      const proposer = staff.find((s) => s.id === r.proposerStaffMemberId);
      const colleague = staff.find((s) => s.id === r.colleagueStaffMemberId);
      const actions: SwapAction[] = [];
      const pending = r.status === 'proposed' || r.status === 'accepted';
      if (pending && proposer?.userId === user.id) actions.push('cancel');
      if (r.status === 'proposed' && colleague?.userId === user.id) actions.push('accept', 'decline');
      if (
        r.status === 'accepted' &&
        hasPermission(user.role, 'requests:approve') &&
        canAccessUnit(user, r.unitId)
      )
        actions.push('approve', 'refuse');
      return {
        id: r.id,
        kind: r.kind,
        status: r.status,
        rosterPeriodId: r.rosterPeriodId,
        unitId: r.unitId,
        proposerStaffMemberId: r.proposerStaffMemberId,
        proposerName: names.get(r.proposerStaffMemberId) ?? '',
        colleagueStaffMemberId: r.colleagueStaffMemberId,
        colleagueName: r.colleagueStaffMemberId ? (names.get(r.colleagueStaffMemberId) ?? '') : null,
        changes: (JSON.parse(r.changes) as StoredCellChange[]).map((c) => changeDto(lookup, c, names)),
        note: r.note,
        outcome: r.outcome,
        createdAt: r.createdAt.toISOString(),
        updatedAt: r.updatedAt.toISOString(),
        actions,
      };
    });
  }
}

/** The earliest day a request changes. */
function firstDateOf(changes: StoredCellChange[]): string {
  return changes.map((c) => c.date).sort()[0];
}

function shiftOf(input: RosterInput, id: string | null) {
  return id === null ? undefined : input.shiftTypes.find((s) => s.id === id);
}

function staffName(input: RosterInput, id: string): string {
  return input.staff.find((s) => s.id === id)?.name ?? 'someone';
}

function newMessages(p: SwapPreviewDto): string[] {
  return p.violations.filter((v) => v.isNew).map((v) => v.message);
}

/** The request in words: who works what after the change. */
function summary(input: RosterInput, row: SwapRequestEntity): string {
  const changes = JSON.parse(row.changes) as StoredCellChange[];
  return changes
    .filter((c) => c.after !== null)
    .map((c) => `${staffName(input, c.staffMemberId)} works ${shiftWords(shiftOf(input, c.after), c.date)}`)
    .join(' and ');
}

function describe(
  input: RosterInput,
  changes: StoredCellChange[],
  me: StaffMemberEntity,
  colleague: StaffMemberEntity,
  kind: 'swap' | 'offer',
): string[] {
  const give = changes.find((c) => c.staffMemberId === me.id && c.before !== null)!;
  if (kind === 'offer') {
    return [`${me.name} offers you their shift ${shiftWords(shiftOf(input, give.before), give.date)}.`];
  }
  const take = changes.find((c) => c.staffMemberId === colleague.id && c.before !== null)!;
  return [
    `${me.name} asks to swap: you would work ${shiftWords(shiftOf(input, give.before), give.date)}, ` +
      `and they would work your shift ${shiftWords(shiftOf(input, take.before), take.date)}.`,
    'Rotaplex checked both rosters after the swap: it breaks no rule.',
  ];
}
