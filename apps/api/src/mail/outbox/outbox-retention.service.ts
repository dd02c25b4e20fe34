import { Injectable, Logger } from '@nestjs/common';
import { Cron, CronExpression } from '@nestjs/schedule';
import { InjectRepository } from '@nestjs/typeorm';
import { Repository } from 'typeorm';
import { AppConfig } from '../../config/app-config';
import { sqliteUtc } from '../../common/dates';
import { OutboxMessageEntity } from './outbox-message.entity';

/**
 * Outbox retention, every hour: a sent message stays listed in the admin's outbox for
 * OUTBOX_RETENTION (AppConfig.outbox.retentionSeconds, default 30 days) after it was sent, then it
 * is deleted. Pending and failed messages are kept (an admin can still retry a failed one).
 */
@Injectable()
export class OutboxRetentionService {
  private readonly logger = new Logger(OutboxRetentionService.name);

  constructor(
    private readonly config: AppConfig,
    @InjectRepository(OutboxMessageEntity) private readonly messages: Repository<OutboxMessageEntity>,
  ) {}

  /** Deletes the messages sent longer ago than the retention; returns how many. */
  @Cron(CronExpression.EVERY_HOUR, { name: 'outbox-retention', waitForCompletion: true })
  async purgeDelivered(): Promise<number> {
    const before = new Date(Date.now() - this.config.outbox.retentionSeconds * 1000);
    const { affected } = await this.messages
      .createQueryBuilder()
      .delete()
      .where(`"status" = 'sent' AND "sentAt" < :before`, { before: sqliteUtc(before) })
      .execute();
    if (affected) this.logger.log(`Deleted ${affected} sent message(s) past the outbox retention`);
    return affected ?? 0;
  }
}
