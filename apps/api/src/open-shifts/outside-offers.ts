import { BadRequestException, ConflictException, NotFoundException } from '@nestjs/common';
import { type OutsideOfferDto } from '@rotaplex/contracts';
import { randomUUID } from 'node:crypto';
import { type EntityManager, In } from 'typeorm';
import { type AssignmentEntity } from '../roster-periods/assignment.entity';
import { type AuditService } from '../audit/audit.service';
import { type AuthUser } from '../common/auth-user';
import { localDate } from '../common/dates';
import { dateInWords } from '../common/text/date-words';
import { assertUnitAccess } from '../common/unit-scope';
import { type PeriodWriter } from '../roster-periods/period-writer';
import { type RosterInput, type RosterInputService } from '../roster-input/roster-input.service';
import { type SkillsService } from '../skills/skills.service';
import { type UsersService } from '../users/users.service';
import { type CreateOutsideOfferBody, type FillOutsideOfferBody } from './dto/outside-offer.dto';
import { OutsideOfferEntity } from './outside-offer.entity';

/** A need of the roster: date, shift type and skill (null: anyone). */
export interface NeedKey {
  date: string;
  shiftTypeId: string;
  skillId: string | null;
}

export const sameNeed = (a: NeedKey, b: NeedKey) =>
  a.date === b.date && a.shiftTypeId === b.shiftTypeId && (a.skillId ?? null) === (b.skillId ?? null);

/** The offers of a period that are current (offered or filled); withdrawn ones are history. */
export function currentOffers(em: EntityManager, periodId: string): Promise<OutsideOfferEntity[]> {
  return em.findBy(OutsideOfferEntity, { rosterPeriodId: periodId, status: In(['offered', 'filled']) });
}

/** How many people from outside the roster fill the need, by its current offer (0 when none is filled). */
export function filledOutside(offers: OutsideOfferEntity[], need: NeedKey): number {
  const offer = offers.find((o) => sameNeed(o, need));
  return offer?.status === 'filled' ? (offer.people ?? 0) : 0;
}

/**
 * Open needs less the people filled from outside the roster: a need whose shortfall outside staff
 * cover in full is no longer open; one covered in part stays open for the rest. Each need carries its
 * current offer.
 */
export function lessFilledOutside<T extends NeedKey & { short: number; belowMinimum: number }>(
  needs: T[],
  offers: OutsideOfferEntity[],
): (T & { offer: OutsideOfferEntity | null })[] {
  return needs.flatMap((n) => {
    const offer = offers.find((o) => sameNeed(o, n)) ?? null;
    const filled = filledOutside(offers, n);
    const short = n.short - filled;
    if (short <= 0) return [];
    return [{ ...n, short, belowMinimum: Math.max(0, n.belowMinimum - filled), offer }];
  });
}

export function offerDto(o: OutsideOfferEntity): OutsideOfferDto {
  return {
    id: o.id,
    rosterPeriodId: o.rosterPeriodId,
    date: o.date,
    shiftTypeId: o.shiftTypeId,
    skillId: o.skillId,
    offeredTo: o.offeredTo,
    note: o.note,
    status: o.status,
    people: o.people,
    offeredByName: o.offeredByName,
    offeredAt: o.offeredAt.toISOString(),
    updatedAt: o.updatedAt.toISOString(),
  };
}

/** What staff see of an offer: that it was made and its state, not to whom, by whom or the note. */
export function offerForStaff(o: OutsideOfferDto): OutsideOfferDto {
  return { ...o, offeredTo: '', note: null, offeredByName: '' };
}

type UnmetNeeds = (
  input: RosterInput,
  rows: Pick<AssignmentEntity, 'staffMemberId' | 'date' | 'shiftTypeId'>[],
  fromDate: string,
) => (NeedKey & { short: number; belowMinimum: number })[];

/**
 * Offering open shifts to bank or agency staff outside the roster, withdrawing the offer and marking
 * it filled. Each change is one transaction with its audit entry ('open-shift-outside'); only managers
 * and planners of the period's unit (the controller's `rosters:plan` and `assertUnitAccess` here).
 */
export class OutsideOffers {
  constructor(
    private readonly input: RosterInputService,
    private readonly audit: AuditService,
    private readonly cells: PeriodWriter,
    private readonly unmetNeeds: UnmetNeeds,
    private readonly users: UsersService,
    private readonly skills: SkillsService,
  ) {}

  async create(em: EntityManager, user: AuthUser, body: CreateOutsideOfferBody): Promise<OutsideOfferDto> {
    const input = await this.published(em, user, body.rosterPeriodId);
    const need = await this.openNeed(em, input, body);
    if (need.offer) {
      throw new ConflictException(
        `This shift is already ${need.offer.status === 'filled' ? 'filled' : 'offered'} outside the roster (to ${need.offer.offeredTo}); withdraw that offer first`,
      );
    }
    const actor = await this.users.byIdOrFail(user.id, em);
    const now = new Date();
    const row = em.create(OutsideOfferEntity, {
      id: randomUUID(),
      rosterPeriodId: input.period.id,
      date: body.date,
      shiftTypeId: body.shiftTypeId,
      skillId: body.skillId ?? null,
      offeredTo: body.offeredTo.trim(),
      note: body.note?.trim() || null,
      status: 'offered',
      people: null,
      offeredById: user.id,
      offeredByName: actor.displayName.slice(0, 200),
      offeredAt: now,
      updatedAt: now,
    });
    await em.save(row);
    const what = await this.shiftWords(em, input, row);
    await this.audit.record(em, {
      rosterPeriodId: input.period.id,
      actorUserId: user.id,
      kind: 'open-shift-outside',
      summary:
        `Offered ${what} outside the roster to ${row.offeredTo} (${need.short} still wanted` +
        `${need.belowMinimum ? `, ${need.belowMinimum} below minimum` : ''})${row.note ? `. Note: ${row.note}` : ''}`,
      before: null,
      after: offerDto(row),
    });
    return offerDto(row);
  }

  async withdraw(em: EntityManager, user: AuthUser, id: string): Promise<OutsideOfferDto> {
    const { row, input } = await this.offer(em, user, id);
    if (row.status === 'withdrawn') throw new ConflictException('This offer is already withdrawn');
    const before = offerDto(row);
    row.status = 'withdrawn';
    row.updatedAt = new Date();
    await em.save(row);
    await this.audit.record(em, {
      rosterPeriodId: row.rosterPeriodId,
      actorUserId: user.id,
      kind: 'open-shift-outside',
      summary: `Withdrew the offer of ${await this.shiftWords(em, input, row)} to ${row.offeredTo}${
        before.status === 'filled' ? ' (it was filled; the shift counts as open again)' : ''
      }`,
      before,
      after: offerDto(row),
    });
    return offerDto(row);
  }

  async fill(
    em: EntityManager,
    user: AuthUser,
    id: string,
    body: FillOutsideOfferBody,
  ): Promise<OutsideOfferDto> {
    const { row, input } = await this.offer(em, user, id);
    if (row.status !== 'offered') {
      throw new ConflictException(
        `Only an offer waiting for an answer can be marked filled; this one is ${row.status}`,
      );
    }
    const need = await this.openNeed(em, input, row);
    const people = body.people ?? need.short;
    if (people > need.short) {
      throw new BadRequestException([
        `people: the shift wants ${need.short} more ${need.short === 1 ? 'person' : 'people'}, not ${people}`,
      ]);
    }
    const before = offerDto(row);
    row.status = 'filled';
    row.people = people;
    row.updatedAt = new Date();
    await em.save(row);
    await this.audit.record(em, {
      rosterPeriodId: row.rosterPeriodId,
      actorUserId: user.id,
      kind: 'open-shift-outside',
      summary:
        `Filled ${await this.shiftWords(em, input, row)} outside the roster: ${people} ` +
        `${people === 1 ? 'person' : 'people'} from ${row.offeredTo}` +
        (people < need.short ? ` (${need.short - people} still wanted)` : ''),
      before,
      after: offerDto(row),
    });
    return offerDto(row);
  }

  /** The period, checked: the caller's unit, and published. */
  private async published(em: EntityManager, user: AuthUser, periodId: string): Promise<RosterInput> {
    const input = await this.input.load(periodId, {}, em);
    assertUnitAccess(user, input.period.unitId);
    if (input.period.status !== 'published') {
      throw new ConflictException(
        `Open shifts are for published rosters; this period is ${input.period.status}`,
      );
    }
    return input;
  }

  private async offer(em: EntityManager, user: AuthUser, id: string) {
    const row = await em.findOneBy(OutsideOfferEntity, { id });
    if (!row) throw new NotFoundException('Offer not found');
    const input = await this.input.load(row.rosterPeriodId, {}, em);
    assertUnitAccess(user, input.period.unitId);
    return { row, input };
  }

  /** The need as open now (from today in the unit's zone, less outside fills), or 409. */
  private async openNeed(em: EntityManager, input: RosterInput, key: NeedKey) {
    const rows = await this.cells.rowsOf(input.period.id, em);
    const today = localDate(new Date(), input.unit.timeZone);
    const offers = await currentOffers(em, input.period.id);
    const need = lessFilledOutside(this.unmetNeeds(input, rows, today), offers).find((n) => sameNeed(n, key));
    if (!need) {
      throw new ConflictException('This shift is not open (it is covered, past or not a need of the roster)');
    }
    return need;
  }

  private async shiftWords(em: EntityManager, input: RosterInput, key: NeedKey): Promise<string> {
    const shift = input.shiftTypes.find((s) => s.id === key.shiftTypeId);
    const skill = key.skillId ? ((await this.skills.byIds([key.skillId], em))[0] ?? null) : null;
    return (
      `${shift ? `${shift.name} (${shift.code})` : 'a shift'} on ${dateInWords(key.date)}` +
      (skill ? ` needing ${skill.code}` : '')
    );
  }
}
