import { BadRequestException, ConflictException, Injectable } from '@nestjs/common';
import {
  type AssignmentGridDto,
  REST_RULE_WARNING,
  type RosterCheckDto,
  type RosterViolationDto,
} from '@rotaplex/contracts';
import { checkRoster, type Roster, type Violation } from '@rotaplex/roster-model';
import { DataSource, type EntityManager } from 'typeorm';
import { type AuthUser } from '../common/auth-user';
import { GenerationCache, WriteGeneration } from '../database/write-generation';
import { RosterPeriodsService } from '../roster-periods/roster-periods.service';
import { type RosterInput, RosterInputService } from '../roster-input/roster-input.service';
import { AssignmentEntity } from './assignment.entity';
import { type AssignmentCellDto, type PinCellDto } from './dto/assignment.dto';

/** The roster of a period: read as a grid with the checker's findings, edit a cell, pin and unpin. */
@Injectable()
export class AssignmentsService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly periods: RosterPeriodsService,
    private readonly input: RosterInputService,
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

  /** Saves one cell (a shift or a day off) of a draft and answers with the checker's findings for the edited roster. */
  async editCell(user: AuthUser, periodId: string, body: AssignmentCellDto): Promise<AssignmentGridDto> {
    await this.periods.get(user, periodId);
    await this.dataSource.transaction(async (em) => {
      const input = await this.input.load(periodId, {}, em);
      assertDraft(input);
      assertCell(input, body.staffMemberId, body.date);
      if (body.shiftTypeId !== null && !input.shiftTypes.some((s) => s.id === body.shiftTypeId)) {
        throw new BadRequestException(["shiftTypeId must be a shift type of the period's unit, or null"]);
      }
      const existing = await em.findOneBy(AssignmentEntity, {
        rosterPeriodId: periodId,
        staffMemberId: body.staffMemberId,
        date: body.date,
      });
      // A manual edit keeps the cell's pin; an unpinned day off is stored as no row.
      const pinned = existing?.pinned ?? false;
      if (body.shiftTypeId === null && !pinned) {
        if (existing) await em.remove(existing);
        return;
      }
      const row =
        existing ??
        em.create(AssignmentEntity, {
          rosterPeriodId: periodId,
          staffMemberId: body.staffMemberId,
          date: body.date,
        });
      row.shiftTypeId = body.shiftTypeId;
      row.pinned = pinned;
      await em.save(row);
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
      const existing = await em.findOneBy(AssignmentEntity, {
        rosterPeriodId: periodId,
        staffMemberId: body.staffMemberId,
        date: body.date,
      });
      if (pinned) {
        // Pinning an empty cell pins the day off.
        const row =
          existing ??
          em.create(AssignmentEntity, {
            rosterPeriodId: periodId,
            staffMemberId: body.staffMemberId,
            date: body.date,
            shiftTypeId: null,
          });
        row.pinned = true;
        await em.save(row);
      } else if (existing) {
        if (existing.shiftTypeId === null) await em.remove(existing);
        else {
          existing.pinned = false;
          await em.save(existing);
        }
      }
    });
    return this.gridOf(periodId);
  }

  /** The grid and the checker's result for the period's current roster (no access check: callers do it). */
  async gridOf(periodId: string): Promise<AssignmentGridDto> {
    const input = await this.input.load(periodId);
    const rows = await this.dataSource.manager.findBy(AssignmentEntity, { rosterPeriodId: periodId });
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
    violations: result.violations.map((v) => violationDto(input, v)),
    terms: { ...result.terms },
    objective: result.objective,
  };
}

function violationDto(input: RosterInput, v: Violation): RosterViolationDto {
  let message = v.message.replace(/\bday (\d+)\b/g, (all, d: string) => input.dates[Number(d)] ?? all);
  for (const s of input.shiftTypes) message = message.split(s.id).join(s.code);
  return {
    rule: v.rule,
    staffMemberId: v.personId,
    dates: v.days.map((d) => input.dates[d]).filter((d): d is string => d !== undefined),
    message,
    warning: v.rule === 'minRest' ? REST_RULE_WARNING : null,
  };
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
 * Replaces the unpinned cells of a period with a solved roster, in the caller's transaction.
 * Pinned cells stay as they are (the solver kept them).
 */
export async function saveSolvedRoster(em: EntityManager, input: RosterInput, roster: Roster): Promise<void> {
  const periodId = input.period.id;
  await em.delete(AssignmentEntity, { rosterPeriodId: periodId, pinned: false });
  const pinned = new Set(
    (await em.findBy(AssignmentEntity, { rosterPeriodId: periodId, pinned: true })).map(
      (a) => `${a.staffMemberId}|${a.date}`,
    ),
  );
  const rows: Partial<AssignmentEntity>[] = [];
  for (const s of input.staff) {
    const days = roster[s.id];
    if (!days) continue;
    days.forEach((shiftTypeId, d) => {
      const date = input.dates[d];
      if (shiftTypeId === null || pinned.has(`${s.id}|${date}`)) return;
      rows.push({ rosterPeriodId: periodId, staffMemberId: s.id, date, shiftTypeId, pinned: false });
    });
  }
  for (let i = 0; i < rows.length; i += 200) await em.insert(AssignmentEntity, rows.slice(i, i + 200));
}
