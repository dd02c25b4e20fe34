import {
  BadRequestException,
  ConflictException,
  Injectable,
  UnprocessableEntityException,
} from '@nestjs/common';
import { type ClaimOpenShiftDto, type OpenShiftDto, type SwapRequestDto } from '@rotaplex/contracts';
import { DataSource, In } from 'typeorm';
import { AssignmentEntity } from '../assignments/assignment.entity';
import { type AuthUser } from '../common/auth-user';
import { assertUnitAccess, visibleUnitIds } from '../common/unit-scope';
import { localDate } from '../demo/demo-planning';
import { RosterPeriodEntity } from '../roster-periods/roster-period.entity';
import { type RosterInput, RosterInputService } from '../roster-input/roster-input.service';
import { SkillEntity } from '../skills/skill.entity';
import { type StaffMemberEntity } from '../staff/staff-member.entity';
import { UnitEntity } from '../units/unit.entity';
import { evaluateChanges } from '../swaps/swap-evaluation';
import { SwapRequestEntity, type StoredCellChange } from '../swaps/swap-request.entity';
import { SwapsService } from '../swaps/swaps.service';

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

/**
 * Open shifts: cover still short on a published roster, offered to staff who have the skill, are
 * free that day and for whom the checker finds no new violation with the shift added. A claim waits
 * for a manager's approval like a swap.
 */
@Injectable()
export class OpenShiftsService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly input: RosterInputService,
    private readonly swaps: SwapsService,
  ) {}

  async list(user: AuthUser, periodId?: string): Promise<OpenShiftDto[]> {
    const m = this.dataSource.manager;
    const qb = m
      .createQueryBuilder(RosterPeriodEntity, 'p')
      .innerJoin(UnitEntity, 'unit', 'unit.id = p.unitId')
      .where('unit.organisationId = :org AND p.status = :published', {
        org: user.organisationId,
        published: 'published',
      });
    const visible = visibleUnitIds(user);
    if (visible !== null) {
      if (!visible.length) return [];
      qb.andWhere('p.unitId IN (:...visible)', { visible });
    }
    if (periodId) qb.andWhere('p.id = :periodId', { periodId });
    const periods = await qb.orderBy('p.startDate', 'ASC').getMany();
    const out: OpenShiftDto[] = [];
    for (const period of periods) {
      const input = await this.input.load(period.id);
      const rows = await m.findBy(AssignmentEntity, { rosterPeriodId: period.id });
      const me = user.role === 'staff' ? input.staff.find((s) => s.userId === user.id) : undefined;
      if (user.role === 'staff' && !me) continue;
      const today = localDate(new Date(), input.unit.timeZone);
      const pending = await m.findBy(SwapRequestEntity, {
        rosterPeriodId: period.id,
        kind: 'claim',
        status: In(['accepted']),
      });
      const skills = await this.skillCodes(input);
      const cache = {};
      for (const need of unmetNeeds(input, rows, today)) {
        if (me && !this.canClaim(input, rows, me, need, cache)) continue;
        const shift = input.shiftTypes.find((s) => s.id === need.shiftTypeId)!;
        out.push({
          rosterPeriodId: period.id,
          unitId: period.unitId,
          date: need.date,
          shiftTypeId: need.shiftTypeId,
          shiftCode: shift.code,
          shiftName: shift.name,
          start: shift.start,
          end: shift.end,
          skillId: need.skillId,
          skillCode: need.skillId ? (skills.get(need.skillId) ?? null) : null,
          short: need.short,
          pendingClaims: pending.filter((p) => {
            const c = (JSON.parse(p.changes) as StoredCellChange[])[0];
            return c?.date === need.date && c.after === need.shiftTypeId && p.skillId === need.skillId;
          }).length,
        });
      }
    }
    return out;
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
        throw new BadRequestException([`date: you already work on ${body.date}`]);
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
        throw new ConflictException(`You already have a claim waiting for ${body.date}`);
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

  private canClaim(
    input: RosterInput,
    rows: Cell[],
    me: StaffMemberEntity,
    need: { date: string; shiftTypeId: string; skillId: string | null },
    cache: Parameters<typeof evaluateChanges>[3],
  ): boolean {
    if (need.skillId && !me.skills.some((k) => k.id === need.skillId)) return false;
    const current = rows.find((r) => r.staffMemberId === me.id && r.date === need.date)?.shiftTypeId ?? null;
    if (current !== null) return false;
    const findings = evaluateChanges(
      input,
      rows,
      [{ staffMemberId: me.id, date: need.date, before: null, after: need.shiftTypeId }],
      cache,
    );
    return !findings.blocked;
  }

  private async skillCodes(input: RosterInput): Promise<Map<string, string>> {
    const ids = [...new Set(input.problem.coverNeeds.flatMap((n) => (n.skillId ? [n.skillId] : [])))];
    const rows = ids.length ? await this.dataSource.manager.findBy(SkillEntity, { id: In(ids) }) : [];
    return new Map(rows.map((s) => [s.id, s.code]));
  }
}
