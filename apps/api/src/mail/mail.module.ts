import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { OutboxDeliveryService } from './outbox/outbox-delivery.service';
import { OutboxMessageEntity } from './outbox/outbox-message.entity';
import { MailBodyCipher } from './mail-body-cipher';
import { MailCatcherService } from './mail-catcher.service';
import { MailMessageEntity } from './mail-message.entity';
import { MailService } from './mail.service';
import { MailboxController } from './mailbox.controller';

@Module({
  imports: [TypeOrmModule.forFeature([MailMessageEntity, OutboxMessageEntity])],
  controllers: [MailboxController],
  providers: [MailBodyCipher, MailCatcherService, MailService, OutboxDeliveryService],
  exports: [MailBodyCipher, MailService, MailCatcherService, OutboxDeliveryService],
})
export class MailModule {}
