import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { OrganisationModule } from '../organisation/organisation.module';
import { TokensModule } from './credentials/tokens.module';
import { MailModule } from '../mail/mail.module';
import { UnitsModule } from '../units/units.module';
import { UserEntity } from './user.entity';
import { UsersController } from './users.controller';
import { UsersService } from './users.service';

@Module({
  imports: [
    TypeOrmModule.forFeature([UserEntity]),
    TokensModule,
    UnitsModule,
    MailModule,
    OrganisationModule,
  ],
  controllers: [UsersController],
  providers: [UsersService],
  exports: [UsersService],
})
export class UsersModule {}
