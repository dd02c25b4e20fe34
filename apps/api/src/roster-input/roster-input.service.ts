import { Injectable, NotFoundException } from '@nestjs/common';
import { contractForPeriod, type ContractRules, type SolveWeights } from '@rotaplex/contracts';
import {
  creditLeave,
  type Contract,
  type CoverNeed,
  type Person,
  type Pin,
  type RosterProblem,
  type ShiftType,
} from '@rotaplex/roster-model';
import { DataSource, type EntityManager, In, LessThanOrEqual, MoreThanOrEqual } from 'typeorm';
import { ContractEntity } from '../contracts/contract.entity';
import { CoverOverrideEntity, CoverPatternRowEntity } from '../cover-needs/cover-need.entity';
import { AvailabilityCellEntity, DateRequestEntity, LeaveRequestEntity } from '../requests/requests.entities';
import { PeriodWriter } from '../roster-periods/period-writer';
import { RosterPeriodEntity } from '../roster-periods/roster-period.entity';
import { addDays } from '../common/dates';
import { ShiftTypeEntity } from '../shift-types/shift-type.entity';
import { SkillEntity } from '../skills/skill.entity';
import { StaffMemberEntity } from '../staff/staff-member.entity';
import { UnitEntity } from '../units/unit.entity';
import { mapRequestsAndAbsences, type RequestsAndAbsences } from './requests-mapping';

/** A period's planning data as the roster model's problem, with the tables to map results back. */
export interface RosterInput {
  period: RosterPeriodEntity;
  unit: UnitEntity;
  problem: RosterProblem;
  /** dates[d] is day d of the problem. */
  dates: string[];
  /** Active staff members in roster order (person ids are staff member ids). */
  staff: StaffMemberEntity[];
  shiftTypes: ShiftTypeEntity[];
  /** The skills the staff hold or the cover needs require (with their names and registered flag). */
  skills: SkillEntity[];
}

export type { RequestsAndAbsences } from './requests-mapping';

/**
 * Builds the roster model's input from the database (people, contracts, needs, pins) for one period.
 *
 * A deliberate read model: it reads the planning tables of eight modules (periods, units, shift
 * types, staff and their skills, contracts, cover needs, requests, skills) directly, in the
 * caller's transaction, so the solver, publish check, reports and swaps see one consistent
 * snapshot in about a dozen queries. Routing each read through its module's service would run the
 * same queries behind seven more module imports for no gain; it writes nothing. The period's cells, which change under the period writer's version,
 * come through the writer (`pinnedOf`). A new planning table the solver needs is read here; any
 * other module reads through the owning service (DEVELOPERS.md, "Adding a feature module").
 */
@Injectable()
export class RosterInputService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly writer: PeriodWriter,
  ) {}

  async load(periodId: string, weights: SolveWeights = {}, em?: EntityManager): Promise<RosterInput> {
    const m = em ?? this.dataSource.manager;
    const period = await m.findOneBy(RosterPeriodEntity, { id: periodId });
    if (!period) throw new NotFoundException('Roster period not found');
    const unit = await m.findOneByOrFail(UnitEntity, { id: period.unitId });
    const dates = Array.from({ length: period.days }, (_, d) => addDays(period.startDate, d));
    const dayOf = new Map(dates.map((date, d) => [date, d]));

    const shiftTypes = await m.find(ShiftTypeEntity, { where: { unitId: unit.id }, order: { code: 'ASC' } });
    const idByCode = new Map(shiftTypes.map((s) => [s.code, s.id]));
    const staff = await m.find(StaffMemberEntity, {
      where: { unitId: unit.id, active: true },
      relations: { skills: true },
      order: { name: 'ASC', id: 'ASC' },
    });
    const contractIds = [...new Set(staff.map((s) => s.contractId).filter((c): c is string => c !== null))];
    const contracts = new Map(
      (contractIds.length ? await m.findBy(ContractEntity, { id: In(contractIds) }) : []).map((c) => [
        c.id,
        c,
      ]),
    );

    const people: Person[] = staff.map((s) => {
      const contract = s.contractId ? contracts.get(s.contractId) : undefined;
      return {
        id: s.id,
        name: s.name,
        skills: s.skills.map((k) => k.id).sort(),
        contract: contract ? periodContract(contract, period.days, idByCode) : {},
        ...(s.hourlyCost !== null ? { hourlyCost: s.hourlyCost } : {}),
      };
    });

    const coverNeeds = expandCoverNeeds(
      await m.findBy(CoverPatternRowEntity, { unitId: unit.id }),
      await m.findBy(CoverOverrideEntity, { unitId: unit.id, date: In(dates) }),
      dates,
    );

    // Skill codes for the explanations' words ("people with skill RN"), not database ids.
    const skillIds = [
      ...new Set([
        ...staff.flatMap((s) => s.skills.map((k) => k.id)),
        ...coverNeeds.flatMap((n) => (n.skillId === null ? [] : [n.skillId])),
      ]),
    ];
    const skills = skillIds.length ? await m.findBy(SkillEntity, { id: In(skillIds) }) : [];
    const skillNames = Object.fromEntries(skills.map((k) => [k.id, k.code]));

    const personIds = new Set(staff.map((s) => s.id));
    const pins: Pin[] = (await this.writer.pinnedOf(period.id, m))
      .filter((a) => personIds.has(a.staffMemberId) && dayOf.has(a.date))
      .map((a) => ({ personId: a.staffMemberId, day: dayOf.get(a.date)!, shiftTypeId: a.shiftTypeId }));

    const { requests, absences } = await this.requestsAndAbsences(m, period, dates, staff, shiftTypes);
    const problem: RosterProblem = {
      startDate: period.startDate,
      days: period.days,
      timeZone: unit.timeZone,
      shiftTypes: shiftTypes.map((s): ShiftType => ({
        id: s.id,
        name: s.name,
        start: s.start,
        end: s.end,
        paidMinutes: s.paidMinutes,
        ...(s.night !== null ? { night: s.night } : {}),
      })),
      people: creditLeave(people, absences, dates),
      coverNeeds,
      requests,
      absences,
      forbiddenSuccessions: [],
      pins,
      weights,
      skillNames,
    };
    return { period, unit, problem, dates, staff, shiftTypes, skills };
  }

  /**
   * The one place that reads staff input for the model: weekly availability, the period's date
   * requests and approved leave that overlaps the period (see mapRequestsAndAbsences).
   */
  protected async requestsAndAbsences(
    m: EntityManager,
    period: RosterPeriodEntity,
    dates: string[],
    staff: StaffMemberEntity[],
    shiftTypes: ShiftTypeEntity[],
  ): Promise<RequestsAndAbsences> {
    const personIds = staff.map((s) => s.id);
    if (!personIds.length || !dates.length) return { requests: [], absences: [] };
    const availability = await m.findBy(AvailabilityCellEntity, { staffMemberId: In(personIds) });
    const dateRequests = await m.findBy(DateRequestEntity, {
      rosterPeriodId: period.id,
      staffMemberId: In(personIds),
    });
    const leave = await m.findBy(LeaveRequestEntity, {
      staffMemberId: In(personIds),
      status: 'approved',
      startDate: LessThanOrEqual(dates[dates.length - 1]),
      endDate: MoreThanOrEqual(dates[0]),
    });
    return mapRequestsAndAbsences({ dates, shiftTypes, personIds, availability, dateRequests, leave });
  }
}

/** A contract's per-week rules scaled to the period, with per-type limits keyed by this unit's shift type ids. */
export function periodContract(rules: ContractRules, days: number, idByCode: Map<string, string>): Contract {
  const scaled = contractForPeriod(rules, days);
  const { maxShiftsPerType, ...rest } = scaled;
  const contract: Contract = { ...rest };
  if (maxShiftsPerType) {
    // Codes of shift types this unit does not have do not limit anything here.
    const byId = Object.entries(maxShiftsPerType).flatMap(([code, n]) => {
      const id = idByCode.get(code);
      return id ? [[id, n] as const] : [];
    });
    if (byId.length) contract.maxShiftsPerType = Object.fromEntries(byId);
  }
  return contract;
}

/**
 * The weekly pattern laid over the period's dates; an override for a date replaces the pattern row
 * with the same shift type and skill on that date (and adds one where the pattern has none).
 */
export function expandCoverNeeds(
  pattern: Pick<CoverPatternRowEntity, 'weekday' | 'shiftTypeId' | 'skillId' | 'min' | 'target'>[],
  overrides: Pick<CoverOverrideEntity, 'date' | 'shiftTypeId' | 'skillId' | 'min' | 'target'>[],
  dates: string[],
): CoverNeed[] {
  const needs: CoverNeed[] = [];
  const key = (shiftTypeId: string, skillId: string | null) => `${shiftTypeId}|${skillId ?? ''}`;
  dates.forEach((date, day) => {
    const weekday = new Date(`${date}T00:00:00Z`).getUTCDay();
    const cells = new Map<string, CoverNeed>();
    for (const row of pattern.filter((r) => r.weekday === weekday)) {
      cells.set(key(row.shiftTypeId, row.skillId), {
        day,
        shiftTypeId: row.shiftTypeId,
        skillId: row.skillId,
        min: row.min,
        target: row.target,
      });
    }
    for (const row of overrides.filter((o) => o.date === date)) {
      cells.set(key(row.shiftTypeId, row.skillId), {
        day,
        shiftTypeId: row.shiftTypeId,
        skillId: row.skillId,
        min: row.min,
        target: row.target,
      });
    }
    needs.push(...[...cells.values()].filter((n) => n.min > 0 || n.target > 0));
  });
  return needs;
}
