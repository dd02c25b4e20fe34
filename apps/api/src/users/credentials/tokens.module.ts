import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { OneTimeTokenEntity } from './one-time-token.entity';
import { OneTimeTokensService } from './one-time-tokens.service';
import { PasswordService } from './password.service';
import { RefreshTokenEntity } from './refresh-token.entity';
import { RefreshTokensService } from './refresh-tokens.service';

/** A user's credentials (password hashing, refresh and one-time tokens): used by users, auth and demo. */
@Module({
  imports: [TypeOrmModule.forFeature([RefreshTokenEntity, OneTimeTokenEntity])],
  providers: [PasswordService, RefreshTokensService, OneTimeTokensService],
  exports: [PasswordService, RefreshTokensService, OneTimeTokensService],
})
export class TokensModule {}
