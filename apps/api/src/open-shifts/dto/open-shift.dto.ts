import { ApiProperty, ApiPropertyOptional, PickType } from '@nestjs/swagger';
import { type ClaimOpenShiftDto, type OpenShiftDto, type Page } from '@rotaplex/contracts';
import { IsOptional, IsString, IsUUID, MaxLength, ValidateIf } from 'class-validator';
import { IsIsoDate } from '../../common/decorators/is-iso-date.decorator';
import { PageQueryDto } from '../../common/pagination';

/** page (from 1), pageSize (1 to MAX_PAGE_SIZE, default 20) and an optional period. */
export class OpenShiftQuery extends PickType(PageQueryDto, ['page', 'pageSize'] as const) {
  @ApiPropertyOptional({ format: 'uuid' })
  @IsOptional()
  @IsUUID('all', { message: 'rosterPeriodId must be a roster period id' })
  rosterPeriodId?: string;
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
  @ApiProperty({ description: 'Claims waiting for a manager' }) pendingClaims!: number;
}

export class OpenShiftPageResponse implements Page<OpenShiftDto> {
  @ApiProperty({ type: [OpenShiftResponse] }) items!: OpenShiftResponse[];
  @ApiProperty() total!: number;
  @ApiProperty() page!: number;
  @ApiProperty() pageSize!: number;
}
