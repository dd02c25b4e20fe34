import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { UnitsModule } from '../units/units.module';
import { ShiftTypeEntity } from './shift-type.entity';
import { ShiftTypesController } from './shift-types.controller';
import { ShiftTypesService } from './shift-types.service';

@Module({
  imports: [TypeOrmModule.forFeature([ShiftTypeEntity]), UnitsModule],
  controllers: [ShiftTypesController],
  providers: [ShiftTypesService],
  exports: [ShiftTypesService],
})
export class ShiftTypesModule {}
