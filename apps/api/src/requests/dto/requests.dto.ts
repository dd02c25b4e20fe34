import { ApiProperty, ApiPropertyOptional, PickType } from '@nestjs/swagger';
import {
  AVAILABILITY_STATUSES,
  type AvailabilityCellDto,
  type AvailabilityStatus,
  type CreateDateRequestRequest,
  type CreateLeaveRequest,
  DATE_REQUEST_KINDS,
  type DateRequestKind,
  type DateRequestListQuery,
  DAY_PARTS,
  type DayPart,
  type DecideLeaveRequest,
  LEAVE_STATUSES,
  LEAVE_TYPES,
  type LeaveStatus,
  type LeaveType,
  MAX_PAGE_SIZE,
  MAX_REQUEST_LIMIT,
  type MyRequestsQuery,
  REQUEST_NOTE_MAX_LENGTH,
  REQUEST_ROW_STATUSES,
  REQUEST_ROW_TYPES,
  REQUEST_SORT_FIELDS,
  type ReplaceAvailabilityRequest,
  type RequestListQuery,
  type RequestRowStatus,
  type RequestRowType,
  type RequestSortField,
  type UpdateDateRequestRequest,
  type UpdateRequestLimitRequest,
} from '@rotaplex/contracts';
import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  IsArray,
  IsIn,
  IsInt,
  IsOptional,
  IsString,
  IsUUID,
  Max,
  MaxLength,
  Min,
  ValidateNested,
} from 'class-validator';
import { PageQueryDto } from '../../common/pagination';
import { IsIsoDate } from '../../common/decorators/is-iso-date.decorator';

const oneOf = (field: string, values: readonly string[]) => ({
  message: `${field} must be one of ${values.join(', ')}`,
});

export class AvailabilityCellBody implements AvailabilityCellDto {
  @ApiProperty({ minimum: 0, maximum: 6, description: '0 = Sunday … 6 = Saturday' })
  @IsInt({ message: 'weekday must be a whole number 0-6 (0 = Sunday)' })
  @Min(0, { message: 'weekday must be a whole number 0-6 (0 = Sunday)' })
  @Max(6, { message: 'weekday must be a whole number 0-6 (0 = Sunday)' })
  weekday!: number;

  @ApiProperty({ enum: DAY_PARTS })
  @IsIn(DAY_PARTS, oneOf('part', DAY_PARTS))
  part!: DayPart;

  @ApiProperty({ enum: AVAILABILITY_STATUSES })
  @IsIn(AVAILABILITY_STATUSES, oneOf('status', AVAILABILITY_STATUSES))
  status!: AvailabilityStatus;
}

export class ReplaceAvailabilityDto implements ReplaceAvailabilityRequest {
  @ApiProperty({ type: [AvailabilityCellBody] })
  @IsArray({ message: 'cells must be an array' })
  @ArrayMaxSize(7 * DAY_PARTS.length)
  @ValidateNested({ each: true })
  @Type(() => AvailabilityCellBody)
  cells!: AvailabilityCellBody[];
}

export class CreateDateRequestDto implements CreateDateRequestRequest {
  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'rosterPeriodId must be a roster period id' })
  rosterPeriodId!: string;

  @ApiProperty({ example: '2030-01-08' })
  @IsIsoDate()
  date!: string;

  @ApiProperty({ enum: DATE_REQUEST_KINDS })
  @IsIn(DATE_REQUEST_KINDS, oneOf('kind', DATE_REQUEST_KINDS))
  kind!: DateRequestKind;

  @ApiPropertyOptional({ format: 'uuid', nullable: true, description: 'Required for shiftOn and shiftOff' })
  @IsOptional()
  @IsUUID('all', { message: 'shiftTypeId must be a shift type id' })
  shiftTypeId?: string | null;

  @ApiPropertyOptional({ maxLength: REQUEST_NOTE_MAX_LENGTH, nullable: true })
  @IsOptional()
  @IsString({ message: 'note must be text' })
  @MaxLength(REQUEST_NOTE_MAX_LENGTH, {
    message: `note must be at most ${REQUEST_NOTE_MAX_LENGTH} characters`,
  })
  note?: string | null;
}

export class UpdateDateRequestDto implements UpdateDateRequestRequest {
  @ApiPropertyOptional({ example: '2030-01-08' })
  @IsOptional()
  @IsIsoDate()
  date?: string;

  @ApiPropertyOptional({ enum: DATE_REQUEST_KINDS })
  @IsOptional()
  @IsIn(DATE_REQUEST_KINDS, oneOf('kind', DATE_REQUEST_KINDS))
  kind?: DateRequestKind;

  @ApiPropertyOptional({ format: 'uuid', nullable: true })
  @IsOptional()
  @IsUUID('all', { message: 'shiftTypeId must be a shift type id' })
  shiftTypeId?: string | null;

  @ApiPropertyOptional({ maxLength: REQUEST_NOTE_MAX_LENGTH, nullable: true })
  @IsOptional()
  @IsString({ message: 'note must be text' })
  @MaxLength(REQUEST_NOTE_MAX_LENGTH, {
    message: `note must be at most ${REQUEST_NOTE_MAX_LENGTH} characters`,
  })
  note?: string | null;
}

/**
 * GET /me/requests: page (from 1) and pageSize (1 to MAX_PAGE_SIZE); the page size defaults to
 * MAX_PAGE_SIZE, so one read usually holds everything the page shows.
 */
export class MyRequestsQueryDto extends PickType(PageQueryDto, ['page'] as const) implements MyRequestsQuery {
  @ApiPropertyOptional({ minimum: 1, maximum: MAX_PAGE_SIZE, default: MAX_PAGE_SIZE })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: `pageSize must be a whole number from 1 to ${MAX_PAGE_SIZE}` })
  @Min(1, { message: `pageSize must be a whole number from 1 to ${MAX_PAGE_SIZE}` })
  @Max(MAX_PAGE_SIZE, { message: `pageSize must be a whole number from 1 to ${MAX_PAGE_SIZE}` })
  pageSize: number = MAX_PAGE_SIZE;
}

/** Filters, page (from 1) and pageSize (1 to MAX_PAGE_SIZE, default 20); by date, oldest first. */
export class DateRequestQueryDto
  extends PickType(PageQueryDto, ['page', 'pageSize'] as const)
  implements DateRequestListQuery
{
  @ApiPropertyOptional({ format: 'uuid' })
  @IsOptional()
  @IsUUID('all', { message: 'rosterPeriodId must be a roster period id' })
  rosterPeriodId?: string;

  @ApiPropertyOptional({ format: 'uuid' })
  @IsOptional()
  @IsUUID('all', { message: 'unitId must be a unit id' })
  unitId?: string;

  @ApiPropertyOptional({ format: 'uuid' })
  @IsOptional()
  @IsUUID('all', { message: 'staffMemberId must be a staff member id' })
  staffMemberId?: string;
}

export class CreateLeaveDto implements CreateLeaveRequest {
  @ApiPropertyOptional({ format: 'uuid', description: 'Needed only when you are on more than one roster' })
  @IsOptional()
  @IsUUID('all', { message: 'staffMemberId must be a staff member id' })
  staffMemberId?: string;

  @ApiProperty({ example: '2030-01-08' })
  @IsIsoDate()
  startDate!: string;

  @ApiProperty({ example: '2030-01-10', description: 'Last day of leave (inclusive)' })
  @IsIsoDate()
  endDate!: string;

  @ApiProperty({ enum: LEAVE_TYPES })
  @IsIn(LEAVE_TYPES, oneOf('type', LEAVE_TYPES))
  type!: LeaveType;

  @ApiPropertyOptional({ maxLength: REQUEST_NOTE_MAX_LENGTH, nullable: true })
  @IsOptional()
  @IsString({ message: 'note must be text' })
  @MaxLength(REQUEST_NOTE_MAX_LENGTH, {
    message: `note must be at most ${REQUEST_NOTE_MAX_LENGTH} characters`,
  })
  note?: string | null;
}

export class DecideLeaveDto implements DecideLeaveRequest {
  @ApiPropertyOptional({ maxLength: REQUEST_NOTE_MAX_LENGTH, nullable: true })
  @IsOptional()
  @IsString({ message: 'note must be text' })
  @MaxLength(REQUEST_NOTE_MAX_LENGTH, {
    message: `note must be at most ${REQUEST_NOTE_MAX_LENGTH} characters`,
  })
  note?: string | null;
}

/** Filters, page (from 1) and pageSize (1 to MAX_PAGE_SIZE, default 20); by first day, oldest first. */
export class LeaveQueryDto extends PickType(PageQueryDto, ['page', 'pageSize'] as const) {
  @ApiPropertyOptional({ format: 'uuid' })
  @IsOptional()
  @IsUUID('all', { message: 'unitId must be a unit id' })
  unitId?: string;

  @ApiPropertyOptional({ format: 'uuid' })
  @IsOptional()
  @IsUUID('all', { message: 'staffMemberId must be a staff member id' })
  staffMemberId?: string;

  @ApiPropertyOptional({ enum: LEAVE_STATUSES })
  @IsOptional()
  @IsIn(LEAVE_STATUSES, oneOf('status', LEAVE_STATUSES))
  status?: LeaveStatus;
}

export class UpdateRequestLimitDto implements UpdateRequestLimitRequest {
  @ApiProperty({ minimum: 0, maximum: MAX_REQUEST_LIMIT })
  @IsInt({ message: 'requestLimit must be a whole number' })
  @Min(0, { message: 'requestLimit must be at least 0' })
  @Max(MAX_REQUEST_LIMIT, { message: `requestLimit must be at most ${MAX_REQUEST_LIMIT}` })
  requestLimit!: number;
}

export class RequestListQueryDto extends PageQueryDto implements RequestListQuery {
  @ApiPropertyOptional({ enum: REQUEST_SORT_FIELDS, default: 'startDate' })
  @IsOptional()
  @IsIn(REQUEST_SORT_FIELDS, oneOf('sort', REQUEST_SORT_FIELDS))
  sort?: RequestSortField;

  @ApiPropertyOptional({ format: 'uuid' })
  @IsOptional()
  @IsUUID('all', { message: 'unitId must be a unit id' })
  unitId?: string;

  @ApiPropertyOptional({ format: 'uuid' })
  @IsOptional()
  @IsUUID('all', { message: 'rosterPeriodId must be a roster period id' })
  rosterPeriodId?: string;

  @ApiPropertyOptional({ enum: REQUEST_ROW_STATUSES })
  @IsOptional()
  @IsIn(REQUEST_ROW_STATUSES, oneOf('status', REQUEST_ROW_STATUSES))
  status?: RequestRowStatus;

  @ApiPropertyOptional({ enum: REQUEST_ROW_TYPES })
  @IsOptional()
  @IsIn(REQUEST_ROW_TYPES, oneOf('type', REQUEST_ROW_TYPES))
  type?: RequestRowType;
}
