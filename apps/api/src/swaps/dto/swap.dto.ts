import { ApiProperty, ApiPropertyOptional, PickType } from '@nestjs/swagger';
import {
  type ProposeSwapDto,
  SWAP_STATUSES,
  type SwapDecisionDto,
  type SwapLinkDecisionDto,
  type SwapStatus,
} from '@rotaplex/contracts';
import { Transform } from 'class-transformer';
import { IsBoolean, IsIn, IsOptional, IsString, IsUUID, Length, MaxLength } from 'class-validator';
import { IsIsoDate } from '../../common/decorators/is-iso-date.decorator';
import { PageQueryDto } from '../../common/pagination';

export class ProposeSwapBody implements ProposeSwapDto {
  @ApiProperty({ enum: ['swap', 'offer'], description: 'swap: exchange shifts; offer: give my shift away' })
  @IsIn(['swap', 'offer'], { message: 'kind must be swap or offer' })
  kind!: 'swap' | 'offer';

  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'rosterPeriodId must be a roster period id' })
  rosterPeriodId!: string;

  @ApiProperty({ example: '2027-01-04', description: 'My working day to give or exchange' })
  @IsIsoDate()
  myDate!: string;

  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'colleagueStaffMemberId must be a staff member id' })
  colleagueStaffMemberId!: string;

  @ApiPropertyOptional({ example: '2027-01-06', description: "Swap only: the colleague's day I take" })
  @IsOptional()
  @IsIsoDate()
  theirDate?: string;

  @ApiPropertyOptional({ maxLength: 500 })
  @IsOptional()
  @IsString()
  @MaxLength(500, { message: 'note must be at most 500 characters' })
  note?: string;
}

export class SwapDecisionBody implements SwapDecisionDto {
  @ApiProperty({ enum: ['accept', 'decline', 'approve', 'refuse'] })
  @IsIn(['accept', 'decline', 'approve', 'refuse'], {
    message: 'decision must be one of accept, decline, approve, refuse',
  })
  decision!: SwapDecisionDto['decision'];

  @ApiPropertyOptional({ maxLength: 500 })
  @IsOptional()
  @IsString()
  @MaxLength(500, { message: 'reason must be at most 500 characters' })
  reason?: string;
}

export class SwapLinkDecisionBody extends SwapDecisionBody implements SwapLinkDecisionDto {
  @ApiProperty({ description: 'The token from the e-mailed link' })
  @IsString()
  @Length(1, 200, { message: 'token must be the token from the e-mailed link' })
  token!: string;
}

export class SwapLinkQuery {
  @ApiProperty()
  @IsString()
  @Length(1, 200, { message: 'token must be the token from the e-mailed link' })
  token!: string;
}

/** page (from 1), pageSize (1 to MAX_PAGE_SIZE, default 20) and filters; newest first. */
export class SwapListQuery extends PickType(PageQueryDto, ['page', 'pageSize'] as const) {
  @ApiPropertyOptional({ enum: SWAP_STATUSES })
  @IsOptional()
  @IsIn(SWAP_STATUSES, { message: `status must be one of ${SWAP_STATUSES.join(', ')}` })
  status?: SwapStatus;

  @ApiPropertyOptional({
    type: Boolean,
    description:
      'Only requests waiting for the caller: staff, those they are asked to accept; managers, those they may approve',
  })
  @IsOptional()
  @Transform(({ value }: { value: unknown }) => (value === 'true' ? true : value === 'false' ? false : value))
  @IsBoolean({ message: 'waitingForMe must be true or false' })
  waitingForMe?: boolean;
}

export class SwapOptionsQuery {
  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'rosterPeriodId must be a roster period id' })
  rosterPeriodId!: string;
}
