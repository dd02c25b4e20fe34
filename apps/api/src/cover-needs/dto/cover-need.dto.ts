import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import {
  type CoverNeedsDto,
  type CoverOverrideDto,
  type CoverPatternRowDto,
  type CreateCoverOverrideRequest,
  type ReplaceCoverPatternRequest,
} from '@rotaplex/contracts';
import { Transform, Type } from 'class-transformer';
import {
  ArrayMaxSize,
  IsArray,
  IsBoolean,
  IsInt,
  IsOptional,
  IsUUID,
  Max,
  Min,
  ValidateIf,
  ValidateNested,
} from 'class-validator';
import { IsIsoDate } from '../../common/decorators/is-iso-date.decorator';

const DATE = /^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/;

class NeedFieldsDto {
  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'shiftTypeId must be a shift type id' })
  shiftTypeId!: string;

  @ApiProperty({ format: 'uuid', nullable: true, type: String, description: 'null: anyone on the shift' })
  @ValidateIf((_o, v) => v !== null)
  @IsUUID('all', { message: 'skillId must be a skill id or null' })
  skillId!: string | null;

  @ApiProperty({ minimum: 0, maximum: 500 })
  @IsInt()
  @Min(0)
  @Max(500)
  min!: number;

  @ApiProperty({ minimum: 0, maximum: 500, description: 'At least min' })
  @IsInt()
  @Min(0)
  @Max(500)
  target!: number;
}

export class CoverPatternRowBody extends NeedFieldsDto implements CoverPatternRowDto {
  @ApiProperty({ minimum: 0, maximum: 6, description: '0 = Sunday … 6 = Saturday' })
  @IsInt()
  @Min(0)
  @Max(6)
  weekday!: number;
}

export class ReplaceCoverPatternDto implements ReplaceCoverPatternRequest {
  @ApiProperty({ type: [CoverPatternRowBody] })
  @IsArray()
  @ArrayMaxSize(2000)
  @ValidateNested({ each: true })
  @Type(() => CoverPatternRowBody)
  rows!: CoverPatternRowBody[];
}

export class CreateCoverOverrideDto extends NeedFieldsDto implements CreateCoverOverrideRequest {
  @ApiProperty({ example: '2026-12-25' })
  @IsIsoDate()
  date!: string;
}

export class CoverImportQueryDto {
  @ApiPropertyOptional({ default: false })
  @IsOptional()
  @Transform(({ value }: { value: unknown }) => (value === 'true' ? true : value === 'false' ? false : value))
  @IsBoolean({ message: 'dryRun must be true or false' })
  dryRun: boolean = false;
}

export class CoverPatternRowResponse implements CoverPatternRowDto {
  @ApiProperty() weekday!: number;
  @ApiProperty({ format: 'uuid' }) shiftTypeId!: string;
  @ApiProperty({ format: 'uuid', nullable: true, type: String }) skillId!: string | null;
  @ApiProperty() min!: number;
  @ApiProperty() target!: number;
}

export class CoverOverrideResponse implements CoverOverrideDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
  @ApiProperty() date!: string;
  @ApiProperty({ format: 'uuid' }) shiftTypeId!: string;
  @ApiProperty({ format: 'uuid', nullable: true, type: String }) skillId!: string | null;
  @ApiProperty() min!: number;
  @ApiProperty() target!: number;
  @ApiProperty({
    type: [String],
    required: false,
    description: 'After a write: the caution when a minimum above 0 became 0',
  })
  cautions?: string[];
}

export class CoverNeedsResponse implements CoverNeedsDto {
  @ApiProperty({ format: 'uuid' }) unitId!: string;
  @ApiProperty({ type: [CoverPatternRowResponse] }) pattern!: CoverPatternRowResponse[];
  @ApiProperty({ type: [CoverOverrideResponse] }) overrides!: CoverOverrideResponse[];
  @ApiProperty({
    type: [String],
    required: false,
    description: 'After a write: minimums above 0 that became 0, each with its caution',
  })
  cautions?: string[];
}

export { DATE as DATE_PATTERN };
