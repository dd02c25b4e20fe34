import { type CheckResult } from '@rotaplex/roster-model';
import {
  BadRequestException,
  ConflictException,
  Injectable,
  type OnModuleInit,
  UnprocessableEntityException,
} from '@nestjs/common';
import {
  type ClaimOpenShiftDto,
  type NotifyOpenShiftDto,
  type NotifyOpenShiftResultDto,
  type OpenShiftDto,
  type Page,
  ROSTER_PERIOD_MAX_DAYS,
  type OutsideOfferDto,
  shiftRedFlags,
  type SwapRequestDto,
  type WhatItWouldTakeDto,
} from '@rotaplex/contracts';
import { DataSource, type EntityManager } from 'typeorm';
import { type AssignmentEntity } from '../roster-periods/assignment.entity';
import { type AuthUser } from '../common/auth-user';
import { assertUnitAccess, visibleUnitIds } from '../common/unit-scope';
import { addDays, localDate } from '../common/dates';
import { GenerationCache, WriteGeneration } from '../database/write-generation';
import { PeriodWriter } from '../roster-periods/period-writer';
import { RosterPeriodsService } from '../roster-periods/roster-periods.service';
import { type RosterInput, RosterInputService } from '../roster-input/roster-input.service';
import { SkillsService } from '../skills/skills.service';
import { type StaffMemberEntity } from '../staff/staff-member.entity';
import { UnitsService } from '../units/units.service';
import { UsersService } from '../users/users.service';
import { ClaimCheck, evaluateChanges } from '../swaps/swap-evaluation';
import { type StoredCellChange } from '../swaps/swap-request.entity';
import { SwapsService } from '../swaps/swaps.service';
import { dateInWords } from '../common/text/date-words';
import { type OpenShiftQuery } from './dto/open-shift.dto';
import { AppConfig } from '../config/app-config';
import { MailService } from '../mail/mail.service';
import { openShiftMail, ruleInWords } from './open-shift-words';
import { AuditService } from '../audit/audit.service';
import {
  type CreateOutsideOfferBody,
  type FillOutsideOfferBody,
  type WhatItWouldTakeQueryDto,
} from './dto/outside-offer.dto';
import {
  currentOffers,
  filledOutside,
  lessFilledOutside,
  type NeedKey,
  offerDto,
  offerForStaff,
  OutsideOffers,
} from './outside-offers';
import { HOW_TO_CHANGE_PUBLISHED, whatItWouldTake } from './what-it-would-take';

type Cell = Pick<AssignmentEntity, 'staffMemberId' | 'date' | 'shiftTypeId'>;

/** A need of a published period with fewer people on it than its target (from today on). */
export function unmetNeeds(input: RosterInput, rows: Cell[], fromDate: string) {
  const skillsOf = new Map(input.staff.map((s) => [s.id, new Set(s.skills.map((k) => k.id))]));
  const out: {
    date: string;
    shiftTypeId: string;
    skillId: string | null;
    short: number;
    belowMinimum: number;
    min: number;
  }[] = [];
  for (const need of input.problem.coverNeeds) {
    const date = input.dates[need.day];
    if (date === undefined || date < fromDate) continue;
    const have = rows.filter(
      (r) =>
        r.date === date &&
        r.shiftTypeId === need.shiftTypeId &&
        (need.skillId === null || skillsOf.get(r.staffMemberId)?.has(need.skillId)),
    ).length;
    if (need.target > have) {
      out.push({
        date,
        shiftTypeId: need.shiftTypeId,
        skillId: need.skillId,
        short: need.target - have,
        belowMinimum: Math.max(0, need.min - have),
        min: need.min,
      });
    }
  }
  return out.sort((a, b) => a.date.localeCompare(b.date) || a.shiftTypeId.localeCompare(b.shiftTypeId));
}

/** The open shifts of one published period as of one day, and what each person may claim. */
interface PeriodOpenShifts {
  input: RosterInput;
  rows: Cell[];
  open: (OpenShiftDto & { skillId: string | null })[];
  check: ClaimCheck;
  /** Per staff member: the open shifts they may claim (filled on first ask). */
  claimable: Map<string, OpenShiftDto[]>;
  /** Per staff member: every open shift with whether they may take it and why not (filled on first ask). */
  withReasons: Map<string, OpenShiftDto[]>;
}

/**
 * Open shifts: cover still short on a published roster, offered to staff who have the skill, are
 * free that day and for whom the checker finds no new violation with the shift added. A claim waits
 * for a manager's approval like a swap.
 *
 * The list reads only periods that have not ended, works each period out once (one problem index,
 * each person's rules checked on their own row) and keeps the result until the next write.
 */
@Injectable()
export class OpenShiftsService implements OnModuleInit {
  private readonly cache: GenerationCache<PeriodOpenShifts>;
  private readonly outside: OutsideOffers;

  constructor(
    private readonly dataSource: DataSource,
    private readonly input: RosterInputService,
    private readonly swaps: SwapsService,
    private readonly mail: MailService,
    private readonly config: AppConfig,
    private readonly cells: PeriodWriter,
    private readonly periods: RosterPeriodsService,
    private readonly units: UnitsService,
    private readonly skills: SkillsService,
    audit: AuditService,
    users: UsersService,
    writes: WriteGeneration,
  ) {
    this.cache = new GenerationCache(writes, { maxEntries: 32 });
    this.outside = new OutsideOffers(input, audit, cells, unmetNeeds, users, skills);
  }

  /** Approving a claim counts the people filling its shift from outside the roster (see filledOutside). */
  onModuleInit(): void {
    this.swaps.coverOutsideFrom(this);
  }

  /** How many people from outside the roster (bank or agency) fill the need now, read in `em`. */
  async filledOutside(em: EntityManager, periodId: string, need: NeedKey): Promise<number> {
    return filledOutside(await currentOffers(em, periodId), need);
  }

  /**
   * A page of the open shifts the caller may see (staff: those they may claim), ordered by date,
   * then unit, shift code and skill.
   */
  async list(user: AuthUser, query: OpenShiftQuery): Promise<Page<OpenShiftDto>> {
    // Periods whose last day is not yet over anywhere (each unit's own today is applied below).
    const yesterday = addDays(localDate(new Date(), 'UTC'), -1);
    const visible = visibleUnitIds(user);
    if (visible !== null && !visible.length) {
      return { items: [], total: 0, page: query.page, pageSize: query.pageSize };
    }
    const periods = (
      await this.periods.publishedOfOrganisation(user.organisationId, {
        // No period is longer than ROSTER_PERIOD_MAX_DAYS; the exact last day is checked below (date
        // arithmetic differs between SQLite and PostgreSQL, text comparison of ISO dates does not).
        earliest: addDays(yesterday, 1 - ROSTER_PERIOD_MAX_DAYS),
        unitIds: visible,
        periodId: query.rosterPeriodId,
      })
    ).filter((p) => addDays(p.startDate, p.days - 1) >= yesterday);
    const zones = await this.timeZones(periods.map((p) => p.unitId));
    const all: OpenShiftDto[] = [];
    for (const period of periods) {
      const today = localDate(new Date(), zones.get(period.unitId) ?? 'UTC');
      const open = await this.cache.get(`${period.id}|${today}`, () => this.compute(period.id, today));
      if (user.role !== 'staff') {
        all.push(...open.open);
        continue;
      }
      const me = open.input.staff.find((s) => s.userId === user.id);
      if (me) {
        const mine = query.withBlocked ? this.withReasons(open, me) : this.claimableBy(open, me);
        all.push(
          ...mine.map((o) => (o.outsideOffer ? { ...o, outsideOffer: offerForStaff(o.outsideOffer) } : o)),
        );
      }
    }
    // With the blocked ones too, the shifts the caller may take come first.
    all.sort(
      (a, b) =>
        Number(b.mayTake ?? false) - Number(a.mayTake ?? false) ||
        a.date.localeCompare(b.date) ||
        a.unitId.localeCompare(b.unitId) ||
        a.shiftCode.localeCompare(b.shiftCode) ||
        (a.skillCode ?? '').localeCompare(b.skillCode ?? ''),
    );
    const from = (query.page - 1) * query.pageSize;
    return {
      items: all.slice(from, from + query.pageSize),
      total: all.length,
      page: query.page,
      pageSize: query.pageSize,
    };
  }

  /** Reads a period once: its input, cells, open needs with their pending claims, and a ClaimCheck. */
  private async compute(periodId: string, today: string): Promise<PeriodOpenShifts> {
    const m = this.dataSource.manager;
    const input = await this.input.load(periodId);
    const rows = await this.cells.rowsOf(periodId, m);
    const claims = await this.swaps.waitingClaims(m, periodId);
    const skills = await this.skillCodes(input);
    const offers = await currentOffers(m, periodId);
    const registered = new Map(input.skills.filter((k) => k.registered).map((k) => [k.id, k]));
    const open = lessFilledOutside(unmetNeeds(input, rows, today), offers).map((need) => {
      const shift = input.shiftTypes.find((s) => s.id === need.shiftTypeId)!;
      const skill = need.skillId ? registered.get(need.skillId) : undefined;
      // People counted now: the minimum less what is still short of it (after people from outside).
      const [redFlag = null] = skill
        ? shiftRedFlags(
            {
              date: need.date,
              shiftTypeId: shift.id,
              shiftCode: shift.code,
              shiftName: shift.name,
              paidMinutes: shift.paidMinutes,
            },
            [
              {
                skillId: skill.id,
                skillCode: skill.code,
                skillName: skill.name,
                need: need.min,
                onShift: need.min - need.belowMinimum,
              },
            ],
          )
        : [];
      return {
        rosterPeriodId: periodId,
        unitId: input.period.unitId,
        date: need.date,
        shiftTypeId: need.shiftTypeId,
        shiftCode: shift.code,
        shiftName: shift.name,
        start: shift.start,
        end: shift.end,
        skillId: need.skillId,
        skillCode: need.skillId ? (skills.get(need.skillId) ?? null) : null,
        short: need.short,
        belowMinimum: need.belowMinimum,
        pendingClaims: claims.filter(
          (c) =>
            c.change?.date === need.date && c.change.after === need.shiftTypeId && c.skillId === need.skillId,
        ).length,
        outsideOffer: need.offer ? offerDto(need.offer) : null,
        redFlag,
      };
    });
    return {
      input,
      rows,
      open,
      check: new ClaimCheck(input, rows),
      claimable: new Map(),
      withReasons: new Map(),
    };
  }

  /** The open shifts a person has the skill for, is free on, and may take without a new violation. */
  private claimableBy(open: PeriodOpenShifts, me: StaffMemberEntity): OpenShiftDto[] {
    let mine = open.claimable.get(me.id);
    if (!mine) {
      const working = new Set(
        open.rows.filter((r) => r.staffMemberId === me.id && r.shiftTypeId !== null).map((r) => r.date),
      );
      mine = open.open.filter(
        (o) =>
          (!o.skillId || me.skills.some((k) => k.id === o.skillId)) &&
          !working.has(o.date) &&
          !open.check.blocked(me.id, o.date, o.shiftTypeId),
      );
      open.claimable.set(me.id, mine);
    }
    return mine;
  }

  /**
   * Every open shift of the period with whether this person may take it and, if not, why in words:
   * the skill, a shift already that day, then each rule the checker finds broken anew (the same test as
   * `claimableBy`, which the `mayTake` flag always agrees with).
   */
  private withReasons(open: PeriodOpenShifts, me: StaffMemberEntity): OpenShiftDto[] {
    let mine = open.withReasons.get(me.id);
    if (mine) return mine;
    const may = new Set(this.claimableBy(open, me));
    const cache: { before?: CheckResult } = {};
    mine = open.open.map((o) => {
      if (may.has(o)) return { ...o, mayTake: true, whyNot: [] };
      const whyNot: string[] = [];
      if (o.skillId && !me.skills.some((k) => k.id === o.skillId)) {
        whyNot.push(`It needs ${o.skillCode ?? 'a skill'}, which is not on your staff record.`);
      }
      const working = open.rows.find(
        (r) => r.staffMemberId === me.id && r.date === o.date && r.shiftTypeId !== null,
      );
      if (working) {
        const shift = open.input.shiftTypes.find((t) => t.id === working.shiftTypeId);
        whyNot.push(`You already work ${shift ? `the ${shift.name} shift` : 'a shift'} that day.`);
      } else if (whyNot.length === 0) {
        const change: StoredCellChange = {
          staffMemberId: me.id,
          date: o.date,
          before: null,
          after: o.shiftTypeId,
        };
        const findings = evaluateChanges(open.input, open.rows, [change], cache);
        for (const v of findings.violations.filter((f) => f.isNew)) whyNot.push(ruleInWords(v, me.name));
      }
      if (whyNot.length === 0) whyNot.push('Taking it would break a rule of your contract.');
      return { ...o, mayTake: false, whyNot };
    });
    open.withReasons.set(me.id, mine);
    return mine;
  }

  /**
   * E-mails every member of the period's unit who may take this open shift (through the outbox, in one
   * transaction). Answers how many were e-mailed; 409 when the shift is not open.
   */
  async notify(user: AuthUser, body: NotifyOpenShiftDto): Promise<NotifyOpenShiftResultDto> {
    // Read first (the one SQLite connection holds other queries while a transaction runs), then write
    // the messages in one transaction.
    const input = await this.input.load(body.rosterPeriodId);
    assertUnitAccess(user, input.period.unitId);
    if (input.period.status !== 'published') {
      throw new ConflictException(
        `Open shifts are for published rosters; this period is ${input.period.status}`,
      );
    }
    const today = localDate(new Date(), input.unit.timeZone);
    const open = await this.cache.get(`${input.period.id}|${today}`, () =>
      this.compute(input.period.id, today),
    );
    const shift = open.open.find(
      (o) =>
        o.date === body.date && o.shiftTypeId === body.shiftTypeId && o.skillId === (body.skillId ?? null),
    );
    if (!shift) {
      throw new ConflictException('This shift is not open (it is covered, past or not a need of the roster)');
    }
    const eligible = open.input.staff.filter((s) => s.email && this.claimableBy(open, s).includes(shift));
    await this.dataSource.transaction(async (em) => {
      for (const person of eligible) {
        await this.mail.send(openShiftMail(person, shift, input.unit, this.config.publicUrl), em);
      }
    });
    return { notified: eligible.length };
  }

  /**
   * For one open shift: each person of the unit with the skill who is not away that day, with the
   * rules taking it would break (nearest first), the cautions, and how the product lets a roster
   * change. Managers and planners of the unit; 409 when the shift is not open.
   */
  async whatItWouldTake(user: AuthUser, query: WhatItWouldTakeQueryDto): Promise<WhatItWouldTakeDto> {
    const input = await this.input.load(query.rosterPeriodId);
    assertUnitAccess(user, input.period.unitId);
    if (input.period.status !== 'published') {
      throw new ConflictException(
        `Open shifts are for published rosters; this period is ${input.period.status}`,
      );
    }
    const skillId = query.skillId || null;
    const today = localDate(new Date(), input.unit.timeZone);
    const open = await this.cache.get(`${input.period.id}|${today}`, () =>
      this.compute(input.period.id, today),
    );
    const shift = open.open.find(
      (o) => o.date === query.date && o.shiftTypeId === query.shiftTypeId && o.skillId === skillId,
    );
    if (!shift) {
      throw new ConflictException('This shift is not open (it is covered, past or not a need of the roster)');
    }
    const found = whatItWouldTake(open.input, open.rows, shift);
    return {
      rosterPeriodId: input.period.id,
      date: shift.date,
      shiftTypeId: shift.shiftTypeId,
      skillId,
      ...found,
      howToChange: HOW_TO_CHANGE_PUBLISHED,
    };
  }

  /** Records that an open shift was offered to bank or agency staff outside the roster (with audit). */
  createOutsideOffer(user: AuthUser, body: CreateOutsideOfferBody): Promise<OutsideOfferDto> {
    return this.dataSource.transaction((em) => this.outside.create(em, user, body));
  }

  /** Takes an offer outside the roster back (an offer or a fill); the shift counts as open again. */
  withdrawOutsideOffer(user: AuthUser, id: string): Promise<OutsideOfferDto> {
    return this.dataSource.transaction((em) => this.outside.withdraw(em, user, id));
  }

  /** Marks an offer filled by people from outside the roster: the shift counts that many fewer open. */
  fillOutsideOffer(user: AuthUser, id: string, body: FillOutsideOfferBody): Promise<OutsideOfferDto> {
    return this.dataSource.transaction((em) => this.outside.fill(em, user, id, body));
  }

  private async timeZones(unitIds: string[]): Promise<Map<string, string>> {
    const ids = [...new Set(unitIds)];
    const units = await this.units.byIds(ids);
    return new Map(units.map((u) => [u.id, u.timeZone]));
  }

  async claim(user: AuthUser, body: ClaimOpenShiftDto): Promise<SwapRequestDto> {
    const id = await this.dataSource.transaction(async (em) => {
      const input = await this.input.load(body.rosterPeriodId, {}, em);
      assertUnitAccess(user, input.period.unitId);
      if (input.period.status !== 'published') {
        throw new ConflictException(
          `Open shifts are for published rosters; this period is ${input.period.status}`,
        );
      }
      const me = this.swaps.staffOf(user, input);
      const rows = await this.cells.rowsOf(input.period.id, em);
      const today = localDate(new Date(), input.unit.timeZone);
      const offers = await currentOffers(em, input.period.id);
      const need = lessFilledOutside(unmetNeeds(input, rows, today), offers).find(
        (n) =>
          n.date === body.date && n.shiftTypeId === body.shiftTypeId && n.skillId === (body.skillId ?? null),
      );
      if (!need)
        throw new ConflictException(
          'This shift is not open (it is covered, past or not a need of the roster)',
        );
      if (body.skillId && !me.skills.some((k) => k.id === body.skillId)) {
        throw new UnprocessableEntityException('You do not have the skill this shift needs');
      }
      if (rows.some((r) => r.staffMemberId === me.id && r.date === body.date && r.shiftTypeId !== null)) {
        throw new BadRequestException([`date: you already work on ${dateInWords(body.date)}`]);
      }
      const change: StoredCellChange = {
        staffMemberId: me.id,
        date: body.date,
        before: rows.find((r) => r.staffMemberId === me.id && r.date === body.date)?.shiftTypeId ?? null,
        after: body.shiftTypeId,
      };
      const findings = evaluateChanges(input, rows, [change]);
      if (findings.blocked) {
        throw new UnprocessableEntityException({
          statusCode: 422,
          error: 'Unprocessable Entity',
          message:
            'Taking this shift would break a rule: ' +
            findings.violations
              .filter((v) => v.isNew)
              .map((v) => v.message)
              .join('; '),
          findings,
        });
      }
      const mine = await this.swaps.waitingClaims(em, input.period.id, me.id);
      if (mine.some((claim) => claim.change?.date === body.date)) {
        throw new ConflictException(`You already have a claim waiting for ${dateInWords(body.date)}`);
      }
      const created = await this.swaps.createClaim(
        em,
        input,
        me,
        change,
        need.skillId,
        body.note?.trim() || null,
      );
      await this.swaps.queue(em, created.mails);
      return created.id;
    });
    return this.swaps.get(user, id);
  }

  private async skillCodes(input: RosterInput): Promise<Map<string, string>> {
    const ids = [...new Set(input.problem.coverNeeds.flatMap((n) => (n.skillId ? [n.skillId] : [])))];
    const rows = await this.skills.byIds(ids);
    return new Map(rows.map((s) => [s.id, s.code]));
  }
}
