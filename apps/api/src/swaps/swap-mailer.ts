import { Injectable } from '@nestjs/common';
import { type EntityManager } from 'typeorm';
import { MailService, type OutgoingMail } from '../mail/mail.service';
import { type RosterInput } from '../roster-input/roster-input.service';
import { StaffService } from '../staff/staff.service';
import { type UserEntity } from '../users/user.entity';
import { UsersService } from '../users/users.service';
import { SwapLinks } from './swap-links';
import { swapMail } from './swap-mails';
import { type SwapRequestEntity } from './swap-request.entity';

/** Who acts on an e-mailed step: enough of a user to check rights and to write to them. */
export interface SwapMailActor {
  email: string;
  displayName: string;
}

/**
 * The mails of swaps, offers and claims: who gets them (the people in the request, the unit's
 * approvers), with a decision link where a step waits for them. Mails are queued in the outbox
 * inside the change's transaction, so they go only if it commits.
 */
@Injectable()
export class SwapMailer {
  constructor(
    private readonly mail: MailService,
    private readonly links: SwapLinks,
    private readonly staff: StaffService,
    private readonly users: UsersService,
  ) {}

  /** Queues the mails in the outbox inside the change's transaction: they go only if it commits. */
  async queue(em: EntityManager, mails: OutgoingMail[]): Promise<void> {
    for (const mail of mails) await this.mail.send(mail, em);
  }

  /** Active managers of the unit (admins of the organisation when the unit has none). */
  async approvers(em: EntityManager, input: RosterInput): Promise<UserEntity[]> {
    const managers = await this.users.activeManagersOf(input.unit.id, em);
    if (managers.length) return managers;
    return this.users.activeAdminsOf(input.unit.organisationId, em);
  }

  /** One mail with a fresh single-use approval link to each approver of the unit. */
  async managerLinks(
    em: EntityManager,
    input: RosterInput,
    row: SwapRequestEntity,
    subject: string,
    lines: string[],
  ): Promise<OutgoingMail[]> {
    const mails: OutgoingMail[] = [];
    for (const m of await this.approvers(em, input)) {
      const token = await this.links.create(em, row.id, m.id, 'manager');
      mails.push(
        swapMail({
          to: m.email,
          name: m.displayName,
          subject,
          lines,
          timeZone: input.unit.timeZone,
          place: 'Swap approvals',
          action: { label: 'Approve or decline', url: this.links.url(token) },
        }),
      );
    }
    return mails;
  }

  /** A mail with a fresh single-use link for the colleague asked. */
  async colleagueLink(
    em: EntityManager,
    input: RosterInput,
    requestId: string,
    to: UserEntity,
    name: string,
    subject: string,
    lines: string[],
  ): Promise<OutgoingMail> {
    const token = await this.links.create(em, requestId, to.id, 'colleague');
    return swapMail({
      to: to.email,
      name,
      subject,
      lines,
      timeZone: input.unit.timeZone,
      place: 'Swaps',
      action: { label: 'Accept or decline', url: this.links.url(token) },
    });
  }

  /** A note to the manager who decided (no link). */
  managerNote(input: RosterInput, actor: SwapMailActor, subject: string, lines: string[]): OutgoingMail {
    return swapMail({
      to: actor.email,
      name: actor.displayName,
      subject,
      lines,
      timeZone: input.unit.timeZone,
      place: 'Swap approvals',
    });
  }

  /**
   * A mail to each of the staff members (their sign-in address, else their staff address).
   * `own` adds lines for one person only (by staff member id), after the common ones: e.g. that the
   * change to their shifts is a late one.
   */
  async mailPeople(
    em: EntityManager,
    input: RosterInput,
    staffIds: string[],
    subject: string,
    lines: string[],
    own: ReadonlyMap<string, readonly string[]> = new Map(),
  ): Promise<OutgoingMail[]> {
    const mails: OutgoingMail[] = [];
    for (const s of await this.staff.byIds(staffIds, em)) {
      const user = s.userId ? await this.users.byId(s.userId, em) : null;
      const to = user?.email ?? s.email;
      if (!to) continue;
      mails.push(
        swapMail({
          to,
          name: s.name,
          subject,
          lines: [...lines, ...(own.get(s.id) ?? [])],
          timeZone: input.unit.timeZone,
          place: 'Swaps',
        }),
      );
    }
    return mails;
  }
}
