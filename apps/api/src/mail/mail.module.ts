import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { MailCatcherService } from './mail-catcher.service';
import { MailMessageEntity } from './mail-message.entity';
import { MailService } from './mail.service';
import { MailboxController } from './mailbox.controller';

@Module({
  imports: [TypeOrmModule.forFeature([MailMessageEntity])],
  controllers: [MailboxController],
  providers: [MailCatcherService, MailService],
  exports: [MailService],
})
export class MailModule {}
