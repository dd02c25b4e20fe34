import { BadRequestException, ConflictException, Injectable, type OnModuleDestroy } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import {
  type AcceptDemandPlanResultDto,
  type ContactCentreDemandDto,
  type ContactIntervalDto,
  type CsvImportResult,
  type CsvRowError,
  DEMAND_CSV_COLUMNS,
  DEMAND_LIMITS,
  type DemandAcceptanceDto,
  type DemandPlanDto,
  ERLANG_CAUTION,
  minutesOfDay,
  OUTSIDE_SHIFTS_CAUTION,
  RATIO_CAUTION,
  TIME_OF_DAY_PATTERN,
  UNDER_COVER_CAUTION,
  type UnitDemandDto,
  type WardDemandDto,
  WEEKDAY_NAMES,
} from '@rotaplex/contracts';
import {
  contactRequirement,
  type PlanShiftType,
  planContactCover,
  rosteredCover,
  rosteredServiceLevel,
  SolverPool,
  wardPlan,
} from '@rotaplex/roster-model';
import { DataSource, Repository } from 'typeorm';
import { type AuthUser } from '../common/auth-user';
import { addDays, isRealDate } from '../common/dates';
import { CoverNeedsService } from '../cover-needs/cover-needs.service';
import { PeriodWriter } from '../roster-periods/period-writer';
import { RosterPeriodsService } from '../roster-periods/roster-periods.service';
import { ShiftTypesService } from '../shift-types/shift-types.service';
import { StaffService } from '../staff/staff.service';
import { parseCsv } from '../common/csv';
import { UnitsService } from '../units/units.service';
import { DemandAcceptanceEntity, UnitDemandEntity } from './demand.entities';
import { type AcceptDemandPlanDto, type DemandImportQueryDto, type PutUnitDemandDto } from './dto/demand.dto';

/** Seconds the covering MIP may take in a request (it answers with the best plan found by then). */
const COVER_TIME_LIMIT_SECONDS = 10;

/** The same numbers as the contracts' type, without class-validator's classes. */
function plainContact(c: ContactCentreDemandDto): ContactCentreDemandDto {
  return {
    intervalMinutes: c.intervalMinutes,
    skillId: c.skillId,
    service: {
      targetPercent: c.service.targetPercent,
      targetSeconds: c.service.targetSeconds,
      maxOccupancyPercent: c.service.maxOccupancyPercent,
      shrinkagePercent: c.service.shrinkagePercent,
    },
    pattern: c.pattern
      .map((p) => ({ weekday: p.weekday, intervals: sortIntervals(p.intervals) }))
      .sort((a, b) => a.weekday - b.weekday),
    dates: c.dates
      .map((d) => ({ date: d.date, intervals: sortIntervals(d.intervals) }))
      .sort((a, b) => a.date.localeCompare(b.date)),
    shiftTypeIds: [...c.shiftTypeIds],
    maxPeoplePerDay: c.maxPeoplePerDay,
  };
}

function sortIntervals(list: readonly ContactIntervalDto[]): ContactIntervalDto[] {
  return list
    .map((i) => ({ start: i.start, contacts: i.contacts, ahtSeconds: i.ahtSeconds }))
    .sort((a, b) => a.start.localeCompare(b.start));
}

function plainWard(w: WardDemandDto): WardDemandDto {
  return {
    patients: w.patients.map((p) => ({
      weekday: p.weekday,
      date: p.date,
      shiftTypeId: p.shiftTypeId,
      patients: { low: p.patients.low, medium: p.patients.medium, high: p.patients.high },
    })),
    ratios: w.ratios.map((r) => ({
      skillId: r.skillId,
      patientsPerStaff: {
        low: r.patientsPerStaff.low,
        medium: r.patientsPerStaff.medium,
        high: r.patientsPerStaff.high,
      },
      minimumPerShift: r.minimumPerShift,
      source: r.source,
    })),
  };
}

/** Checks of a contact forecast beyond the field rules: starts on the grid, nothing repeated. */
function contactErrors(c: ContactCentreDemandDto, shiftIds: Set<string>, skillIds: Set<string>): string[] {
  const errors: string[] = [];
  if (c.skillId !== null && !skillIds.has(c.skillId)) errors.push('contactCentre.skillId must be a skill');
  c.shiftTypeIds.forEach((id, i) => {
    if (!shiftIds.has(id)) errors.push(`contactCentre.shiftTypeIds.${i} must be a shift type of this unit`);
  });
  const days = (at: string, intervals: readonly ContactIntervalDto[]) => {
    const starts = new Set<string>();
    intervals.forEach((iv, k) => {
      if (minutesOfDay(iv.start) % c.intervalMinutes !== 0)
        errors.push(`${at}.intervals.${k}.start ${iv.start} must be on the ${c.intervalMinutes}-minute grid`);
      if (starts.has(iv.start)) errors.push(`${at}.intervals.${k}.start ${iv.start} is repeated`);
      starts.add(iv.start);
    });
  };
  const weekdays = new Set<number>();
  c.pattern.forEach((p, i) => {
    if (weekdays.has(p.weekday)) errors.push(`contactCentre.pattern.${i}.weekday ${p.weekday} is repeated`);
    weekdays.add(p.weekday);
    days(`contactCentre.pattern.${i}`, p.intervals);
  });
  const dates = new Set<string>();
  c.dates.forEach((d, i) => {
    if (dates.has(d.date)) errors.push(`contactCentre.dates.${i}.date ${d.date} is repeated`);
    dates.add(d.date);
    days(`contactCentre.dates.${i}`, d.intervals);
  });
  return errors;
}

function wardErrors(w: WardDemandDto, shiftIds: Set<string>, skillIds: Set<string>): string[] {
  const errors: string[] = [];
  const seen = new Set<string>();
  w.patients.forEach((p, i) => {
    const at = `ward.patients.${i}`;
    if ((p.weekday === null) === (p.date === null))
      errors.push(`${at} needs either a weekday or a date, not both`);
    if (!shiftIds.has(p.shiftTypeId)) errors.push(`${at}.shiftTypeId must be a shift type of this unit`);
    const key = `${p.weekday ?? p.date}|${p.shiftTypeId}`;
    if (seen.has(key)) errors.push(`${at} repeats the day and shift type of an earlier row`);
    seen.add(key);
  });
  const skills = new Set<string>();
  w.ratios.forEach((r, i) => {
    if (!skillIds.has(r.skillId)) errors.push(`ward.ratios.${i}.skillId must be a skill`);
    if (skills.has(r.skillId)) errors.push(`ward.ratios.${i}.skillId has a ratio already`);
    skills.add(r.skillId);
  });
  return errors;
}

@Injectable()
export class DemandService implements OnModuleDestroy {
  /** One worker thread for the covering solves, so a plan never blocks the request thread. */
  private pool: SolverPool | null = null;

  constructor(
    @InjectRepository(UnitDemandEntity) private readonly demands: Repository<UnitDemandEntity>,
    @InjectRepository(DemandAcceptanceEntity)
    private readonly acceptances: Repository<DemandAcceptanceEntity>,
    private readonly units: UnitsService,
    private readonly periods: RosterPeriodsService,
    private readonly coverNeeds: CoverNeedsService,
    private readonly dataSource: DataSource,
    private readonly shiftTypesService: ShiftTypesService,
    private readonly staff: StaffService,
    private readonly cells: PeriodWriter,
  ) {}

  async onModuleDestroy(): Promise<void> {
    await this.pool?.close();
    this.pool = null;
  }

  private solverPool(): SolverPool {
    if (!this.pool) this.pool = new SolverPool({ size: 1 });
    return this.pool;
  }

  async get(user: AuthUser, unitId: string): Promise<UnitDemandDto> {
    await this.units.get(user, unitId);
    const row = await this.demands.findOneBy({ unitId });
    return toDto(unitId, row);
  }

  /** Replaces the unit's demand (both parts) after checking every row; one write. */
  async put(user: AuthUser, unitId: string, body: PutUnitDemandDto): Promise<UnitDemandDto> {
    await this.units.get(user, unitId);
    const refs = await this.coverNeeds.references(user, unitId);
    const contact = body.contactCentre ? plainContact(body.contactCentre) : null;
    const ward = body.ward ? plainWard(body.ward) : null;
    const errors = [
      ...(contact ? contactErrors(contact, refs.shiftIds, refs.skillIds) : []),
      ...(ward ? wardErrors(ward, refs.shiftIds, refs.skillIds) : []),
    ];
    if (errors.length) throw new BadRequestException(errors);
    const saved = await this.dataSource.transaction((em) =>
      em.save(
        em.create(UnitDemandEntity, {
          unitId,
          contactCentre: contact,
          ward,
          updatedAt: new Date(),
          updatedById: user.id,
        }),
      ),
    );
    return toDto(unitId, saved);
  }

  /**
   * CSV of contacts (DEMAND_CSV_COLUMNS) into the unit's contact-centre part: weekday rows replace
   * the whole weekly pattern when there are any, date rows replace those dates. Any bad row: 400
   * with every row's errors, nothing saved.
   */
  async importContacts(
    user: AuthUser,
    unitId: string,
    query: DemandImportQueryDto,
    text: unknown,
  ): Promise<CsvImportResult> {
    if (typeof text !== 'string') {
      throw new BadRequestException(['body must be CSV text sent with Content-Type: text/csv']);
    }
    await this.units.get(user, unitId);
    const row = await this.demands.findOneBy({ unitId });
    const current = row?.contactCentre ?? null;
    if (!current) {
      throw new BadRequestException([
        'the unit has no contact-centre demand yet: save its interval length and service target first (PUT the demand)',
      ]);
    }
    const parsed = parseCsv(text, DEMAND_CSV_COLUMNS, DEMAND_CSV_COLUMNS);
    const errors: CsvRowError[] = [...parsed.errors];
    const weekdays = new Map<number, ContactIntervalDto[]>();
    const dates = new Map<string, ContactIntervalDto[]>();
    const seen = new Map<string, number>();
    for (const { line, cells } of parsed.rows) {
      const err = (field: string, message: string) => errors.push({ line, field, message });
      const day = cells.day ?? '';
      let weekday: number | null = null;
      let date: string | null = null;
      const named = WEEKDAY_NAMES.findIndex((n) => n.toLowerCase() === day.slice(0, 3).toLowerCase());
      if (/^[0-6]$/.test(day)) weekday = Number(day);
      else if (/^\d{4}-\d{2}-\d{2}$/.test(day) && isRealDate(day)) date = day;
      else if (named >= 0 && /^[a-z]+$/i.test(day)) weekday = named;
      else err('day', `"${day}" must be a weekday (Mon … Sun, or 0-6 with 0 = Sunday) or a date YYYY-MM-DD`);
      const start = cells.start ?? '';
      let okStart = false;
      if (!TIME_OF_DAY_PATTERN.test(start)) err('start', `"${start}" must be a time HH:mm`);
      else if (minutesOfDay(start) % current.intervalMinutes !== 0)
        err('start', `${start} is not on the unit's ${current.intervalMinutes}-minute grid`);
      else okStart = true;
      const contactsText = cells.contacts ?? '';
      const contacts = Number(contactsText);
      const okContacts =
        /^\d+(\.\d{1,3})?$/.test(contactsText) && contacts >= 0 && contacts <= DEMAND_LIMITS.maxContacts;
      if (!okContacts) err('contacts', `"${contactsText}" must be a number 0-${DEMAND_LIMITS.maxContacts}`);
      const ahtText = cells.aht ?? '';
      const aht = Number(ahtText);
      const okAht =
        /^\d+$/.test(ahtText) && aht >= DEMAND_LIMITS.minAhtSeconds && aht <= DEMAND_LIMITS.maxAhtSeconds;
      if (!okAht)
        err(
          'aht',
          `"${ahtText}" must be whole seconds ${DEMAND_LIMITS.minAhtSeconds}-${DEMAND_LIMITS.maxAhtSeconds}`,
        );
      const key = `${weekday ?? date}|${start}`;
      if (seen.has(key)) err('start', `repeats line ${seen.get(key)} (same day and start)`);
      else seen.set(key, line);
      if (okStart && okContacts && okAht) {
        const interval = { start, contacts, ahtSeconds: aht };
        if (weekday !== null) weekdays.set(weekday, [...(weekdays.get(weekday) ?? []), interval]);
        else if (date !== null) dates.set(date, [...(dates.get(date) ?? []), interval]);
      }
    }
    if (!errors.length && !parsed.rows.length)
      errors.push({ line: 2, field: 'file', message: 'no data rows' });
    const merged = new Map(current.dates.map((d) => [d.date, d.intervals]));
    for (const [d, intervals] of dates) merged.set(d, intervals);
    if (merged.size > 366) {
      errors.push({ line: 1, field: 'file', message: 'more than 366 dated days in the forecast' });
    }
    const result: CsvImportResult = { dryRun: query.dryRun, rows: parsed.rows.length, saved: 0, errors };
    if (query.dryRun) return result;
    if (errors.length) {
      throw new BadRequestException({
        statusCode: 400,
        error: 'Bad Request',
        message: errors.map((e) => `line ${e.line}, ${e.field}: ${e.message}`),
        ...result,
      });
    }
    const next = plainContact({
      ...current,
      pattern: weekdays.size
        ? [...weekdays].map(([weekday, intervals]) => ({ weekday, intervals }))
        : current.pattern,
      dates: [...merged].map(([date, intervals]) => ({ date, intervals })),
    });
    await this.dataSource.transaction(async (em) => {
      const fresh = await em.findOneBy(UnitDemandEntity, { unitId });
      if (!fresh) throw new ConflictException('The unit demand was removed meanwhile; try again');
      fresh.contactCentre = next;
      fresh.updatedAt = new Date();
      fresh.updatedById = user.id;
      await em.save(fresh);
    });
    return { ...result, saved: parsed.rows.length };
  }

  /** Requirement and covering plan for a roster period (computed, nothing saved). */
  async plan(user: AuthUser, periodId: string): Promise<DemandPlanDto> {
    const started = performance.now();
    const period = await this.periods.get(user, periodId);
    const unitId = period.unitId;
    const row = await this.demands.findOneBy({ unitId });
    const dates = Array.from({ length: period.days }, (_, i) => addDays(period.startDate, i));
    const shiftTypes = await this.shiftTypesService.inDayOrder(unitId);
    const cautions: string[] = [];
    let contactCentre: DemandPlanDto['contactCentre'] = null;
    const contact = row?.contactCentre ?? null;
    if (contact) {
      const allowed = contact.shiftTypeIds.length
        ? shiftTypes.filter((s) => contact.shiftTypeIds.includes(s.id))
        : shiftTypes;
      if (!allowed.length) {
        throw new ConflictException('The unit has no shift types for the plan: add shift types first');
      }
      const plans: PlanShiftType[] = allowed.map((s) => ({
        id: s.id,
        start: s.start,
        end: s.end,
        paidMinutes: s.paidMinutes,
      }));
      const requirement = contactRequirement(contact, dates);
      const plan = await planContactCover(requirement, dates, contact.intervalMinutes, plans, {
        maxPeoplePerDay: contact.maxPeoplePerDay,
        timeLimitSeconds: COVER_TIME_LIMIT_SECONDS,
        solver: (data, options) => this.solverPool().solveMip(data, options),
      });
      const assignments = await this.rosteredAssignments(periodId, contact.skillId);
      const rostered = rosteredCover(dates, contact.intervalMinutes, assignments, plans);
      contactCentre = {
        intervalMinutes: contact.intervalMinutes,
        skillId: contact.skillId,
        service: contact.service,
        requirement,
        cover: requirement.map((r, t) => ({
          start: r.start,
          planned: plan.planned[t],
          short: plan.short[t],
          rostered: rostered[t],
          rosteredServiceLevelPercent: rosteredServiceLevel(
            r,
            rostered[t],
            contact.service.targetSeconds,
            contact.service.shrinkagePercent,
          ),
        })),
        starts: plan.starts,
        paidHours: plan.paidHours,
        underCoverPersonIntervals: plan.underCoverPersonIntervals,
        outsideShiftsPersonIntervals: plan.outsideShiftsPersonIntervals,
        solverStatus: plan.status,
        seconds: (performance.now() - started) / 1000,
      };
      cautions.push(ERLANG_CAUTION);
      if (plan.outsideShiftsPersonIntervals > 0) cautions.push(OUTSIDE_SHIFTS_CAUTION);
      if (plan.underCoverPersonIntervals > plan.outsideShiftsPersonIntervals)
        cautions.push(UNDER_COVER_CAUTION);
    }
    let ward: DemandPlanDto['ward'] = null;
    if (row?.ward) {
      const knownSkills = (await this.coverNeeds.references(user, unitId)).skillIds;
      const usable = { ...row.ward, ratios: row.ward.ratios.filter((r) => knownSkills.has(r.skillId)) };
      ward = {
        requirement: wardPlan(
          usable,
          dates,
          shiftTypes.map((s) => s.id),
        ),
      };
      cautions.push(RATIO_CAUTION);
    }
    return { rosterPeriodId: periodId, unitId, dates, contactCentre, ward, cautions };
  }

  /** Writes the accepted rows as date overrides of the unit's cover needs, with the acceptance record. */
  async accept(
    user: AuthUser,
    periodId: string,
    body: AcceptDemandPlanDto,
  ): Promise<AcceptDemandPlanResultDto> {
    const period = await this.periods.get(user, periodId);
    if (period.status === 'archived') {
      throw new ConflictException(
        'The period is archived: its cover needs are on record and stay as they are',
      );
    }
    const last = addDays(period.startDate, period.days - 1);
    const outside = body.rows
      .map((r, i) => ({ r, i }))
      .filter(({ r }) => r.date < period.startDate || r.date > last)
      .map(({ r, i }) => `rows.${i}.date ${r.date} is outside the period ${period.startDate} … ${last}`);
    if (outside.length) throw new BadRequestException(outside);
    const rows = body.rows.map((r) => ({
      date: r.date,
      shiftTypeId: r.shiftTypeId,
      skillId: r.skillId,
      min: r.min,
      target: r.target,
    }));
    const demand = await this.demands.findOneBy({ unitId: period.unitId });
    const wardSkills = new Set((demand?.ward?.ratios ?? []).map((r) => r.skillId));
    return this.dataSource.transaction(async (em) => {
      const written = await this.coverNeeds.writeOverridesIn(em, user, period.unitId, rows);
      const days = new Set(rows.map((r) => r.date)).size;
      const record = await em.save(
        em.create(DemandAcceptanceEntity, {
          rosterPeriodId: periodId,
          actorUserId: user.id,
          actorName: user.displayName.slice(0, 200),
          at: new Date(),
          written: written.saved.length,
          summary:
            `Accepted the demand plan: ${written.saved.length} cover need${written.saved.length === 1 ? '' : 's'} on ${days} day${days === 1 ? '' : 's'} (${rows[0].date} … ${rows[rows.length - 1].date})`.slice(
              0,
              1000,
            ),
          before: written.before,
          after: written.saved,
        }),
      );
      const cautions = [...written.cautions];
      if (rows.some((r) => r.skillId !== null && wardSkills.has(r.skillId))) cautions.push(RATIO_CAUTION);
      return { rosterPeriodId: periodId, written: written.saved.length, acceptanceId: record.id, cautions };
    });
  }

  async listAcceptances(user: AuthUser, periodId: string): Promise<DemandAcceptanceDto[]> {
    await this.periods.get(user, periodId);
    const rows = await this.acceptances.find({ where: { rosterPeriodId: periodId }, order: { at: 'DESC' } });
    return rows.map((r) => ({
      id: r.id,
      rosterPeriodId: r.rosterPeriodId,
      actorUserId: r.actorUserId,
      actorName: r.actorName,
      at: r.at.toISOString(),
      written: r.written,
      summary: r.summary,
    }));
  }

  /** The period's shifts, of people with the skill when one is given. */
  private async rosteredAssignments(periodId: string, skillId: string | null) {
    const rows = (await this.cells.rowsOf(periodId)).filter((r) => r.shiftTypeId !== null);
    if (skillId === null) return rows.map((r) => ({ date: r.date, shiftTypeId: r.shiftTypeId as string }));
    const ids = new Set(await this.staff.idsWithSkill(skillId));
    return rows
      .filter((r) => ids.has(r.staffMemberId))
      .map((r) => ({ date: r.date, shiftTypeId: r.shiftTypeId as string }));
  }
}

function toDto(unitId: string, row: UnitDemandEntity | null): UnitDemandDto {
  const ward = row?.ward ?? null;
  return {
    unitId,
    contactCentre: row?.contactCentre ?? null,
    ward,
    updatedAt: row ? row.updatedAt.toISOString() : null,
    cautions: [...(row?.contactCentre ? [ERLANG_CAUTION] : []), ...(ward ? [RATIO_CAUTION] : [])],
  };
}
