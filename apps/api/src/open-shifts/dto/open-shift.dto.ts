import { ApiProperty, ApiPropertyOptional, PickType } from '@nestjs/swagger';
import {
  type ClaimOpenShiftDto,
  type NotifyOpenShiftDto,
  type NotifyOpenShiftResultDto,
  type OpenShiftDto,
  type Page,
} from '@rotaplex/contracts';
import { Transform } from 'class-transformer';
import { IsBoolean, IsOptional, IsString, IsUUID, MaxLength, ValidateIf } from 'class-validator';
import { IsIsoDate } from '../../common/decorators/is-iso-date.decorator';
import { PageQueryDto } from '../../common/pagination';
import { RedFlagResponse } from '../../common/red-flag.dto';
import { OutsideOfferResponse } from './outside-offer.dto';

/** page (from 1), pageSize (1 to MAX_PAGE_SIZE, default 20) and an optional period. */
export class OpenShiftQuery extends PickType(PageQueryDto, ['page', 'pageSize'] as const) {
  @ApiPropertyOptional({ format: 'uuid' })
  @IsOptional()
  @IsUUID('all', { message: 'rosterPeriodId must be a roster period id' })
  rosterPeriodId?: string;

  @ApiPropertyOptional({
    description: 'Staff: every open shift, with mayTake and whyNot (default: only those the caller may take)',
  })
  @IsOptional()
  @Transform(({ value }: { value: unknown }) => (value === 'true' ? true : value === 'false' ? false : value))
  @IsBoolean({ message: 'withBlocked must be true or false' })
  withBlocked?: boolean;
}

export class NotifyOpenShiftBody implements NotifyOpenShiftDto {
  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'rosterPeriodId must be a roster period id' })
  rosterPeriodId!: string;

  @ApiProperty({ example: '2027-01-04' })
  @IsIsoDate()
  date!: string;

  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'shiftTypeId must be a shift type id' })
  shiftTypeId!: string;

  @ApiProperty({ format: 'uuid', nullable: true, type: String })
  @ValidateIf((_o, v) => v !== null)
  @IsUUID('all', { message: 'skillId must be a skill id or null' })
  skillId!: string | null;
}

export class NotifyOpenShiftResponse implements NotifyOpenShiftResultDto {
  @ApiProperty({ description: 'People e-mailed' }) notified!: number;
}

export class ClaimOpenShiftBody implements ClaimOpenShiftDto {
  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'rosterPeriodId must be a roster period id' })
  rosterPeriodId!: string;

  @ApiProperty({ example: '2027-01-04' })
  @IsIsoDate()
  date!: string;

  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'shiftTypeId must be a shift type id' })
  shiftTypeId!: string;

  @ApiProperty({ format: 'uuid', nullable: true, type: String })
  @ValidateIf((_o, v) => v !== null)
  @IsUUID('all', { message: 'skillId must be a skill id or null' })
  skillId!: string | null;

  @ApiPropertyOptional({ maxLength: 500 })
  @IsOptional()
  @IsString()
  @MaxLength(500, { message: 'note must be at most 500 characters' })
  note?: string;
}

class OpenShiftResponse implements OpenShiftDto {
  @ApiProperty({ format: 'uuid' }) rosterPeriodId!: string;
  @ApiProperty({ format: 'uuid' }) unitId!: string;
  @ApiProperty({ example: '2030-01-08' }) date!: string;
  @ApiProperty({ format: 'uuid' }) shiftTypeId!: string;
  @ApiProperty() shiftCode!: string;
  @ApiProperty() shiftName!: string;
  @ApiProperty({ example: '07:00' }) start!: string;
  @ApiProperty({ example: '15:00' }) end!: string;
  @ApiProperty({ format: 'uuid', nullable: true, type: String }) skillId!: string | null;
  @ApiProperty({ nullable: true, type: String }) skillCode!: string | null;
  @ApiProperty({ description: 'People still wanted' }) short!: number;
  @ApiProperty({ description: 'People short of the minimum (0: only the target is unmet)' })
  belowMinimum!: number;
  @ApiPropertyOptional({ description: 'withBlocked only: whether the caller may take it' }) mayTake?: boolean;
  @ApiPropertyOptional({ type: [String], description: 'withBlocked only: why the caller may not take it' })
  whyNot?: string[];
  @ApiProperty({ description: 'Claims waiting for a manager' }) pendingClaims!: number;
  @ApiPropertyOptional({
    type: OutsideOfferResponse,
    nullable: true,
    description: 'The current offer to bank or agency staff outside the roster (staff: its state only)',
  })
  outsideOffer?: OutsideOfferResponse | null;
  @ApiPropertyOptional({
    type: RedFlagResponse,
    nullable: true,
    description: 'A red flag of safe staffing (NICE SG1 2014) when the skill is registered',
  })
  redFlag?: RedFlagResponse | null;
}

export class OpenShiftPageResponse implements Page<OpenShiftDto> {
  @ApiProperty({ type: [OpenShiftResponse] }) items!: OpenShiftResponse[];
  @ApiProperty() total!: number;
  @ApiProperty() page!: number;
  @ApiProperty() pageSize!: number;
}
