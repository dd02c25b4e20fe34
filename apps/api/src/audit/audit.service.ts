import { BadRequestException, Injectable } from '@nestjs/common';
import { AUDIT_KINDS, type AuditKind } from '@rotaplex/contracts';
import { randomUUID } from 'node:crypto';
import { DataSource, type EntityManager } from 'typeorm';
import { UsersService } from '../users/users.service';
import { AuditEntryEntity } from './audit-entry.entity';

export interface AuditRecord {
  rosterPeriodId: string;
  /** The user who made the change; null for the system. */
  actorUserId: string | null;
  kind: AuditKind;
  summary: string;
  before: unknown;
  after: unknown;
}

const MAX_SUMMARY_LENGTH = 1000;

/**
 * Writes the audit trail of published rosters, always in the transaction of the change it records,
 * and reads it for other modules (no access check: the caller checks).
 */
@Injectable()
export class AuditService {
  constructor(
    private readonly users: UsersService,
    private readonly dataSource: DataSource,
  ) {}

  /** A page of the period's trail by time (then id), with the number of entries in all. */
  pageOf(
    periodId: string,
    query: { order?: 'asc' | 'desc'; page: number; pageSize: number },
    em: EntityManager = this.dataSource.manager,
  ): Promise<[AuditEntryEntity[], number]> {
    return em.findAndCount(AuditEntryEntity, {
      where: { rosterPeriodId: periodId },
      order: { at: query.order === 'desc' ? 'DESC' : 'ASC', id: 'ASC' },
      skip: (query.page - 1) * query.pageSize,
      take: query.pageSize,
    });
  }

  /** The period's whole trail, oldest first. */
  ofPeriod(periodId: string, em: EntityManager = this.dataSource.manager): Promise<AuditEntryEntity[]> {
    return em.find(AuditEntryEntity, {
      where: { rosterPeriodId: periodId },
      order: { at: 'ASC', id: 'ASC' },
    });
  }

  async record(em: EntityManager, entry: AuditRecord): Promise<void> {
    if (!(AUDIT_KINDS as readonly string[]).includes(entry.kind)) {
      throw new BadRequestException(`kind must be one of ${AUDIT_KINDS.join(', ')}`);
    }
    let actorName = 'Rotaplex (system)';
    if (entry.actorUserId !== null) {
      const user = await this.users.byId(entry.actorUserId, em);
      if (!user) throw new BadRequestException(`actorUserId: no user ${entry.actorUserId}`);
      actorName = user.displayName.slice(0, 200);
    }
    const row = em.create(AuditEntryEntity, {
      id: randomUUID(),
      rosterPeriodId: entry.rosterPeriodId,
      actorUserId: entry.actorUserId,
      actorName,
      kind: entry.kind,
      at: new Date(),
      summary: entry.summary.slice(0, MAX_SUMMARY_LENGTH),
      before: entry.before ?? null,
      after: entry.after ?? null,
    });
    await em.save(row);
  }
}
