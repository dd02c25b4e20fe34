import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { ShiftTypesModule } from '../shift-types/shift-types.module';
import { SkillsModule } from '../skills/skills.module';
import { UnitsModule } from '../units/units.module';
import { CoverOverrideEntity, CoverPatternRowEntity } from './cover-need.entity';
import { CoverNeedsController } from './cover-needs.controller';
import { CoverNeedsService } from './cover-needs.service';

@Module({
  imports: [
    TypeOrmModule.forFeature([CoverPatternRowEntity, CoverOverrideEntity]),
    UnitsModule,
    ShiftTypesModule,
    SkillsModule,
  ],
  controllers: [CoverNeedsController],
  providers: [CoverNeedsService],
  exports: [CoverNeedsService],
})
export class CoverNeedsModule {}
