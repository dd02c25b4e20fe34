import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import {
  type CandidateDto,
  type CreateOutsideOfferDto,
  type FillOutsideOfferDto,
  OUTSIDE_OFFER_NOTE_MAX_LENGTH,
  OUTSIDE_OFFER_STATUSES,
  OUTSIDE_OFFER_TO_MAX_LENGTH,
  type OutsideOfferDto,
  type OutsideOfferStatus,
  type RuleBreakDto,
  type WhatItWouldTakeDto,
  type WhatItWouldTakeQuery,
} from '@rotaplex/contracts';
import { Transform } from 'class-transformer';
import {
  IsInt,
  IsNotEmpty,
  IsOptional,
  IsString,
  IsUUID,
  Max,
  MaxLength,
  Min,
  ValidateIf,
} from 'class-validator';
import { IsIsoDate } from '../../common/decorators/is-iso-date.decorator';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);

/** One open shift of a published period: period, date, shift type and skill (empty: anyone). */
export class WhatItWouldTakeQueryDto implements WhatItWouldTakeQuery {
  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'rosterPeriodId must be a roster period id' })
  rosterPeriodId!: string;

  @ApiProperty({ example: '2027-01-04' })
  @IsIsoDate()
  date!: string;

  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'shiftTypeId must be a shift type id' })
  shiftTypeId!: string;

  @ApiPropertyOptional({ format: 'uuid', description: 'Omitted or empty: a need open to anyone' })
  @IsOptional()
  @ValidateIf((_o, v) => v !== '')
  @IsUUID('all', { message: 'skillId must be a skill id, or empty for anyone' })
  skillId?: string;
}

export class CreateOutsideOfferBody implements CreateOutsideOfferDto {
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

  @ApiProperty({ maxLength: OUTSIDE_OFFER_TO_MAX_LENGTH, example: 'Staff bank office' })
  @Transform(trim)
  @IsString({ message: 'offeredTo must be text' })
  @IsNotEmpty({ message: 'offeredTo must say to whom (a bank office, an agency)' })
  @MaxLength(OUTSIDE_OFFER_TO_MAX_LENGTH, {
    message: `offeredTo must be at most ${OUTSIDE_OFFER_TO_MAX_LENGTH} characters`,
  })
  offeredTo!: string;

  @ApiPropertyOptional({ maxLength: OUTSIDE_OFFER_NOTE_MAX_LENGTH })
  @IsOptional()
  @IsString({ message: 'note must be text' })
  @MaxLength(OUTSIDE_OFFER_NOTE_MAX_LENGTH, {
    message: `note must be at most ${OUTSIDE_OFFER_NOTE_MAX_LENGTH} characters`,
  })
  note?: string;
}

export class FillOutsideOfferBody implements FillOutsideOfferDto {
  @ApiPropertyOptional({ minimum: 1, maximum: 99, description: 'Default: every person still wanted' })
  @IsOptional()
  @IsInt({ message: 'people must be a whole number' })
  @Min(1, { message: 'people must be at least 1' })
  @Max(99, { message: 'people must be at most 99' })
  people?: number;
}

export class OutsideOfferResponse implements OutsideOfferDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
  @ApiProperty({ format: 'uuid' }) rosterPeriodId!: string;
  @ApiProperty({ example: '2027-01-04' }) date!: string;
  @ApiProperty({ format: 'uuid' }) shiftTypeId!: string;
  @ApiProperty({ format: 'uuid', nullable: true, type: String }) skillId!: string | null;
  @ApiProperty({ description: 'Empty for staff' }) offeredTo!: string;
  @ApiProperty({ nullable: true, type: String, description: 'Null for staff' }) note!: string | null;
  @ApiProperty({ enum: OUTSIDE_OFFER_STATUSES }) status!: OutsideOfferStatus;
  @ApiProperty({ nullable: true, type: Number }) people!: number | null;
  @ApiProperty({ description: 'Empty for staff' }) offeredByName!: string;
  @ApiProperty() offeredAt!: string;
  @ApiProperty() updatedAt!: string;
}

class RuleBreakResponse implements RuleBreakDto {
  @ApiProperty({ example: 'minRest' }) rule!: string;
  @ApiProperty({ description: 'A rule whose breach by a manual edit needs a written reason' })
  serious!: boolean;
  @ApiProperty() words!: string;
}

class CandidateResponse implements CandidateDto {
  @ApiProperty({ format: 'uuid' }) staffMemberId!: string;
  @ApiProperty() name!: string;
  @ApiProperty({ type: [RuleBreakResponse] }) breaks!: RuleBreakResponse[];
  @ApiProperty({ nullable: true, type: String }) alreadyWorks!: string | null;
}

export class WhatItWouldTakeResponse implements WhatItWouldTakeDto {
  @ApiProperty({ format: 'uuid' }) rosterPeriodId!: string;
  @ApiProperty() date!: string;
  @ApiProperty({ format: 'uuid' }) shiftTypeId!: string;
  @ApiProperty({ format: 'uuid', nullable: true, type: String }) skillId!: string | null;
  @ApiProperty({ type: [CandidateResponse] }) candidates!: CandidateResponse[];
  @ApiProperty() absent!: number;
  @ApiProperty({ type: [String] }) cautions!: string[];
  @ApiProperty() howToChange!: string;
}
