import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { OrganisationController } from './organisation.controller';
import { OrganisationEntity } from './organisation.entity';
import { OrganisationService } from './organisation.service';

@Module({
  imports: [TypeOrmModule.forFeature([OrganisationEntity])],
  controllers: [OrganisationController],
  providers: [OrganisationService],
  exports: [OrganisationService],
})
export class OrganisationModule {}
