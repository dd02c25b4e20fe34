import { Injectable, Logger, type OnApplicationBootstrap } from '@nestjs/common';
import { Cron, CronExpression } from '@nestjs/schedule';
import { type SwapStatus } from '@rotaplex/contracts';
import { Brackets, DataSource } from 'typeorm';
import { dateInWords } from '../common/text/date-words';
import { localDate } from '../common/dates';
import { sqliteUtc } from '../common/dates';
import { UnitsService } from '../units/units.service';
import { SwapLinkTokenEntity, SwapRequestEntity } from './swap-request.entity';

/** Statuses that still wait for a decision. */
export const PENDING_SWAP_STATUSES: readonly SwapStatus[] = ['proposed', 'accepted'];

export const EXPIRED_OUTCOME = 'Expired: its first day passed before a decision was made';

/** The refusal of any decision on an expired request (the same whether the sweep or the decision found it). */
export function expiredMessage(row: Pick<SwapRequestEntity, 'firstDate'>): string {
  return `This request has expired: its first day (${dateInWords(row.firstDate)}) has passed before a decision was made. Nothing was changed.`;
}

/**
 * How long a decision link's record is kept after it expired: until then an old link answers
 * "expired" (410); afterwards it is unknown (400, "not valid"). Only token hashes are stored.
 */
export const LINK_RECORD_DAYS = 30;

/** Whether a pending request's first day has passed in its unit's time zone. */
export function isOverdue(row: Pick<SwapRequestEntity, 'status' | 'firstDate'>, today: string): boolean {
  return PENDING_SWAP_STATUSES.includes(row.status) && row.firstDate < today;
}

/**
 * Time-driven work on swaps, offers and open-shift claims, run every minute and once at start:
 * requests still pending once their first day has passed (in the unit's time zone) expire, and
 * decision links long past their expiry are deleted. Decisions check expiry themselves as well
 * (SwapsService), so nothing depends on this having run.
 */
@Injectable()
export class SwapExpiryService implements OnApplicationBootstrap {
  private readonly logger = new Logger(SwapExpiryService.name);

  constructor(
    private readonly dataSource: DataSource,
    private readonly units: UnitsService,
  ) {}

  async onApplicationBootstrap(): Promise<void> {
    // A server that was stopped for a while catches up before it answers.
    await this.expireOverdue();
  }

  /**
   * Marks every overdue pending request expired in one UPDATE (the local date of each time zone in
   * use decides, through the index on status and first date) and deletes old link records.
   * Returns the number of requests expired.
   */
  @Cron(CronExpression.EVERY_MINUTE, { name: 'swap-expiry', waitForCompletion: true })
  async expireOverdue(): Promise<number> {
    const m = this.dataSource.manager;
    const now = new Date();
    const zones = await this.units.timeZonesInUse();
    // Units in zones that share today's local date are one condition (at most three dates exist at once).
    const byDate = new Map<string, string[]>();
    for (const timeZone of zones) {
      const today = localDate(now, timeZone);
      byDate.set(today, [...(byDate.get(today) ?? []), timeZone]);
    }
    let expired = 0;
    if (byDate.size) {
      const result = await m
        .createQueryBuilder()
        .update(SwapRequestEntity)
        .set({ status: 'expired', outcome: EXPIRED_OUTCOME })
        .where('"status" IN (:...pending)', { pending: PENDING_SWAP_STATUSES })
        .andWhere(
          new Brackets((any) => {
            [...byDate].forEach(([today, timeZones], i) =>
              any.orWhere(
                `("firstDate" < :today${i} AND "unitId" IN (SELECT "id" FROM "units" WHERE "timeZone" IN (:...zones${i})))`,
                { [`today${i}`]: today, [`zones${i}`]: timeZones },
              ),
            );
          }),
        )
        .execute();
      expired = result.affected ?? 0;
    }
    const before = new Date(now.getTime() - LINK_RECORD_DAYS * 86_400_000);
    const purged = await m
      .createQueryBuilder()
      .delete()
      .from(SwapLinkTokenEntity)
      .where('"expiresAt" < :before', { before: sqliteUtc(before) })
      .execute();
    if (expired || purged.affected) {
      this.logger.log(
        `Expired ${expired} overdue request(s); deleted ${purged.affected ?? 0} old decision link(s)`,
      );
    }
    return expired;
  }
}
