import { ConflictException, Injectable } from '@nestjs/common';
import {
  type RosterChangeKind,
  type RosterPeriodChangeDto,
  type RosterPeriodStatus,
  type StaleVersionDto,
} from '@rotaplex/contracts';
import { randomUUID } from 'node:crypto';
import { DataSource, type EntityManager, MoreThan, MoreThanOrEqual } from 'typeorm';
import { UsersService } from '../users/users.service';
import { AssignmentEntity } from './assignment.entity';
import { RosterPeriodChangeEntity } from './roster-period-change.entity';
import { recordLateChanges, type ShiftChange } from './notice-window';
import { RosterPeriodEntity } from './roster-period.entity';

/** One cell as it must be after the change: a shift (or null for a day off) and its pin. */
export interface CellWrite {
  staffMemberId: string;
  date: string;
  shiftTypeId: string | null;
  pinned: boolean;
}

/** Who changed the cells and why: kept with the version the change made. */
export interface CellChangeBy {
  kind: RosterChangeKind;
  /** The user who asked for it; null for the system. */
  actorUserId: string | null;
  /**
   * "staffMemberId|date" of cells whose person is on approved leave that day: a shift taken off
   * there counts as asked for by the person (notice-window.ts).
   */
  leaveCells?: ReadonlySet<string>;
}

/**
 * The one writer of a period's cells. Every change of cells (edit, pin, solve result, repair, swap
 * and claim approval) goes through it, inside the caller's transaction (which checks the change and
 * records its audit entry and mails): it writes the rows, raises `roster_periods.version` by one and
 * records the change, so a publish or decision holding an older version is refused with what
 * changed. A change that leaves every cell as it was writes nothing and keeps the version. On a
 * published period, shifts changed inside the organisation's notice window are recorded as late
 * changes (with predictability pay when the organisation records it) in the same transaction.
 */
@Injectable()
export class PeriodWriter {
  constructor(
    private readonly dataSource: DataSource,
    private readonly users: UsersService,
  ) {}

  /**
   * The period's cells as stored (a shift, or a pinned day off), read in `em`'s transaction when
   * given: other modules read the cells through here, not from the table.
   */
  rowsOf(periodId: string, em: EntityManager = this.dataSource.manager): Promise<AssignmentEntity[]> {
    return em.findBy(AssignmentEntity, { rosterPeriodId: periodId });
  }

  /** The period's pinned cells (a shift or a day off a new solve keeps), in `em`'s transaction when given. */
  pinnedOf(periodId: string, em: EntityManager = this.dataSource.manager): Promise<AssignmentEntity[]> {
    return em.findBy(AssignmentEntity, { rosterPeriodId: periodId, pinned: true });
  }

  /**
   * Worked cells (a shift, not a day off) of the periods in `statuses`, of some staff members or of
   * everyone in some units, optionally on days in [from, to], each with its period's unit: one query
   * over the cells and their periods, for reads across periods (my roster, calendar feeds).
   */
  async shiftCellsOf(
    filter: {
      statuses: readonly RosterPeriodStatus[];
      staffMemberIds?: readonly string[];
      unitIds?: readonly string[];
      from?: string;
      to?: string;
    },
    em: EntityManager = this.dataSource.manager,
  ): Promise<{ staffMemberId: string; date: string; shiftTypeId: string; unitId: string }[]> {
    if (filter.staffMemberIds?.length === 0 || filter.unitIds?.length === 0) return [];
    const qb = em
      .createQueryBuilder(AssignmentEntity, 'a')
      .innerJoin(RosterPeriodEntity, 'p', 'p.id = a.rosterPeriodId')
      .select('a.staffMemberId', 'staffMemberId')
      .addSelect('a.date', 'date')
      .addSelect('a.shiftTypeId', 'shiftTypeId')
      .addSelect('p.unitId', 'unitId')
      .where('p.status IN (:...statuses)', { statuses: filter.statuses })
      .andWhere('a.shiftTypeId IS NOT NULL');
    if (filter.staffMemberIds)
      qb.andWhere('a.staffMemberId IN (:...staff)', { staff: filter.staffMemberIds });
    if (filter.unitIds) qb.andWhere('p.unitId IN (:...units)', { units: filter.unitIds });
    if (filter.from) qb.andWhere('a.date >= :from', { from: filter.from });
    if (filter.to) qb.andWhere('a.date <= :to', { to: filter.to });
    return qb.getRawMany();
  }

  /** Sets the given cells (a day off that is not pinned is stored as no row); answers the version. */
  async writeCells(
    em: EntityManager,
    periodId: string,
    cells: readonly CellWrite[],
    by: CellChangeBy,
  ): Promise<number> {
    const rows = await em.findBy(AssignmentEntity, { rosterPeriodId: periodId });
    const byCell = new Map(rows.map((r) => [`${r.staffMemberId}|${r.date}`, r]));
    let changed = 0;
    const shiftChanges: ShiftChange[] = [];
    for (const c of cells) {
      const existing = byCell.get(`${c.staffMemberId}|${c.date}`) ?? null;
      if ((existing?.shiftTypeId ?? null) === c.shiftTypeId && (existing?.pinned ?? false) === c.pinned)
        continue;
      changed++;
      if ((existing?.shiftTypeId ?? null) !== c.shiftTypeId) {
        const before = existing?.shiftTypeId ?? null;
        shiftChanges.push({ staffMemberId: c.staffMemberId, date: c.date, before, after: c.shiftTypeId });
      }
      if (c.shiftTypeId === null && !c.pinned) {
        if (existing) await em.delete(AssignmentEntity, { id: existing.id });
      } else if (existing) {
        await em.update(
          AssignmentEntity,
          { id: existing.id },
          { shiftTypeId: c.shiftTypeId, pinned: c.pinned },
        );
      } else {
        await em.insert(AssignmentEntity, {
          rosterPeriodId: periodId,
          staffMemberId: c.staffMemberId,
          date: c.date,
          shiftTypeId: c.shiftTypeId,
          pinned: c.pinned,
        });
      }
    }
    return this.bump(em, periodId, changed, by, shiftChanges);
  }

  /**
   * Replaces every unpinned cell of the period with the given shifts (a solve or repair result);
   * pinned cells stay as they are. Answers the period's version after the change.
   */
  async replaceUnpinned(
    em: EntityManager,
    periodId: string,
    shifts: readonly { staffMemberId: string; date: string; shiftTypeId: string }[],
    by: CellChangeBy,
  ): Promise<number> {
    const before = await em.findBy(AssignmentEntity, { rosterPeriodId: periodId });
    const pinned = new Set(before.filter((r) => r.pinned).map((r) => `${r.staffMemberId}|${r.date}`));
    const old = new Map(
      before.filter((r) => !r.pinned).map((r) => [`${r.staffMemberId}|${r.date}`, r.shiftTypeId]),
    );
    const rows = shifts
      .filter((s) => !pinned.has(`${s.staffMemberId}|${s.date}`))
      .map((s) => ({ rosterPeriodId: periodId, ...s, pinned: false }));
    const now = new Set(rows.map((r) => `${r.staffMemberId}|${r.date}`));
    const shiftChanges: ShiftChange[] = rows
      .filter((r) => (old.get(`${r.staffMemberId}|${r.date}`) ?? null) !== r.shiftTypeId)
      .map((r) => ({
        staffMemberId: r.staffMemberId,
        date: r.date,
        before: old.get(`${r.staffMemberId}|${r.date}`) ?? null,
        after: r.shiftTypeId,
      }));
    for (const [k, before] of old) {
      if (now.has(k) || before === null) continue;
      const [staffMemberId, date] = k.split('|');
      shiftChanges.push({ staffMemberId, date, before, after: null });
    }
    let changed = rows.filter((r) => old.get(`${r.staffMemberId}|${r.date}`) !== r.shiftTypeId).length;
    changed += [...old.keys()].filter((k) => !now.has(k)).length;
    if (changed === 0) return this.bump(em, periodId, 0, by, []);
    await em.delete(AssignmentEntity, { rosterPeriodId: periodId, pinned: false });
    for (let i = 0; i < rows.length; i += 200) await em.insert(AssignmentEntity, rows.slice(i, i + 200));
    return this.bump(em, periodId, changed, by, shiftChanges);
  }

  /**
   * 409 unless `version` is the period's version as read in `em`'s transaction; the body names the
   * cell changes made since that version (StaleVersionDto).
   */
  async assertVersion(em: EntityManager, period: RosterPeriodEntity, version: number): Promise<void> {
    if (period.version === version) return;
    const changes = await this.changesSince(em, period.id, version);
    const cells = changes.reduce((n, c) => n + c.cells, 0);
    const who = [...new Set(changes.map((c) => c.actorName))];
    const kinds = [...new Set(changes.map((c) => c.kind))];
    const what =
      version > period.version
        ? `version ${version} was never reached`
        : changes.length > 0
          ? `${cells} cell(s) changed since version ${version} (${kinds.join(', ')}) by ${who.join(', ')}`
          : `the period's settings changed since version ${version}`;
    const body: StaleVersionDto = {
      statusCode: 409,
      error: 'Conflict',
      message: `The period was changed meanwhile: ${what}; it is now version ${period.version}. Reload it and check the roster again.`,
      version: period.version,
      changes,
    };
    throw new ConflictException(body);
  }

  /** The cell changes that made versions after `version`, oldest first. */
  async changesSince(em: EntityManager, periodId: string, version: number): Promise<RosterPeriodChangeDto[]> {
    const rows = await em.find(RosterPeriodChangeEntity, {
      where: { rosterPeriodId: periodId, version: MoreThan(version) },
      order: { version: 'ASC', id: 'ASC' },
      take: 100,
    });
    return rows.map((r) => ({
      version: r.version,
      kind: r.kind,
      cells: r.cells,
      actorName: r.actorName,
      at: r.at.toISOString(),
    }));
  }

  /**
   * The cell changes recorded at or after `since`, oldest first: what changed since a request
   * was made (a swap or claim holds the period as it was when it was asked for).
   */
  async changesAfter(em: EntityManager, periodId: string, since: Date): Promise<RosterPeriodChangeDto[]> {
    const rows = await em.find(RosterPeriodChangeEntity, {
      where: { rosterPeriodId: periodId, at: MoreThanOrEqual(since) },
      order: { version: 'ASC', id: 'ASC' },
      take: 100,
    });
    return rows.map((r) => ({
      version: r.version,
      kind: r.kind,
      cells: r.cells,
      actorName: r.actorName,
      at: r.at.toISOString(),
    }));
  }

  private async bump(
    em: EntityManager,
    periodId: string,
    cells: number,
    by: CellChangeBy,
    shiftChanges: readonly ShiftChange[],
  ): Promise<number> {
    if (cells === 0) return (await em.findOneByOrFail(RosterPeriodEntity, { id: periodId })).version;
    await em.increment(RosterPeriodEntity, { id: periodId }, 'version', 1);
    const { version } = await em.findOneByOrFail(RosterPeriodEntity, { id: periodId });
    let actorName = 'Rotaplex (system)';
    let actorUserId: string | null = null;
    if (by.actorUserId !== null) {
      const user = await this.users.byId(by.actorUserId, em);
      actorName = user?.displayName.slice(0, 200) ?? 'a user removed since';
      actorUserId = user?.id ?? null;
    }
    await em.insert(RosterPeriodChangeEntity, {
      id: randomUUID(),
      rosterPeriodId: periodId,
      version,
      kind: by.kind,
      cells,
      actorUserId,
      actorName,
      at: new Date(),
    });
    await recordLateChanges(em, periodId, version, shiftChanges, {
      kind: by.kind,
      actorName,
      leaveCells: by.leaveCells,
    });
    return version;
  }
}
