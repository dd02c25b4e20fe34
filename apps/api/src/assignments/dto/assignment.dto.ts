import { ApiProperty } from '@nestjs/swagger';
import {
  type AssignmentCellRequest,
  type AssignmentGridDto,
  type AssignmentRowDto,
  type PinCellRequest,
  type RosterCheckDto,
  type RosterViolationDto,
} from '@rotaplex/contracts';
import { IsUUID, Matches, ValidateIf } from 'class-validator';

const DATE = /^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/;

export class PinCellDto implements PinCellRequest {
  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'staffMemberId must be a staff member id' })
  staffMemberId!: string;

  @ApiProperty({ example: '2027-01-04', description: 'A day of the period, YYYY-MM-DD' })
  @Matches(DATE, { message: 'date must be a date YYYY-MM-DD' })
  date!: string;
}

export class AssignmentCellDto extends PinCellDto implements AssignmentCellRequest {
  @ApiProperty({ format: 'uuid', nullable: true, description: 'Shift type id, or null for a day off' })
  @ValidateIf((_o, v) => v !== null)
  @IsUUID('all', { message: 'shiftTypeId must be a shift type id or null' })
  shiftTypeId!: string | null;
}

class ViolationResponse implements RosterViolationDto {
  @ApiProperty() rule!: string;
  @ApiProperty() staffMemberId!: string;
  @ApiProperty({ type: [String] }) dates!: string[];
  @ApiProperty() message!: string;
  @ApiProperty({ nullable: true, type: String }) warning!: string | null;
}

class CheckResponse implements RosterCheckDto {
  @ApiProperty({ type: [ViolationResponse] }) violations!: ViolationResponse[];
  @ApiProperty({ type: 'object', additionalProperties: { type: 'number' } }) terms!: Record<string, number>;
  @ApiProperty() objective!: number;
}

class CellResponse {
  @ApiProperty({ nullable: true, type: String }) shiftTypeId!: string | null;
  @ApiProperty() pinned!: boolean;
}

class RowResponse implements AssignmentRowDto {
  @ApiProperty() staffMemberId!: string;
  @ApiProperty() name!: string;
  @ApiProperty({ type: [CellResponse] }) cells!: CellResponse[];
}

export class AssignmentGridResponse implements AssignmentGridDto {
  @ApiProperty() rosterPeriodId!: string;
  @ApiProperty({ type: [String] }) dates!: string[];
  @ApiProperty({ type: [RowResponse] }) rows!: RowResponse[];
  @ApiProperty({ type: CheckResponse }) check!: CheckResponse;
}
