import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { type OrganisationDto } from '@rotaplex/contracts';
import { Repository } from 'typeorm';
import { OrganisationEntity } from './organisation.entity';

@Injectable()
export class OrganisationService {
  constructor(
    @InjectRepository(OrganisationEntity) private readonly organisations: Repository<OrganisationEntity>,
  ) {}

  async get(id: string): Promise<OrganisationDto> {
    const org = await this.organisations.findOneBy({ id });
    if (!org) throw new NotFoundException('Organisation not found');
    return toOrganisationDto(org);
  }

  async rename(id: string, name: string): Promise<OrganisationDto> {
    const org = await this.organisations.findOneBy({ id });
    if (!org) throw new NotFoundException('Organisation not found');
    org.name = name;
    return toOrganisationDto(await this.organisations.save(org));
  }
}

export function toOrganisationDto(org: OrganisationEntity): OrganisationDto {
  return { id: org.id, name: org.name };
}
