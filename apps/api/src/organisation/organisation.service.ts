import { BadRequestException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { type NoticeWindowSettingsDto, type OrganisationDto } from '@rotaplex/contracts';
import { type EntityManager, Repository } from 'typeorm';
import { OrganisationEntity } from './organisation.entity';

@Injectable()
export class OrganisationService {
  constructor(
    @InjectRepository(OrganisationEntity) private readonly organisations: Repository<OrganisationEntity>,
  ) {}

  /** The organisation by id, or null (for other services), in `em`'s transaction when given. */
  byId(id: string, em: EntityManager = this.organisations.manager): Promise<OrganisationEntity | null> {
    return em.findOneBy(OrganisationEntity, { id });
  }

  async get(id: string): Promise<OrganisationDto> {
    const org = await this.organisations.findOneBy({ id });
    if (!org) throw new NotFoundException('Organisation not found');
    return toOrganisationDto(org);
  }

  async noticeWindow(id: string): Promise<NoticeWindowSettingsDto> {
    const org = await this.organisations.findOneBy({ id });
    if (!org) throw new NotFoundException('Organisation not found');
    return toNoticeWindowDto(org);
  }

  /** Sets the notice window; pay hours in quarter hours (400 otherwise). */
  async setNoticeWindow(id: string, body: NoticeWindowSettingsDto): Promise<NoticeWindowSettingsDto> {
    if (!Number.isInteger(body.predictabilityPayHours * 4)) {
      throw new BadRequestException([
        'predictabilityPayHours must be in quarter hours (for example 1 or 1.25)',
      ]);
    }
    const org = await this.organisations.findOneBy({ id });
    if (!org) throw new NotFoundException('Organisation not found');
    org.noticeWindowDays = body.noticeWindowDays;
    org.recordPredictabilityPay = body.recordPredictabilityPay;
    org.predictabilityPayHours = body.predictabilityPayHours;
    org.predictabilityPayRule = body.predictabilityPayRule;
    return toNoticeWindowDto(await this.organisations.save(org));
  }

  async rename(id: string, name: string): Promise<OrganisationDto> {
    const org = await this.organisations.findOneBy({ id });
    if (!org) throw new NotFoundException('Organisation not found');
    org.name = name;
    return toOrganisationDto(await this.organisations.save(org));
  }
}

/** The notice window and predictability-pay setting of an organisation. */
export function toNoticeWindowDto(org: OrganisationEntity): NoticeWindowSettingsDto {
  return {
    noticeWindowDays: org.noticeWindowDays,
    recordPredictabilityPay: org.recordPredictabilityPay,
    predictabilityPayHours: org.predictabilityPayHours,
    predictabilityPayRule: org.predictabilityPayRule,
  };
}

export function toOrganisationDto(org: OrganisationEntity): OrganisationDto {
  return { id: org.id, name: org.name };
}
