import { ApiProperty } from '@nestjs/swagger';
import {
  type AssignmentCellRequest,
  type AssignmentGridDto,
  type AssignmentRowDto,
  type PinCellRequest,
  type RosterCheckDto,
  type RosterViolationDto,
} from '@rotaplex/contracts';
import { OVERRIDE_REASON_MAX_LENGTH } from '@rotaplex/contracts';
import { IsOptional, IsString, IsUUID, MaxLength, ValidateIf } from 'class-validator';
import { IsIsoDate } from '../../common/decorators/is-iso-date.decorator';

export class PinCellDto implements PinCellRequest {
  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'staffMemberId must be a staff member id' })
  staffMemberId!: string;

  @ApiProperty({ example: '2027-01-04', description: 'A day of the period, YYYY-MM-DD' })
  @IsIsoDate()
  date!: string;
}

export class AssignmentCellDto extends PinCellDto implements AssignmentCellRequest {
  @ApiProperty({ format: 'uuid', nullable: true, description: 'Shift type id, or null for a day off' })
  @ValidateIf((_o, v) => v !== null)
  @IsUUID('all', { message: 'shiftTypeId must be a shift type id or null' })
  shiftTypeId!: string | null;

  @ApiProperty({
    required: false,
    maxLength: OVERRIDE_REASON_MAX_LENGTH,
    description: 'Why an edit that breaks a rest or working-time rule is kept; kept in the audit trail',
  })
  @IsOptional()
  @IsString({ message: 'overrideReason must be text' })
  @MaxLength(OVERRIDE_REASON_MAX_LENGTH, {
    message: `overrideReason must be at most ${OVERRIDE_REASON_MAX_LENGTH} characters`,
  })
  overrideReason?: string;
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
