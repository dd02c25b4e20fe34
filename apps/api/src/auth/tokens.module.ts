import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { OneTimeTokenEntity } from './one-time-token.entity';
import { OneTimeTokensService } from './one-time-tokens.service';
import { PasswordService } from './password.service';
import { RefreshTokenEntity } from './refresh-token.entity';
import { RefreshTokensService } from './refresh-tokens.service';

/** Passwords and tokens, shared by the auth and users features. */
@Module({
  imports: [TypeOrmModule.forFeature([RefreshTokenEntity, OneTimeTokenEntity])],
  providers: [PasswordService, RefreshTokensService, OneTimeTokensService],
  exports: [PasswordService, RefreshTokensService, OneTimeTokensService],
})
export class TokensModule {}
