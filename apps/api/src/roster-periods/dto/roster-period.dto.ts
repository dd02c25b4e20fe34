import { ApiProperty, ApiPropertyOptional, PickType } from '@nestjs/swagger';
import {
  type CreateRosterPeriodRequest,
  type Page,
  ROSTER_PERIOD_MAX_DAYS,
  ROSTER_PERIOD_MIN_DAYS,
  ROSTER_PERIOD_STATUSES,
  type RosterPeriodDto,
  type RosterPeriodListQuery,
  type RosterPeriodStatus,
  type UpdateRosterPeriodRequest,
} from '@rotaplex/contracts';
import { IsIn, IsInt, IsOptional, IsUUID, Max, Min } from 'class-validator';
import { IsIsoDate } from '../../common/decorators/is-iso-date.decorator';
import { PageQueryDto } from '../../common/pagination';

export class CreateRosterPeriodDto implements CreateRosterPeriodRequest {
  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'unitId must be a unit id' })
  unitId!: string;

  @ApiProperty({ example: '2027-01-04', description: 'First day, YYYY-MM-DD' })
  @IsIsoDate()
  startDate!: string;

  @ApiProperty({ minimum: ROSTER_PERIOD_MIN_DAYS, maximum: ROSTER_PERIOD_MAX_DAYS, example: 28 })
  @IsInt()
  @Min(ROSTER_PERIOD_MIN_DAYS)
  @Max(ROSTER_PERIOD_MAX_DAYS)
  days!: number;
}

export class UpdateRosterPeriodDto implements UpdateRosterPeriodRequest {
  @ApiPropertyOptional({ example: '2027-01-04' })
  @IsOptional()
  @IsIsoDate()
  startDate?: string;

  @ApiPropertyOptional({ minimum: ROSTER_PERIOD_MIN_DAYS, maximum: ROSTER_PERIOD_MAX_DAYS })
  @IsOptional()
  @IsInt()
  @Min(ROSTER_PERIOD_MIN_DAYS)
  @Max(ROSTER_PERIOD_MAX_DAYS)
  days?: number;

  @ApiPropertyOptional({ description: 'Expected current version; 409 when the period changed meanwhile' })
  @IsOptional()
  @IsInt()
  @Min(1)
  version?: number;
}

/** Filters, page (from 1) and pageSize (1 to MAX_PAGE_SIZE, default 20); newest first. */
export class RosterPeriodQueryDto
  extends PickType(PageQueryDto, ['page', 'pageSize'] as const)
  implements RosterPeriodListQuery
{
  @ApiPropertyOptional({ format: 'uuid' })
  @IsOptional()
  @IsUUID('all', { message: 'unitId must be a unit id' })
  unitId?: string;

  @ApiPropertyOptional({ enum: ROSTER_PERIOD_STATUSES })
  @IsOptional()
  @IsIn(ROSTER_PERIOD_STATUSES, { message: `status must be one of ${ROSTER_PERIOD_STATUSES.join(', ')}` })
  status?: RosterPeriodStatus;
}

export class RosterPeriodResponse implements RosterPeriodDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
  @ApiProperty({ format: 'uuid' }) unitId!: string;
  @ApiProperty() startDate!: string;
  @ApiProperty() days!: number;
  @ApiProperty({ enum: ROSTER_PERIOD_STATUSES }) status!: RosterPeriodStatus;
  @ApiProperty({ format: 'date-time' }) createdAt!: string;
  @ApiProperty({ format: 'date-time', nullable: true, type: String }) publishedAt!: string | null;
  @ApiProperty() version!: number;
}

export class RosterPeriodPageResponse implements Page<RosterPeriodDto> {
  @ApiProperty({ type: [RosterPeriodResponse] }) items!: RosterPeriodResponse[];
  @ApiProperty() total!: number;
  @ApiProperty() page!: number;
  @ApiProperty() pageSize!: number;
}
