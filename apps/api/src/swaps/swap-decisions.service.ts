import {
  BadRequestException,
  ConflictException,
  ForbiddenException,
  GoneException,
  Injectable,
  UnprocessableEntityException,
} from '@nestjs/common';
import {
  hasPermission,
  SWAP_FINAL_STATUSES,
  type SwapDecisionDto,
  type SwapLinkViewDto,
  type SwapPreviewDto,
  type SwapRequestDto,
  type StaleVersionDto,
  type SwapStatus,
} from '@rotaplex/contracts';
import { DataSource, type EntityManager } from 'typeorm';
import { AuditService } from '../audit/audit.service';
import { type AuthUser } from '../common/auth-user';
import { canAccessUnit } from '../common/unit-scope';
import { dateInWords } from '../common/text/date-words';
import { type OutgoingMail } from '../mail/mail.service';
import { lateChangesOf, lateSummary } from '../roster-periods/notice-window';
import { PeriodWriter } from '../roster-periods/period-writer';
import { type RosterInput, RosterInputService } from '../roster-input/roster-input.service';
import { StaffService } from '../staff/staff.service';
import { UsersService } from '../users/users.service';
import { evaluateChanges, staleCells } from './swap-evaluation';
import { EXPIRED_OUTCOME, expiredMessage, isOverdue } from './swap-expiry.service';
import { type OutsideCover } from './outside-cover';
import { SwapLinks } from './swap-links';
import { SwapMailer } from './swap-mailer';
import { lateLines, lateManagerLine, newMessages, staffName, summary } from './swap-mails';
import { SwapReads } from './swap-reads.service';
import { type StoredCellChange, SwapRequestEntity } from './swap-request.entity';

/** What a decision produced: mails (queued in its transaction), and a refusal to report after the commit. */
interface Outcome {
  mails: OutgoingMail[];
  refusal?: {
    status: 409 | 410 | 422;
    message: string;
    findings?: SwapPreviewDto;
    /** A stale roster: the period's version now and the cell changes since the request was made. */
    stale?: Pick<StaleVersionDto, 'version' | 'changes'>;
  };
}

type Actor = AuthUser;

/**
 * Decisions on swaps, offers and open-shift claims: the proposer's cancel, the colleague's answer,
 * the manager's approval (in the app or through a single-use e-mail link) and the change itself,
 * applied through the period's writer in one transaction only if the roster still holds the cells
 * recorded at proposal and the rules still hold (and, for a claim, the shift is still wanted: people
 * on the roster and people filled from outside it count). Every decision re-checks expiry itself.
 */
@Injectable()
export class SwapDecisions {
  constructor(
    private readonly dataSource: DataSource,
    private readonly input: RosterInputService,
    private readonly reads: SwapReads,
    private readonly links: SwapLinks,
    private readonly mailer: SwapMailer,
    private readonly auditTrail: AuditService,
    private readonly writer: PeriodWriter,
    private readonly staff: StaffService,
    private readonly users: UsersService,
  ) {}

  /** People filling open shifts from outside the roster (registered by the open-shifts module). */
  private outsideCover: OutsideCover | null = null;

  coverOutsideFrom(source: OutsideCover): void {
    this.outsideCover = source;
  }

  async cancel(user: AuthUser, id: string): Promise<SwapRequestDto> {
    const outcome = await this.dataSource.transaction(async (em): Promise<Outcome> => {
      const row = await this.reads.visibleRequest(em, user, id);
      const proposer = await this.staff.byId(row.proposerStaffMemberId, em);
      const me = proposer?.userId === user.id ? proposer : null;
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
          ...(await this.mailer.mailPeople(
            em,
            input,
            [row.colleagueStaffMemberId],
            `${me.name} cancelled a swap`,
            [`${me.name} cancelled their request: ${summary(input, row)}.`, 'Your roster stays as it was.'],
          )),
        );
      }
      await this.mailer.queue(em, mails);
      return { mails };
    });
    await this.finish(outcome);
    return this.reads.get(user, id);
  }

  /** A decision in the app by the signed-in user. */
  async decide(user: AuthUser, id: string, body: SwapDecisionDto): Promise<SwapRequestDto> {
    const outcome = await this.dataSource.transaction(async (em) => {
      const row = await this.reads.visibleRequest(em, user, id);
      const result = await this.decideIn(em, row, user, body);
      await this.mailer.queue(em, result.mails);
      return result;
    });
    await this.finish(outcome);
    return this.reads.get(user, id);
  }

  /** What an e-mail link shows before the person confirms. Changes nothing (mail scanners may fetch it). */
  async viewLink(token: string): Promise<SwapLinkViewDto> {
    const m = this.dataSource.manager;
    const link = await this.links.valid(m, token);
    const row = await m.findOneByOrFail(SwapRequestEntity, { id: link.swapRequestId });
    const actor = await this.actorOf(m, link.userId);
    const input = await this.input.load(row.rosterPeriodId, {}, m);
    const dto = await this.reads.dtoOf(m, row, actor);
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
      const link = await this.links.valid(em, token);
      const allowed = link.role === 'colleague' ? ['accept', 'decline'] : ['approve', 'refuse'];
      if (!allowed.includes(body.decision)) {
        throw new BadRequestException([`decision: this link can only ${allowed.join(' or ')}`]);
      }
      await this.links.useUp(em, link);
      const row = await em.findOneByOrFail(SwapRequestEntity, { id: link.swapRequestId });
      const actor = await this.actorOf(em, link.userId);
      const result = await this.decideIn(em, row, actor, body);
      await this.mailer.queue(em, result.mails);
      return { ...result, id: row.id, actor };
    });
    await this.finish(outcome);
    const m = this.dataSource.manager;
    const row = await m.findOneByOrFail(SwapRequestEntity, { id: outcome.id });
    return this.reads.dtoOf(m, row, outcome.actor);
  }

  /** Reports a refusal (recorded in the committed transaction) as an error. */
  private async finish(outcome: Outcome): Promise<void> {
    if (outcome.refusal) {
      const body = { statusCode: outcome.refusal.status, message: outcome.refusal.message };
      if (outcome.refusal.status === 422) {
        throw new UnprocessableEntityException({ ...body, findings: outcome.refusal.findings });
      }
      if (outcome.refusal.status === 410) throw new GoneException(body);
      throw new ConflictException({ ...body, error: 'Conflict', ...outcome.refusal.stale });
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
        ? await this.staff.byId(row.colleagueStaffMemberId, em)
        : null;
      if (!colleague || colleague.userId !== actor.id) {
        throw new ForbiddenException('Only the colleague asked can accept or decline this request');
      }
      if (row.status !== 'proposed') throw new ConflictException(`This request is already ${row.status}`);
      const proposer = await this.staff.byIdOrFail(row.proposerStaffMemberId, em);
      await this.links.retire(em, row.id, 'colleague');
      if (body.decision === 'decline') {
        await this.setStatus(
          em,
          row,
          'declined',
          `Declined by ${colleague.name}${reason ? `: ${reason}` : ''}`,
          null,
        );
        return {
          mails: await this.mailer.mailPeople(
            em,
            input,
            [proposer.id],
            `${colleague.name} declined your swap`,
            [
              `${colleague.name} declined: ${summary(input, row)}.`,
              ...(reason ? [`Their reason: "${reason}"`] : []),
              'Your roster stays as it was.',
            ],
          ),
        };
      }
      await this.setStatus(em, row, 'accepted', null, null);
      const mails = await this.mailer.mailPeople(
        em,
        input,
        [proposer.id],
        `${colleague.name} accepted your swap`,
        [
          `${colleague.name} accepted: ${summary(input, row)}.`,
          'A manager of the unit now approves or declines it; you will hear the result.',
        ],
      );
      mails.push(
        ...(await this.mailer.managerLinks(
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
    await this.links.retire(em, row.id, 'manager');
    const involved = [
      row.proposerStaffMemberId,
      ...(row.colleagueStaffMemberId ? [row.colleagueStaffMemberId] : []),
    ];
    const what = summary(input, row);
    const refuse = async (outcome: string, refusal: Outcome['refusal']): Promise<Outcome> => {
      await this.setStatus(em, row, 'refused', outcome, actor.id);
      const mails = await this.mailer.mailPeople(em, input, involved, 'A roster change was declined', [
        `Not approved: ${what}.`,
        outcome,
        'Your roster stays as it was.',
      ]);
      mails.push(
        this.mailer.managerNote(input, actor, 'A roster change was declined', [
          `Not approved: ${what}.`,
          outcome,
        ]),
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
    const rows = await this.writer.rowsOf(row.rosterPeriodId, em);
    // The request holds the period as it was when asked for: its own cells are the lock (the
    // period's writer records who changed what since), and the rules are checked again below on
    // the roster as it is now, whatever else changed meanwhile.
    const stale = staleCells(rows, changes);
    if (stale.length) {
      const cells = stale
        .map((c) => `${staffName(input, c.staffMemberId)} on ${dateInWords(c.date)}`)
        .join(', ');
      const since = await this.writer.changesAfter(em, row.rosterPeriodId, row.createdAt);
      const by = [...new Set(since.map((c) => `${c.kind} by ${c.actorName}`))].slice(0, 5);
      const message =
        `The roster changed since this was asked (${cells}): nothing was changed` +
        (by.length ? `. Changed since: ${by.join(', ')}` : '');
      return refuse(message, {
        status: 409,
        message,
        stale: { version: input.period.version, changes: since },
      });
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
      // People from outside the roster (bank or agency) may have been recorded on it since the claim.
      // Claims exist only through the open-shifts module, which registers where those are kept.
      if (!this.outsideCover)
        throw new Error('No record of outside cover is registered for open-shift claims');
      const outside = await this.outsideCover.filledOutside(em, row.rosterPeriodId, {
        date: c.date,
        shiftTypeId: need.shiftTypeId,
        skillId: row.skillId,
      });
      if (have + outside >= need.target) {
        const message =
          `The open shift has been filled from outside the roster meanwhile (${outside} ` +
          `${outside === 1 ? 'person' : 'people'} from bank or agency staff): nothing was changed`;
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
    const version = await this.writer.writeCells(em, row.rosterPeriodId, cells, {
      kind: row.kind === 'claim' ? 'open-shift-claim' : 'swap',
      actorUserId: actor.id,
    });
    // The cells the writer recorded as changed inside the notice window (none when nothing changed:
    // the version stays and its late changes are an earlier change's).
    const late = version === input.period.version ? [] : await lateChangesOf(em, row.rosterPeriodId, version);
    await this.setStatus(em, row, 'approved', `Approved by ${actor.displayName}`, actor.id);
    await this.auditTrail.record(em, {
      rosterPeriodId: row.rosterPeriodId,
      actorUserId: actor.id,
      kind: row.kind === 'claim' ? 'open-shift-claim' : 'swap',
      summary:
        `${row.kind === 'claim' ? 'Open shift claim' : row.kind === 'swap' ? 'Swap' : 'Shift given away'}: ${what}` +
        lateSummary(late),
      before: changes.map((c) => ({ staffMemberId: c.staffMemberId, date: c.date, shiftTypeId: c.before })),
      after: changes.map((c) => ({ staffMemberId: c.staffMemberId, date: c.date, shiftTypeId: c.after })),
    });
    const mails = await this.mailer.mailPeople(
      em,
      input,
      involved,
      'Your roster has changed',
      [`Approved by ${actor.displayName}: ${what}.`, 'Your roster and calendar now show the change.'],
      lateLines(late),
    );
    const lateLine = lateManagerLine(late);
    mails.push(
      this.mailer.managerNote(input, actor, 'You approved a roster change', [
        `Approved: ${what}.`,
        ...(lateLine ? [lateLine] : []),
      ]),
    );
    return { mails };
  }

  /**
   * A pending request whose first day has passed (in the unit's time zone) expires now, in the
   * caller's transaction; the refusal (410) is reported after the commit.
   */
  private async expireIfOverdue(
    em: EntityManager,
    row: SwapRequestEntity,
    input: RosterInput,
  ): Promise<Outcome | null> {
    if (!isOverdue(row, this.reads.today(input))) return null;
    await this.setStatus(em, row, 'expired', EXPIRED_OUTCOME, null);
    return { mails: [], refusal: { status: 410, message: expiredMessage(row) } };
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
    if (SWAP_FINAL_STATUSES.includes(status)) await this.links.retireAll(em, row.id);
    row.status = status;
    row.version += 1;
  }

  private async actorOf(em: EntityManager, userId: string): Promise<Actor> {
    const user = await this.users.activeAuthUserIn(userId, em);
    if (!user) throw new ForbiddenException('The account this link was sent to is no longer active');
    return user;
  }
}
