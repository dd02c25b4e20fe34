import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { MailModule } from '../mail/mail.module';
import { OutboxMessageEntity } from './outbox-message.entity';
import { OutboxController } from './outbox.controller';

/** The admin's view of the outbox. Queueing and delivery live in MailModule (MailService, OutboxDeliveryService). */
@Module({
  imports: [TypeOrmModule.forFeature([OutboxMessageEntity]), MailModule],
  controllers: [OutboxController],
})
export class OutboxModule {}
