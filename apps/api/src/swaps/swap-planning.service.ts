import { BadRequestException, Injectable, UnprocessableEntityException } from '@nestjs/common';
import { type ProposeSwapDto, type SwapPreviewDto, type SwapRequestDto } from '@rotaplex/contracts';
import { DataSource, type EntityManager } from 'typeorm';
import { type AuthUser } from '../common/auth-user';
import { assertUnitAccess } from '../common/unit-scope';
import { dateInWords } from '../common/text/date-words';
import { type OutgoingMail } from '../mail/mail.service';
import { PeriodWriter } from '../roster-periods/period-writer';
import { type RosterInput } from '../roster-input/roster-input.service';
import { type StaffMemberEntity } from '../staff/staff-member.entity';
import { UsersService } from '../users/users.service';
import { evaluateChanges } from './swap-evaluation';
import { SwapMailer } from './swap-mailer';
import { describe, newMessages, shiftOf, shiftWords } from './swap-mails';
import { SwapReads } from './swap-reads.service';
import { type StoredCellChange, SwapRequestEntity } from './swap-request.entity';

/**
 * Asking for a change of a published roster: the cell changes a swap or offer makes, the checker's
 * preview of them, the proposal (refused when it breaks a rule) with its mail and link to the
 * colleague, and open-shift claims with their mails to the unit's approvers.
 */
@Injectable()
export class SwapPlanning {
  constructor(
    private readonly dataSource: DataSource,
    private readonly reads: SwapReads,
    private readonly mailer: SwapMailer,
    private readonly users: UsersService,
    private readonly cells: PeriodWriter,
  ) {}

  async preview(user: AuthUser, body: ProposeSwapDto): Promise<SwapPreviewDto> {
    const { input, changes, rows } = await this.planSwap(this.dataSource.manager, user, body);
    return evaluateChanges(input, rows, changes);
  }

  async propose(user: AuthUser, body: ProposeSwapDto): Promise<SwapRequestDto> {
    const id = await this.dataSource.transaction(async (em) => {
      // Inside the transaction: on PostgreSQL a serialisation conflict runs the callback again, and
      // its mail must not be queued twice.
      const mails: OutgoingMail[] = [];
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
      const colleagueUser = await this.users.byIdOrFail(colleague.userId!, em);
      mails.push(
        await this.mailer.colleagueLink(
          em,
          input,
          saved.id,
          colleagueUser,
          colleague.name,
          body.kind === 'swap' ? `${me.name} asks to swap a shift with you` : `${me.name} offers you a shift`,
          [
            ...describe(input, changes, me, colleague, body.kind),
            ...(saved.note ? [`Their note: "${saved.note}"`] : []),
            'Please accept or decline. A manager approves the change after you accept.',
          ],
        ),
      );
      await this.mailer.queue(em, mails);
      return saved.id;
    });
    return this.reads.get(user, id);
  }

  /** Builds the cell changes of a proposed swap or offer and checks who may ask for it. */
  private async planSwap(em: EntityManager, user: AuthUser, body: ProposeSwapDto) {
    const input = await this.reads.publishedInput(body.rosterPeriodId, em);
    assertUnitAccess(user, input.period.unitId);
    const me = this.reads.staffOf(user, input);
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
    const rows = await this.cells.rowsOf(input.period.id, em);
    const cell = (staffId: string, date: string) =>
      rows.find((r) => r.staffMemberId === staffId && r.date === date)?.shiftTypeId ?? null;
    const today = this.reads.today(input);
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
    const mails = await this.mailer.managerLinks(em, input, saved, `${me.name} claims an open shift`, [
      `${me.name} claims the open shift ${shiftWords(shiftOf(input, change.after), change.date)}.`,
      ...(note ? [`Their note: "${note}"`] : []),
      'Rotaplex checked their roster with the shift added: it breaks no rule. Please approve or decline.',
    ]);
    return { id: saved.id, mails };
  }
}

/** The earliest day a request changes. */
function firstDateOf(changes: StoredCellChange[]): string {
  return changes.map((c) => c.date).sort()[0];
}
