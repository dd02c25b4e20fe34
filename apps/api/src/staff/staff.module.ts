import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { ContractsModule } from '../contracts/contracts.module';
import { SkillsModule } from '../skills/skills.module';
import { UnitsModule } from '../units/units.module';
import { UsersModule } from '../users/users.module';
import { StaffMemberEntity } from './staff-member.entity';
import { StaffController } from './staff.controller';
import { StaffService } from './staff.service';

@Module({
  imports: [
    TypeOrmModule.forFeature([StaffMemberEntity]),
    UnitsModule,
    SkillsModule,
    ContractsModule,
    UsersModule,
  ],
  controllers: [StaffController],
  providers: [StaffService],
  exports: [StaffService],
})
export class StaffModule {}
