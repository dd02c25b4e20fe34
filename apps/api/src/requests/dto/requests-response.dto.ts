import { ApiProperty } from '@nestjs/swagger';
import {
  AVAILABILITY_STATUSES,
  type AvailabilityDto,
  type AvailabilityStatus,
  DATE_REQUEST_KINDS,
  type DateRequestDto,
  type DateRequestKind,
  DAY_PARTS,
  type DayPart,
  LEAVE_STATUSES,
  LEAVE_TYPES,
  type LeaveDto,
  type Page,
  type LeaveStatus,
  type LeaveType,
  type MyRequestsDto,
  type MyStaffMemberDto,
  type PeriodRequestsDto,
  REQUEST_ROW_STATUSES,
  REQUEST_ROW_TYPES,
  type RequestPage,
  type RequestPeriodDto,
  type RequestRowDto,
  type RequestRowStatus,
  type RequestRowType,
  ROSTER_PERIOD_STATUSES,
} from '@rotaplex/contracts';

/** Response shapes for the OpenAPI document (the types themselves live in @rotaplex/contracts). */
export class AvailabilityCellResponse {
  @ApiProperty({ minimum: 0, maximum: 6 }) weekday!: number;
  @ApiProperty({ enum: DAY_PARTS }) part!: DayPart;
  @ApiProperty({ enum: AVAILABILITY_STATUSES }) status!: AvailabilityStatus;
}

export class AvailabilityResponse implements AvailabilityDto {
  @ApiProperty({ format: 'uuid' }) staffMemberId!: string;
  @ApiProperty({ type: [AvailabilityCellResponse], description: 'Cells not listed are available' })
  cells!: AvailabilityCellResponse[];
}

export class DateRequestResponse implements DateRequestDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
  @ApiProperty({ format: 'uuid' }) rosterPeriodId!: string;
  @ApiProperty({ format: 'uuid' }) staffMemberId!: string;
  @ApiProperty() staffName!: string;
  @ApiProperty({ format: 'uuid' }) unitId!: string;
  @ApiProperty({ example: '2030-01-08' }) date!: string;
  @ApiProperty({ enum: DATE_REQUEST_KINDS }) kind!: DateRequestKind;
  @ApiProperty({ format: 'uuid', nullable: true, type: String }) shiftTypeId!: string | null;
  @ApiProperty({ nullable: true, type: String }) shiftTypeCode!: string | null;
  @ApiProperty({ nullable: true, type: String }) note!: string | null;
  @ApiProperty({ format: 'date-time' }) createdAt!: string;
}

export class LeaveResponse implements LeaveDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
  @ApiProperty({ format: 'uuid' }) staffMemberId!: string;
  @ApiProperty() staffName!: string;
  @ApiProperty({ format: 'uuid' }) unitId!: string;
  @ApiProperty({ example: '2030-01-08' }) startDate!: string;
  @ApiProperty({ example: '2030-01-10', description: 'Last day, inclusive' }) endDate!: string;
  @ApiProperty({ enum: LEAVE_TYPES }) type!: LeaveType;
  @ApiProperty({ enum: LEAVE_STATUSES }) status!: LeaveStatus;
  @ApiProperty({ nullable: true, type: String }) note!: string | null;
  @ApiProperty({ nullable: true, type: String }) decisionNote!: string | null;
  @ApiProperty({ nullable: true, type: String, format: 'date-time' }) decidedAt!: string | null;
  @ApiProperty({ nullable: true, type: String }) decidedBy!: string | null;
  @ApiProperty({ format: 'date-time' }) createdAt!: string;
}

export class RequestPeriodResponse implements RequestPeriodDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
  @ApiProperty({ format: 'uuid' }) unitId!: string;
  @ApiProperty() startDate!: string;
  @ApiProperty() days!: number;
  @ApiProperty({ enum: ROSTER_PERIOD_STATUSES }) status!: RequestPeriodDto['status'];
  @ApiProperty({ description: 'Date requests one staff member may make in this period' })
  requestLimit!: number;
}

export class MyStaffMemberResponse implements MyStaffMemberDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
  @ApiProperty() name!: string;
  @ApiProperty({ format: 'uuid' }) unitId!: string;
  @ApiProperty() unitName!: string;
  @ApiProperty({ example: 'Europe/London' }) timeZone!: string;
}

export class MyRequestsResponse implements MyRequestsDto {
  @ApiProperty({ type: [MyStaffMemberResponse] }) staffMembers!: MyStaffMemberResponse[];
  @ApiProperty({ type: [RequestPeriodResponse] }) periods!: RequestPeriodResponse[];
  @ApiProperty({ type: [DateRequestResponse] }) dateRequests!: DateRequestResponse[];
  @ApiProperty({ type: [LeaveResponse] }) leave!: LeaveResponse[];
  @ApiProperty({ description: 'All date requests of the caller; dateRequests is one page of them' })
  dateRequestsTotal!: number;
  @ApiProperty({ description: 'All leave of the caller; leave is one page of it' }) leaveTotal!: number;
  @ApiProperty() page!: number;
  @ApiProperty() pageSize!: number;
}

export class PeriodRequestsResponse implements PeriodRequestsDto {
  @ApiProperty({ type: RequestPeriodResponse }) period!: RequestPeriodResponse;
  @ApiProperty({ type: [DateRequestResponse] }) dateRequests!: DateRequestResponse[];
  @ApiProperty({ type: [LeaveResponse], description: 'Leave of any status that overlaps the period' })
  leave!: LeaveResponse[];
  @ApiProperty({ type: [AvailabilityResponse] }) availability!: AvailabilityResponse[];
}

export class RequestRowResponse implements RequestRowDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
  @ApiProperty({ enum: REQUEST_ROW_TYPES }) type!: RequestRowType;
  @ApiProperty({ format: 'uuid' }) staffMemberId!: string;
  @ApiProperty() staffName!: string;
  @ApiProperty({ format: 'uuid' }) unitId!: string;
  @ApiProperty({ format: 'uuid', nullable: true, type: String }) rosterPeriodId!: string | null;
  @ApiProperty() startDate!: string;
  @ApiProperty() endDate!: string;
  @ApiProperty({ enum: [...DATE_REQUEST_KINDS, ...LEAVE_TYPES] }) kind!: DateRequestKind | LeaveType;
  @ApiProperty({ nullable: true, type: String }) shiftTypeCode!: string | null;
  @ApiProperty({ nullable: true, type: String }) note!: string | null;
  @ApiProperty({ enum: REQUEST_ROW_STATUSES }) status!: RequestRowStatus;
  @ApiProperty({ format: 'date-time' }) createdAt!: string;
}

export class RequestPageResponse implements RequestPage {
  @ApiProperty({ type: [RequestRowResponse] }) items!: RequestRowResponse[];
  @ApiProperty() total!: number;
  @ApiProperty() page!: number;
  @ApiProperty() pageSize!: number;
}

export class DateRequestPageResponse implements Page<DateRequestDto> {
  @ApiProperty({ type: [DateRequestResponse] }) items!: DateRequestResponse[];
  @ApiProperty() total!: number;
  @ApiProperty() page!: number;
  @ApiProperty() pageSize!: number;
}

export class LeavePageResponse implements Page<LeaveDto> {
  @ApiProperty({ type: [LeaveResponse] }) items!: LeaveResponse[];
  @ApiProperty() total!: number;
  @ApiProperty() page!: number;
  @ApiProperty() pageSize!: number;
}
