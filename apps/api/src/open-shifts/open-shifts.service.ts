import {
  BadRequestException,
  ConflictException,
  Injectable,
  UnprocessableEntityException,
} from '@nestjs/common';
import {
  type ClaimOpenShiftDto,
  type OpenShiftDto,
  type Page,
  type SwapRequestDto,
} from '@rotaplex/contracts';
import { DataSource, In } from 'typeorm';
import { AssignmentEntity } from '../assignments/assignment.entity';
import { type AuthUser } from '../common/auth-user';
import { assertUnitAccess, visibleUnitIds } from '../common/unit-scope';
import { localDate } from '../common/dates';
import { GenerationCache, WriteGeneration } from '../database/write-generation';
import { RosterPeriodEntity } from '../roster-periods/roster-period.entity';
import { addDays } from '../roster-periods/roster-periods.service';
import { type RosterInput, RosterInputService } from '../roster-input/roster-input.service';
import { SkillEntity } from '../skills/skill.entity';
import { type StaffMemberEntity } from '../staff/staff-member.entity';
import { UnitEntity } from '../units/unit.entity';
import { ClaimCheck, evaluateChanges } from '../swaps/swap-evaluation';
import { SwapRequestEntity, type StoredCellChange } from '../swaps/swap-request.entity';
import { SwapsService } from '../swaps/swaps.service';
import { dateInWords } from '../common/text/date-words';
import { type OpenShiftQuery } from './dto/open-shift.dto';

type Cell = Pick<AssignmentEntity, 'staffMemberId' | 'date' | 'shiftTypeId'>;

/** A need of a published period with fewer people on it than its target (from today on). */
export function unmetNeeds(input: RosterInput, rows: Cell[], fromDate: string) {
  const skillsOf = new Map(input.staff.map((s) => [s.id, new Set(s.skills.map((k) => k.id))]));
  const out: { date: string; shiftTypeId: string; skillId: string | null; short: number }[] = [];
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
      out.push({ date, shiftTypeId: need.shiftTypeId, skillId: need.skillId, short: need.target - have });
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
export class OpenShiftsService {
  private readonly cache: GenerationCache<PeriodOpenShifts>;

  constructor(
    private readonly dataSource: DataSource,
    private readonly input: RosterInputService,
    private readonly swaps: SwapsService,
    writes: WriteGeneration,
  ) {
    this.cache = new GenerationCache(writes, { maxEntries: 32 });
  }

  /**
   * A page of the open shifts the caller may see (staff: those they may claim), ordered by date,
   * then unit, shift code and skill.
   */
  async list(user: AuthUser, query: OpenShiftQuery): Promise<Page<OpenShiftDto>> {
    const m = this.dataSource.manager;
    // Periods whose last day is not yet over anywhere (each unit's own today is applied below).
    const yesterday = addDays(localDate(new Date(), 'UTC'), -1);
    const qb = m
      .createQueryBuilder(RosterPeriodEntity, 'p')
      .innerJoin(UnitEntity, 'unit', 'unit.id = p.unitId')
      .where('unit.organisationId = :org AND p.status = :published', {
        org: user.organisationId,
        published: 'published',
      })
      .andWhere(`date(p.startDate, '+' || (p.days - 1) || ' days') >= :yesterday`, { yesterday });
    const visible = visibleUnitIds(user);
    if (visible !== null) {
      if (!visible.length) return { items: [], total: 0, page: query.page, pageSize: query.pageSize };
      qb.andWhere('p.unitId IN (:...visible)', { visible });
    }
    if (query.rosterPeriodId) qb.andWhere('p.id = :periodId', { periodId: query.rosterPeriodId });
    const periods = await qb.orderBy('p.startDate', 'ASC').addOrderBy('p.id', 'ASC').getMany();
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
      if (me) all.push(...this.claimableBy(open, me));
    }
    all.sort(
      (a, b) =>
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
    const rows = await m.findBy(AssignmentEntity, { rosterPeriodId: periodId });
    const pending = await m.findBy(SwapRequestEntity, {
      rosterPeriodId: periodId,
      kind: 'claim',
      status: In(['accepted']),
    });
    const claims = pending.map((p) => ({
      change: (JSON.parse(p.changes) as StoredCellChange[])[0],
      skillId: p.skillId,
    }));
    const skills = await this.skillCodes(input);
    const open = unmetNeeds(input, rows, today).map((need) => {
      const shift = input.shiftTypes.find((s) => s.id === need.shiftTypeId)!;
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
        pendingClaims: claims.filter(
          (c) =>
            c.change?.date === need.date && c.change.after === need.shiftTypeId && c.skillId === need.skillId,
        ).length,
      };
    });
    return { input, rows, open, check: new ClaimCheck(input, rows), claimable: new Map() };
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

  private async timeZones(unitIds: string[]): Promise<Map<string, string>> {
    const ids = [...new Set(unitIds)];
    const units = ids.length ? await this.dataSource.manager.findBy(UnitEntity, { id: In(ids) }) : [];
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
      const rows = await em.findBy(AssignmentEntity, { rosterPeriodId: input.period.id });
      const today = localDate(new Date(), input.unit.timeZone);
      const need = unmetNeeds(input, rows, today).find(
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
      const mine = await em.findBy(SwapRequestEntity, {
        rosterPeriodId: input.period.id,
        proposerStaffMemberId: me.id,
        kind: 'claim',
        status: 'accepted',
      });
      if (mine.some((p) => (JSON.parse(p.changes) as StoredCellChange[])[0]?.date === body.date)) {
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
    const rows = ids.length ? await this.dataSource.manager.findBy(SkillEntity, { id: In(ids) }) : [];
    return new Map(rows.map((s) => [s.id, s.code]));
  }
}
