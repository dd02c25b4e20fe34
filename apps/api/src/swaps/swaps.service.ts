import { Injectable } from '@nestjs/common';
import { type SwapRequestDto } from '@rotaplex/contracts';
import { type EntityManager } from 'typeorm';
import { type AuthUser } from '../common/auth-user';
import { type OutgoingMail } from '../mail/mail.service';
import { type RosterInput } from '../roster-input/roster-input.service';
import { type StaffMemberEntity } from '../staff/staff-member.entity';
import { type OutsideCover } from './outside-cover';
import { SwapDecisions } from './swap-decisions.service';
import { SwapMailer } from './swap-mailer';
import { SwapPlanning } from './swap-planning.service';
import { SwapReads } from './swap-reads.service';
import { SwapRequestEntity, type StoredCellChange } from './swap-request.entity';

/**
 * What other modules ask of swaps (open shifts: who the caller is on a roster, a new claim and its
 * mails, a request as the caller sees it). The work itself is split by job: SwapReads (reading and
 * who sees what), SwapPlanning (proposals, previews, claims), SwapDecisions (cancel, accept,
 * approve, e-mailed links), SwapLinks (decision tokens), SwapMailer and swap-mails (mails and their
 * words) and SwapExpiryService (the scheduled expiry).
 */
@Injectable()
export class SwapsService {
  constructor(
    private readonly reads: SwapReads,
    private readonly planning: SwapPlanning,
    private readonly mailer: SwapMailer,
    private readonly decisions: SwapDecisions,
  ) {}

  /**
   * Where people filling open shifts from outside the roster are recorded: the approval of a claim
   * counts them in its transaction and refuses (409) a shift they fill in full.
   */
  coverOutsideFrom(source: OutsideCover): void {
    this.decisions.coverOutsideFrom(source);
  }

  /**
   * Open-shift claims of a period waiting for a manager (of one person when given): the cell each
   * would change and the skill it claims, in the caller's transaction.
   */
  async waitingClaims(
    em: EntityManager,
    periodId: string,
    proposerStaffMemberId?: string,
  ): Promise<{ change: StoredCellChange; skillId: string | null }[]> {
    const rows = await em.findBy(SwapRequestEntity, {
      rosterPeriodId: periodId,
      kind: 'claim',
      status: 'accepted',
      ...(proposerStaffMemberId ? { proposerStaffMemberId } : {}),
    });
    return rows.map((row) => ({
      change: (JSON.parse(row.changes) as StoredCellChange[])[0],
      skillId: row.skillId,
    }));
  }

  /** The caller's staff member on the period's unit (403 when they are not on its roster). */
  staffOf(user: AuthUser, input: RosterInput): StaffMemberEntity {
    return this.reads.staffOf(user, input);
  }

  /** Creates an open-shift claim (already "accepted": it waits for a manager) and its mails to the managers. */
  createClaim(
    em: EntityManager,
    input: RosterInput,
    me: StaffMemberEntity,
    change: StoredCellChange,
    skillId: string | null,
    note: string | null,
  ): Promise<{ id: string; mails: OutgoingMail[] }> {
    return this.planning.createClaim(em, input, me, change, skillId, note);
  }

  /** Queues the mails in the outbox inside the change's transaction: they go only if it commits. */
  queue(em: EntityManager, mails: OutgoingMail[]): Promise<void> {
    return this.mailer.queue(em, mails);
  }

  get(user: AuthUser, id: string): Promise<SwapRequestDto> {
    return this.reads.get(user, id);
  }
}
