import { Module } from '@nestjs/common';
import { TokensModule } from '../users/credentials/tokens.module';
import { MailModule } from '../mail/mail.module';
import { FirstRunService } from './first-run.service';

@Module({
  imports: [TokensModule, MailModule],
  providers: [FirstRunService],
})
export class DemoModule {}
