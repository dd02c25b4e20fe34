import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { MailModule } from '../mail/mail.module';
import { OutboxMessageEntity } from './outbox-message.entity';
import { OutboxController } from './outbox.controller';
import { OutboxRetentionService } from './outbox-retention.service';

/**
 * The admin's view of the outbox and its retention. Queueing and delivery live in MailModule
 * (MailService, OutboxDeliveryService).
 */
@Module({
  imports: [TypeOrmModule.forFeature([OutboxMessageEntity]), MailModule],
  controllers: [OutboxController],
  providers: [OutboxRetentionService],
})
export class OutboxModule {}
