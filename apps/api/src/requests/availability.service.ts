import { BadRequestException, Injectable } from '@nestjs/common';
import { type AvailabilityDto } from '@rotaplex/contracts';
import { DataSource } from 'typeorm';
import { type AuthUser } from '../common/auth-user';
import { type ReplaceAvailabilityDto } from './dto/requests.dto';
import { RequestAccess } from './request-access';
import { AvailabilityCellEntity } from './requests.entities';

/** A staff member's weekly availability: read by them and their managers, replaced by them alone. */
@Injectable()
export class AvailabilityService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly access: RequestAccess,
  ) {}

  async get(user: AuthUser, staffMemberId: string): Promise<AvailabilityDto> {
    await this.access.readableStaff(user, staffMemberId);
    return this.of(staffMemberId);
  }

  private async of(staffMemberId: string): Promise<AvailabilityDto> {
    const cells = await this.dataSource.manager.find(AvailabilityCellEntity, {
      where: { staffMemberId },
      order: { weekday: 'ASC', part: 'ASC' },
    });
    return {
      staffMemberId,
      cells: cells.map((c) => ({ weekday: c.weekday, part: c.part, status: c.status })),
    };
  }

  async replace(
    user: AuthUser,
    staffMemberId: string,
    body: ReplaceAvailabilityDto,
  ): Promise<AvailabilityDto> {
    await this.access.ownStaff(user, staffMemberId);
    const seen = new Set<string>();
    for (const c of body.cells) {
      const key = `${c.weekday}|${c.part}`;
      if (seen.has(key)) {
        throw new BadRequestException([`cells has weekday ${c.weekday}, part ${c.part} more than once`]);
      }
      seen.add(key);
    }
    await this.dataSource.transaction(async (em) => {
      await em.delete(AvailabilityCellEntity, { staffMemberId });
      const rows = body.cells.filter((c) => c.status !== 'available');
      if (rows.length) {
        await em.insert(
          AvailabilityCellEntity,
          rows.map((c) => ({ staffMemberId, weekday: c.weekday, part: c.part, status: c.status })),
        );
      }
    });
    return this.of(staffMemberId);
  }
}
