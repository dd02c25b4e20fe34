import { ConflictException, Injectable, UnprocessableEntityException } from '@nestjs/common';
import {
  type AuditEntryDto,
  type Page,
  type PublishCheckDto,
  type PublishRequest,
  type PublishResultDto,
  type RosterCellChangeDto,
  type SolveRunStartedDto,
} from '@rotaplex/contracts';
import { type Roster } from '@rotaplex/roster-model';
import { randomUUID } from 'node:crypto';
import { DataSource, type EntityManager } from 'typeorm';
import { type AssignmentEntity } from '../roster-periods/assignment.entity';
import { checkDto, rosterOf, saveSolvedRoster } from '../assignments/assignments.service';
import { type AuditEntryEntity } from '../audit/audit-entry.entity';
import { AuditService } from '../audit/audit.service';
import { type AuthUser } from '../common/auth-user';
import { type PageQueryDto, toPage } from '../common/pagination';
import { AppConfig } from '../config/app-config';
import { ContractsService } from '../contracts/contracts.service';
import { MailService } from '../mail/mail.service';
import { lateChangesOf, lateNotes, lateSummary } from '../roster-periods/notice-window';
import { PeriodWriter } from '../roster-periods/period-writer';
import { RosterPeriodsService } from '../roster-periods/roster-periods.service';
import { type RosterInput, RosterInputService } from '../roster-input/roster-input.service';
import { type SolveRunMode, SolveRunsService } from '../solve-runs/solve-runs.service';
import { toCsv } from '../common/csv';
import { type PublishedCell, RosterPublicationEntity } from './roster-publication.entity';
import { belowMinimum, leadTimeCaution, redFlags, settingCautions, unhonouredLeave } from './publish-check';
import { localDate } from '../common/dates';
import { unmetNeeds } from '../open-shifts/open-shifts.service';
import { ClaimCheck } from '../swaps/swap-evaluation';
import { formatShiftTimes, type MailShift, rosterMail } from './roster-mail';

/** Publishing a draft roster, repairing a published one, and the period's audit trail and export. */
@Injectable()
export class PublishingService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly config: AppConfig,
    private readonly periods: RosterPeriodsService,
    private readonly input: RosterInputService,
    private readonly mail: MailService,
    private readonly audit: AuditService,
    private readonly solveRuns: SolveRunsService,
    private readonly writer: PeriodWriter,
    private readonly contracts: ContractsService,
  ) {}

  /**
   * What publishing the period's roster as it stands would publish: shifts below minimum cover
   * (worst first, with the roster model's reasons), the checker's rule findings, shifts on approved
   * leave and cautions on the settings used; and whether it can be published.
   */
  async publishCheck(user: AuthUser, periodId: string): Promise<PublishCheckDto> {
    await this.periods.get(user, periodId); // 404 / 403 by unit
    const em = this.dataSource.manager;
    const input = await this.input.load(periodId);
    const rows = await this.writer.rowsOf(periodId, em);
    const roster = rosterOf(input, rows);
    const cells = publishedCells(input, rows);
    const contractIds = [...new Set(input.staff.flatMap((s) => (s.contractId ? [s.contractId] : [])))];
    const contracts = new Map((await this.contracts.byIds(contractIds, em)).map((c) => [c.id, c]));
    const short = belowMinimum(input, roster, true);
    const flags = redFlags(input, roster);
    const blockers: string[] = [];
    if (input.period.status !== 'draft')
      blockers.push(`Only a draft can be published; this period is ${input.period.status}.`);
    if (cells.length === 0) blockers.push(EMPTY_ROSTER);
    return {
      rosterPeriodId: periodId,
      version: input.period.version,
      shifts: cells.length,
      people: new Set(cells.map((c) => c.staffMemberId)).size,
      redFlags: flags,
      belowMinimum: short,
      ruleFindings: checkDto(input, roster).violations,
      unhonouredLeave: unhonouredLeave(input, roster),
      lateNotice: leadTimeCaution(
        localDate(new Date(), input.unit.timeZone),
        input.period.startDate,
        input.unit.publishLeadDays,
      ),
      cautions: settingCautions(input, roster, contracts),
      blockers,
      needsAcknowledgement: short.length > 0 || flags.length > 0,
    };
  }

  /**
   * Publishes a draft: status, snapshot, audit entry and one e-mail per person with an e-mail
   * address (their own shifts only), all in one transaction. 409 when the version is stale, the
   * period is not a draft or a solve is running; 422 when the roster has no shifts, or has shifts
   * below minimum cover and the request does not acknowledge them with a reason (kept in the audit
   * entry).
   */
  async publish(user: AuthUser, periodId: string, request: PublishRequest): Promise<PublishResultDto> {
    const { version } = request;
    await this.periods.get(user, periodId); // 404 / 403 by unit
    return this.dataSource.transaction(async (em) => {
      const period = await this.periods.byIdOrFail(periodId, em);
      if (period.status !== 'draft') {
        throw new ConflictException(`Only a draft period can be published; this one is ${period.status}`);
      }
      // A stale version answers 409 with the cell changes made since it (StaleVersionDto).
      await this.writer.assertVersion(em, period, version);
      const running = await this.solveRuns.activeOf(periodId, em);
      if (running) {
        throw new ConflictException(
          `A solve run is ${running.status} for this period: wait for it or stop it`,
        );
      }
      const input = await this.input.load(periodId, {}, em);
      const rows = await this.writer.rowsOf(periodId, em);
      const cells = publishedCells(input, rows);
      if (cells.length === 0) throw new UnprocessableEntityException(EMPTY_ROSTER);
      const short = belowMinimum(input, rosterOf(input, rows), false);
      // Every red flag is also a shift below minimum (its need is the minimum), so short[0] exists.
      const flags = redFlags(input, rosterOf(input, rows));
      const reason = request.reason?.trim() ?? '';
      if (
        (short.length > 0 || flags.length > 0) &&
        (request.acknowledgeBelowMinimum !== true || reason === '')
      ) {
        throw new UnprocessableEntityException(
          (flags.length > 0
            ? `${flags.length} ${flags.length === 1 ? 'red flag' : 'red flags'} of safe staffing ` +
              `(NICE SG1; first: ${flags[0].text}). `
            : '') +
            `${short.length} ${short.length === 1 ? 'shift is' : 'shifts are'} below minimum cover ` +
            `(worst: ${short[0].shiftName} on ${short[0].date}, ${short[0].onShift} of ${short[0].min}` +
            `${short[0].skillCode ? ` ${short[0].skillCode}` : ''}). To publish anyway, acknowledge it ` +
            '(acknowledgeBelowMinimum) and give the reason (reason); it is kept in the audit trail.',
        );
      }
      const publishedAt = new Date();
      if (!(await this.periods.markPublished(em, periodId, version, publishedAt))) {
        throw new ConflictException('The period was changed meanwhile: reload it');
      }
      await em.insert(RosterPublicationEntity, {
        id: randomUUID(),
        rosterPeriodId: periodId,
        kind: 'publish',
        publishedAt,
        publishedById: user.id,
        cells,
      });
      const people = new Set(cells.map((c) => c.staffMemberId)).size;
      await this.audit.record(em, {
        rosterPeriodId: periodId,
        actorUserId: user.id,
        kind: 'publish',
        summary:
          `Published the roster: ${cells.length} shift(s) for ${people} person(s)` +
          (short.length > 0 || flags.length > 0
            ? `, with ${short.length} shift(s) below minimum cover` +
              (flags.length > 0 ? ` and ${flags.length} red flag(s) of safe staffing (NICE SG1)` : '') +
              ` acknowledged. Reason: ${reason}`
            : ''),
        before: null,
        after: cells,
      });
      const emailed = await this.mailPeople(em, input, rosterOf(input, rows), null, 'published');
      const saved = await this.periods.byIdOrFail(periodId, em);
      return {
        rosterPeriodId: periodId,
        status: 'published',
        publishedAt: publishedAt.toISOString(),
        version: saved.version,
        emailed,
      };
    });
  }

  /**
   * Starts a repair of a published roster: a solve run in the roster model's repair mode (fewest
   * changes to the current roster). At its end the roster is replaced, the changed cells audited
   * and the people whose shifts changed e-mailed, in one transaction.
   */
  async repair(user: AuthUser, periodId: string, timeLimitSeconds: number): Promise<SolveRunStartedDto> {
    let reference: Roster | null = null;
    const mode: SolveRunMode = {
      periodStatuses: ['published'],
      prepare: async (input) => {
        const rows = await this.writer.rowsOf(periodId);
        reference = rosterOf(input, rows);
        input.problem.published = reference;
      },
      save: async (em, input, roster, run) => {
        const period = await this.periods.byId(periodId, em);
        if (!period || period.status !== 'published') {
          throw new Error(
            `the period was ${period ? period.status : 'deleted'} during the repair; nothing was changed`,
          );
        }
        const rows = await this.writer.rowsOf(periodId, em);
        const before = rosterOf(input, rows);
        if (!reference || !sameRoster(before, reference)) {
          throw new Error(
            'the roster changed during the repair (a swap or a claim); nothing was changed, start the repair again',
          );
        }
        const changes = diffRosters(input, before, roster);
        // Through the period's writer: the version rises, clients holding the old roster must reload.
        // A shift taken off for the person's own approved leave counts as asked for by them.
        const version = await saveSolvedRoster(em, this.writer, input, roster, {
          kind: 'repair',
          actorUserId: run.requestedById,
          leaveCells: new Set(
            input.problem.absences
              .filter((a) => a.kind === 'leave')
              .map((a) => `${a.personId}|${input.dates[a.day]}`),
          ),
        });
        const late = await lateChangesOf(em, periodId, version);
        const after = await this.writer.rowsOf(periodId, em);
        await em.insert(RosterPublicationEntity, {
          id: randomUUID(),
          rosterPeriodId: periodId,
          kind: 'repair',
          publishedAt: new Date(),
          publishedById: run.requestedById,
          cells: publishedCells(input, after),
        });
        const changedPeople = new Set(changes.map((c) => c.staffMemberId));
        await this.audit.record(em, {
          rosterPeriodId: periodId,
          actorUserId: run.requestedById,
          kind: 'repair',
          summary:
            `Repair changed ${changes.length} ${changes.length === 1 ? 'cell' : 'cells'} for ${changedPeople.size} ${changedPeople.size === 1 ? 'person' : 'people'}` +
            lateSummary(late),
          before: changes.map((c) => ({
            staffMemberId: c.staffMemberId,
            date: c.date,
            shiftTypeId: c.before,
          })),
          after: changes.map((c) => ({ staffMemberId: c.staffMemberId, date: c.date, shiftTypeId: c.after })),
        });
        await this.mailPeople(em, input, roster, changedPeople, 'changed', lateNotes(late));
      },
    };
    return this.solveRuns.start(user, periodId, { timeLimitSeconds }, mode);
  }

  async auditTrail(user: AuthUser, periodId: string, query: PageQueryDto): Promise<Page<AuditEntryDto>> {
    await this.periods.get(user, periodId);
    const [rows, total] = await this.audit.pageOf(periodId, query);
    return toPage(rows.map(toAuditDto), total, query);
  }

  /**
   * The period as CSV: one "shift" line per worked cell of the current roster (times in the unit's
   * zone), then one "audit" line per entry of the trail. Every cell is neutralised against
   * spreadsheet formula injection.
   */
  async exportCsv(user: AuthUser, periodId: string): Promise<{ filename: string; csv: string }> {
    await this.periods.get(user, periodId);
    const input = await this.input.load(periodId);
    const rows = await this.writer.rowsOf(periodId);
    const trail = await this.audit.ofPeriod(periodId);
    const staffById = new Map(input.staff.map((s) => [s.id, s]));
    const shiftById = new Map(input.shiftTypes.map((s) => [s.id, s]));
    const dayOf = new Map(input.dates.map((d, i) => [d, i]));
    const header = [
      'record',
      'date',
      'staff_member',
      'shift_code',
      'shift_times',
      'pinned',
      'at',
      'actor',
      'kind',
      'summary',
      'before',
      'after',
    ] as const;
    const out: (string | null)[][] = [];
    const sorted = [...rows]
      .filter((r) => r.shiftTypeId !== null)
      .sort((a, b) => a.date.localeCompare(b.date) || nameOf(a).localeCompare(nameOf(b)));
    function nameOf(r: AssignmentEntity): string {
      return staffById.get(r.staffMemberId)?.name ?? r.staffMemberId;
    }
    for (const r of sorted) {
      const st = shiftById.get(r.shiftTypeId as string);
      const day = dayOf.get(r.date);
      out.push([
        'shift',
        r.date,
        nameOf(r),
        st?.code ?? '',
        st && day !== undefined
          ? formatShiftTimes(
              { day, start: st.start, end: st.end },
              { startDate: input.period.startDate, timeZone: input.unit.timeZone },
            )
          : '',
        r.pinned ? 'yes' : 'no',
        null,
        null,
        null,
        null,
        null,
        null,
      ]);
    }
    for (const a of trail) {
      out.push([
        'audit',
        null,
        null,
        null,
        null,
        null,
        a.at.toISOString(),
        a.actorName,
        a.kind,
        a.summary,
        a.before === null || a.before === undefined ? null : JSON.stringify(a.before),
        a.after === null || a.after === undefined ? null : JSON.stringify(a.after),
      ]);
    }
    return {
      filename: `roster-${input.unit.name.replace(/[^A-Za-z0-9-]+/g, '-')}-${input.period.startDate}.csv`,
      csv: toCsv(header, out),
    };
  }

  /** Queues one e-mail per person (with an address) in `only` (all when null) with their own shifts. */
  private async mailPeople(
    em: EntityManager,
    input: RosterInput,
    roster: Roster,
    only: Set<string> | null,
    kind: 'published' | 'changed',
    lateNote: Map<string, string> = new Map(),
  ): Promise<number> {
    const shiftById = new Map(input.shiftTypes.map((s) => [s.id, s]));
    const link = `${this.config.publicUrl ?? ''}/`;
    const mayTake = kind === 'published' ? openShiftsByPerson(input, roster) : new Map<string, number>();
    let sent = 0;
    for (const person of input.staff) {
      if (!person.email || (only && !only.has(person.id))) continue;
      const shifts: MailShift[] = [];
      (roster[person.id] ?? []).forEach((id, day) => {
        const st = id ? shiftById.get(id) : undefined;
        if (st) shifts.push({ day, code: st.code, name: st.name, start: st.start, end: st.end });
      });
      const content = rosterMail({
        displayName: person.name,
        unitName: input.unit.name,
        timeZone: input.unit.timeZone,
        startDate: input.period.startDate,
        days: input.period.days,
        shifts,
        link,
        kind,
        openShifts: mayTake.get(person.id) ?? 0,
        lateNote: lateNote.get(person.id),
      });
      await this.mail.send({ to: person.email, ...content }, em);
      sent++;
    }
    return sent;
  }
}

/**
 * How many open shifts (cover below target from the unit's today on) each person may take on a roster
 * about to be published: they have the skill, work no shift that day, and the checker finds no rule of
 * theirs broken anew (the same test the open-shift list uses).
 */
function openShiftsByPerson(input: RosterInput, roster: Roster): Map<string, number> {
  const rows = Object.entries(roster).flatMap(([staffMemberId, days]) =>
    days.map((shiftTypeId, d) => ({ staffMemberId, date: input.dates[d], shiftTypeId })),
  );
  const open = unmetNeeds(input, rows, localDate(new Date(), input.unit.timeZone));
  const out = new Map<string, number>();
  if (open.length === 0) return out;
  const check = new ClaimCheck(input, rows);
  for (const person of input.staff) {
    const skills = new Set(person.skills.map((k) => k.id));
    const working = new Set(
      rows.filter((r) => r.staffMemberId === person.id && r.shiftTypeId).map((r) => r.date),
    );
    const n = open.filter(
      (o) =>
        (o.skillId === null || skills.has(o.skillId)) &&
        !working.has(o.date) &&
        !check.blocked(person.id, o.date, o.shiftTypeId),
    ).length;
    if (n > 0) out.set(person.id, n);
  }
  return out;
}

const EMPTY_ROSTER =
  'The roster has no shifts: there is nothing to publish. Generate a roster or enter shifts first.';

/** The worked cells of a roster's rows (active people of the period only). */
function publishedCells(input: RosterInput, rows: AssignmentEntity[]): PublishedCell[] {
  const active = new Set(input.staff.map((s) => s.id));
  const dates = new Set(input.dates);
  return rows
    .filter((r) => r.shiftTypeId !== null && active.has(r.staffMemberId) && dates.has(r.date))
    .map((r) => ({ staffMemberId: r.staffMemberId, date: r.date, shiftTypeId: r.shiftTypeId as string }))
    .sort((a, b) => a.date.localeCompare(b.date) || a.staffMemberId.localeCompare(b.staffMemberId));
}

function sameRoster(a: Roster, b: Roster): boolean {
  const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
  for (const k of keys) {
    const x = a[k] ?? [];
    const y = b[k] ?? [];
    const n = Math.max(x.length, y.length);
    for (let d = 0; d < n; d++) if ((x[d] ?? null) !== (y[d] ?? null)) return false;
  }
  return true;
}

/** Cells whose shift differs between two rosters of the period. */
export function diffRosters(input: RosterInput, before: Roster, after: Roster): RosterCellChangeDto[] {
  const out: RosterCellChangeDto[] = [];
  for (const s of input.staff) {
    input.dates.forEach((date, d) => {
      const b = before[s.id]?.[d] ?? null;
      const a = after[s.id]?.[d] ?? null;
      if (a !== b) out.push({ staffMemberId: s.id, date, before: b, after: a });
    });
  }
  return out;
}

export function toAuditDto(a: AuditEntryEntity): AuditEntryDto {
  return {
    id: a.id,
    rosterPeriodId: a.rosterPeriodId,
    actorUserId: a.actorUserId,
    actorName: a.actorName,
    kind: a.kind,
    at: a.at.toISOString(),
    summary: a.summary,
    before: a.before ?? null,
    after: a.after ?? null,
  };
}
