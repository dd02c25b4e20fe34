import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { MailModule } from '../mail.module';
import { OutboxMessageEntity } from './outbox-message.entity';
import { OutboxController } from './outbox.controller';
import { OutboxRetentionService } from './outbox-retention.service';

/**
 * The admin's view of the outbox and its retention. Queueing and delivery live in MailModule
 * (MailService, OutboxDeliveryService); the outbox is part of the mail folder, which holds all of
 * sending e-mail (queue, sealed bodies, delivery, the local catcher and its mailbox).
 */
@Module({
  imports: [TypeOrmModule.forFeature([OutboxMessageEntity]), MailModule],
  controllers: [OutboxController],
  providers: [OutboxRetentionService],
})
export class OutboxModule {}
