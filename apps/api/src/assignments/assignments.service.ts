import {
  BadRequestException,
  ConflictException,
  Injectable,
  UnprocessableEntityException,
} from '@nestjs/common';
import {
  type AssignmentGridDto,
  hoursAndMinutes,
  OVERRIDE_REASON_RULES,
  REST_RULE_WARNING,
  type RosterCheckDto,
  type RosterViolationDto,
} from '@rotaplex/contracts';
import { checkRoster, restMinutes, type Roster, type Violation } from '@rotaplex/roster-model';
import { DataSource, type EntityManager } from 'typeorm';
import { AuditService } from '../audit/audit.service';
import { type AuthUser } from '../common/auth-user';
import { GenerationCache, WriteGeneration } from '../database/write-generation';
import { type CellChangeBy, PeriodWriter } from '../roster-periods/period-writer';
import { RosterPeriodsService } from '../roster-periods/roster-periods.service';
import { type RosterInput, RosterInputService } from '../roster-input/roster-input.service';
import { type AssignmentEntity } from '../roster-periods/assignment.entity';
import { type AssignmentCellDto, type PinCellDto } from './dto/assignment.dto';

/** The roster of a period: read as a grid with the checker's findings, edit a cell, pin and unpin. */
@Injectable()
export class AssignmentsService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly periods: RosterPeriodsService,
    private readonly input: RosterInputService,
    private readonly audit: AuditService,
    private readonly writer: PeriodWriter,
    writes: WriteGeneration,
  ) {
    this.grids = new GenerationCache(writes);
    this.access = new GenerationCache(writes, { maxEntries: 256 });
  }

  /** Board reads repeat while nothing changes (many readers, a solve running): served from a cache. */
  private readonly grids: GenerationCache<AssignmentGridDto>;
  /** The access check of a read, per caller (with their role and units) and period. */
  private readonly access: GenerationCache<unknown>;

  async grid(user: AuthUser, periodId: string): Promise<AssignmentGridDto> {
    const caller = `${user.id}|${user.role}|${user.organisationId}|${user.unitIds.join(',')}`;
    await this.access.get(`${caller}|${periodId}`, () => this.periods.get(user, periodId)); // 404 / 403 by unit
    return this.grids.get(periodId, () => this.gridOf(periodId));
  }

  /**
   * Saves one cell (a shift or a day off) of a draft and answers with the checker's findings for the
   * edited roster. A shift that overlaps the person's shift of the day before or after is refused
   * (422) whatever the reason. An edit that breaks a rule of OVERRIDE_REASON_RULES for the person,
   * which the roster did not break before, needs `overrideReason` (422 without it); the edit, the
   * findings and the reason then go into the audit trail in the same transaction.
   */
  async editCell(user: AuthUser, periodId: string, body: AssignmentCellDto): Promise<AssignmentGridDto> {
    await this.periods.get(user, periodId);
    await this.dataSource.transaction(async (em) => {
      const input = await this.input.load(periodId, {}, em);
      assertDraft(input);
      assertCell(input, body.staffMemberId, body.date);
      if (body.shiftTypeId !== null && !input.shiftTypes.some((s) => s.id === body.shiftTypeId)) {
        throw new BadRequestException(["shiftTypeId must be a shift type of the period's unit, or null"]);
      }
      const all = await this.writer.rowsOf(periodId, em);
      const existing =
        all.find((r) => r.staffMemberId === body.staffMemberId && r.date === body.date) ?? null;
      const before = rosterOf(input, all);
      const day = input.dates.indexOf(body.date);
      const after: Roster = { ...before, [body.staffMemberId]: [...before[body.staffMemberId]] };
      after[body.staffMemberId][day] = body.shiftTypeId;
      if (body.shiftTypeId !== null) assertNoOverlap(input, after, body.staffMemberId, day);
      const broken = newOverrideFindings(input, before, after, body.staffMemberId);
      const reason = body.overrideReason?.trim() ?? '';
      if (broken.length > 0 && reason === '') {
        throw new UnprocessableEntityException([
          ...broken.map((v) => v.message),
          'This edit breaks a rule of the contract. To keep it, give the reason (overrideReason); it is kept in the audit trail.',
        ]);
      }
      // A manual edit keeps the cell's pin; an unpinned day off is stored as no row.
      const cell = {
        staffMemberId: body.staffMemberId,
        date: body.date,
        shiftTypeId: body.shiftTypeId,
        pinned: existing?.pinned ?? false,
      };
      await this.writer.writeCells(em, periodId, [cell], { kind: 'edit', actorUserId: user.id });
      if (broken.length > 0) {
        const name = input.staff.find((s) => s.id === body.staffMemberId)?.name ?? body.staffMemberId;
        await this.audit.record(em, {
          rosterPeriodId: periodId,
          actorUserId: user.id,
          kind: 'manual-edit',
          summary:
            `Kept an edit for ${name} on ${body.date} that breaks ${broken.length} rule(s): ` +
            `${broken.map((v) => v.message).join('; ')}. Reason: ${reason}`,
          before: {
            staffMemberId: body.staffMemberId,
            date: body.date,
            shiftTypeId: existing?.shiftTypeId ?? null,
          },
          after: {
            staffMemberId: body.staffMemberId,
            date: body.date,
            shiftTypeId: body.shiftTypeId,
            rules: broken.map((v) => v.rule),
            reason,
          },
        });
      }
    });
    return this.gridOf(periodId);
  }

  /** Pins (or unpins) a cell as it stands; a pinned cell is kept by every new solve. */
  async setPinned(
    user: AuthUser,
    periodId: string,
    body: PinCellDto,
    pinned: boolean,
  ): Promise<AssignmentGridDto> {
    await this.periods.get(user, periodId);
    await this.dataSource.transaction(async (em) => {
      const input = await this.input.load(periodId, {}, em);
      assertDraft(input);
      assertCell(input, body.staffMemberId, body.date);
      const existing = (await this.writer.rowsOf(periodId, em)).find(
        (r) => r.staffMemberId === body.staffMemberId && r.date === body.date,
      );
      // Pinning an empty cell pins the day off; unpinning a pinned day off leaves no row.
      const cell = {
        staffMemberId: body.staffMemberId,
        date: body.date,
        shiftTypeId: existing?.shiftTypeId ?? null,
        pinned,
      };
      await this.writer.writeCells(em, periodId, [cell], {
        kind: pinned ? 'pin' : 'unpin',
        actorUserId: user.id,
      });
    });
    return this.gridOf(periodId);
  }

  /** The grid and the checker's result for the period's current roster (no access check: callers do it). */
  async gridOf(periodId: string): Promise<AssignmentGridDto> {
    const input = await this.input.load(periodId);
    const rows = await this.writer.rowsOf(periodId);
    const cells = new Map<string, AssignmentEntity>();
    for (const r of rows) cells.set(`${r.staffMemberId}|${r.date}`, r);
    const roster = rosterOf(input, rows);
    return {
      rosterPeriodId: periodId,
      dates: input.dates,
      rows: input.staff.map((s) => ({
        staffMemberId: s.id,
        name: s.name,
        cells: input.dates.map((date) => {
          const cell = cells.get(`${s.id}|${date}`);
          return { shiftTypeId: cell?.shiftTypeId ?? null, pinned: cell?.pinned ?? false };
        }),
      })),
      check: checkDto(input, roster),
    };
  }
}

/** The stored cells as the roster model's roster (active people only; other cells are days off). */
export function rosterOf(
  input: RosterInput,
  rows: Pick<AssignmentEntity, 'staffMemberId' | 'date' | 'shiftTypeId'>[],
): Roster {
  const dayOf = new Map(input.dates.map((d, i) => [d, i]));
  const roster: Roster = Object.fromEntries(
    input.staff.map((s) => [s.id, new Array<string | null>(input.dates.length).fill(null)]),
  );
  for (const r of rows) {
    const day = dayOf.get(r.date);
    if (day !== undefined && roster[r.staffMemberId]) roster[r.staffMemberId][day] = r.shiftTypeId;
  }
  return roster;
}

/** The checker's result in the period's dates, with shift codes instead of ids in the messages. */
export function checkDto(input: RosterInput, roster: Roster): RosterCheckDto {
  const result = checkRoster(input.problem, roster);
  return {
    violations: result.violations.map((v) => violationDto(input, v, roster)),
    terms: { ...result.terms },
    objective: result.objective,
  };
}

/**
 * Findings of OVERRIDE_REASON_RULES for one person that the edited roster has and the roster before
 * did not (same rule and days), in the period's words.
 */
function newOverrideFindings(
  input: RosterInput,
  before: Roster,
  after: Roster,
  personId: string,
): RosterViolationDto[] {
  const rules: readonly string[] = OVERRIDE_REASON_RULES;
  const key = (v: Violation) => `${v.rule}|${v.days.join(',')}`;
  const mine = (roster: Roster) =>
    checkRoster(input.problem, roster).violations.filter(
      (v) => v.personId === personId && rules.includes(v.rule),
    );
  const had = new Set(mine(before).map(key));
  return mine(after)
    .filter((v) => !had.has(key(v)))
    .map((v) => violationDto(input, v, after));
}

/**
 * Refuses (422) a shift that overlaps the person's shift on a nearby day: the rest between them is
 * negative, which no rule or reason can allow. Measured in real time in the unit's zone.
 */
function assertNoOverlap(input: RosterInput, roster: Roster, personId: string, day: number): void {
  const days = roster[personId];
  const byId = new Map(input.shiftTypes.map((s) => [s.id, s]));
  const name = input.staff.find((s) => s.id === personId)?.name ?? personId;
  for (let d = Math.max(0, day - 2); d <= Math.min(days.length - 1, day + 2); d++) {
    if (d === day) continue;
    const [first, second] = d < day ? [d, day] : [day, d];
    const a = byId.get(days[first] ?? '');
    const b = byId.get(days[second] ?? '');
    if (!a || !b) continue;
    const rest = restMinutes(input.problem, first, a, second, b);
    if (rest >= 0) continue;
    throw new UnprocessableEntityException([
      `${name}: ${a.name} (${a.code}) on ${input.dates[first]} runs until ${a.end} and ${b.name} (${b.code}) ` +
        `on ${input.dates[second]} starts at ${b.start}: the shifts overlap by ${hoursAndMinutes(-rest)}. ` +
        'Nobody can work two shifts at once, so this edit is not saved; change or remove the other shift first.',
    ]);
  }
}

function violationDto(input: RosterInput, v: Violation, roster: Roster): RosterViolationDto {
  if (v.rule === 'minRest') return restViolationDto(input, v, roster);
  let message = v.message.replace(/\bday (\d+)\b/g, (all, d: string) => input.dates[Number(d)] ?? all);
  for (const s of input.shiftTypes) message = message.split(s.id).join(s.code);
  return {
    rule: v.rule,
    staffMemberId: v.personId,
    dates: v.days.map((d) => input.dates[d]).filter((d): d is string => d !== undefined),
    message,
    warning: null,
  };
}

/**
 * A rest finding in the API's own words: the rest in hours and minutes, and an overlap (negative
 * rest) named as an overlap, never as "-0 h 30 min" of rest.
 */
function restViolationDto(input: RosterInput, v: Violation, roster: Roster): RosterViolationDto {
  const [d1, d2] = v.days;
  const byId = new Map(input.shiftTypes.map((s) => [s.id, s]));
  const a = byId.get(roster[v.personId]?.[d1] ?? '');
  const b = byId.get(roster[v.personId]?.[d2] ?? '');
  const name = input.staff.find((s) => s.id === v.personId)?.name ?? v.personId;
  const limit = input.problem.people.find((p) => p.id === v.personId)?.contract.minRestMinutes;
  const dates = [input.dates[d1], input.dates[d2]].filter((d): d is string => d !== undefined);
  let message = v.message;
  if (a && b) {
    const rest = restMinutes(input.problem, d1, a, d2, b);
    const between = `${a.code} on ${input.dates[d1]} and ${b.code} on ${input.dates[d2]}`;
    const least = limit ? ` (the contract asks for at least ${hoursAndMinutes(limit)})` : '';
    if (rest < 0) message = `${name}: ${between} overlap by ${hoursAndMinutes(-rest)}${least}`;
    else if (rest === 0) message = `${name}: no rest at all between ${between}${least}`;
    else message = `${name}: only ${hoursAndMinutes(rest)} of rest between ${between}${least}`;
  }
  return { rule: v.rule, staffMemberId: v.personId, dates, message, warning: REST_RULE_WARNING };
}

function assertDraft(input: RosterInput): void {
  if (input.period.status === 'published') {
    throw new ConflictException('This period is published: change it through repair or a swap');
  }
  if (input.period.status !== 'draft') {
    throw new ConflictException(`Only a draft period can be edited; this one is ${input.period.status}`);
  }
}

function assertCell(input: RosterInput, staffMemberId: string, date: string): void {
  if (!input.staff.some((s) => s.id === staffMemberId)) {
    throw new BadRequestException(["staffMemberId must be an active staff member of the period's unit"]);
  }
  if (!input.dates.includes(date)) throw new BadRequestException(['date must be a day of the period']);
}

/**
 * Replaces the unpinned cells of a period with a solved roster through the period's writer, in the
 * caller's transaction (the version rises when a cell changed). Pinned cells stay as they are (the
 * solver kept them). Answers the period's version after the change.
 */
export async function saveSolvedRoster(
  em: EntityManager,
  writer: PeriodWriter,
  input: RosterInput,
  roster: Roster,
  by: CellChangeBy,
): Promise<number> {
  const shifts: { staffMemberId: string; date: string; shiftTypeId: string }[] = [];
  for (const s of input.staff) {
    const days = roster[s.id];
    if (!days) continue;
    days.forEach((shiftTypeId, d) => {
      if (shiftTypeId !== null) shifts.push({ staffMemberId: s.id, date: input.dates[d], shiftTypeId });
    });
  }
  return writer.replaceUnpinned(em, input.period.id, shifts, by);
}
