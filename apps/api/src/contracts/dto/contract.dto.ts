import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import {
  type ContractDto,
  type ContractPresetDto,
  type ContractRules,
  type CreateContractRequest,
  SHIFT_CODE_PATTERN,
  type UpdateContractRequest,
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
  ValidateBy,
  ValidateIf,
  type ValidationOptions,
} from 'class-validator';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);
const WEEK_MINUTES = 7 * 1440;

/** An object of shift type code → whole number 0-7 (shifts per week). */
function IsShiftCountMap(options?: ValidationOptions): PropertyDecorator {
  return ValidateBy(
    {
      name: 'isShiftCountMap',
      validator: {
        validate: (value: unknown) =>
          typeof value === 'object' &&
          value !== null &&
          !Array.isArray(value) &&
          Object.entries(value).every(
            ([k, v]) => SHIFT_CODE_PATTERN.test(k) && Number.isInteger(v) && (v as number) >= 0 && v <= 7,
          ),
        defaultMessage: () =>
          'maxShiftsPerType must map shift type codes (1-4 upper-case letters or digits) to whole numbers 0-7 per week',
      },
    },
    options,
  );
}

/** Optional nullable whole number in [min, max]. */
function Rule(min: number, max: number, description: string): PropertyDecorator {
  const decorators = [
    ApiPropertyOptional({ type: Number, nullable: true, minimum: min, maximum: max, description }),
    IsOptional(),
    ValidateIf((_o: object, v: unknown) => v !== null),
    IsInt(),
    Min(min),
    Max(max),
  ];
  return (target, key) => decorators.forEach((d) => d(target, key));
}

/** The rules part shared by create and update. */
export class ContractRulesDto implements Partial<ContractRules> {
  @ApiPropertyOptional({
    type: 'object',
    additionalProperties: { type: 'integer', minimum: 0, maximum: 7 },
    nullable: true,
    example: { N: 4 },
    description: 'Max shifts per week of each shift type code',
  })
  @IsOptional()
  @ValidateIf((_o, v) => v !== null)
  @IsShiftCountMap()
  maxShiftsPerType?: Record<string, number> | null;

  @Rule(0, WEEK_MINUTES, 'Min paid minutes per week') minPaidMinutes?: number | null;
  @Rule(0, WEEK_MINUTES, 'Max paid minutes per week') maxPaidMinutes?: number | null;
  @Rule(0, WEEK_MINUTES, 'Contracted paid minutes per week') targetPaidMinutes?: number | null;
  @Rule(1, 84, 'Max working days in a row') maxConsecutiveWorkDays?: number | null;
  @Rule(1, 84, 'Min working days in a row') minConsecutiveWorkDays?: number | null;
  @Rule(1, 84, 'Min days off in a row') minConsecutiveDaysOff?: number | null;
  @Rule(0, 4, 'Max weekends worked per 4 weeks') maxWeekends?: number | null;
  @Rule(0, 84, 'Max night shifts in a row') maxConsecutiveNights?: number | null;
  @Rule(0, 2880, 'Min rest in minutes between shifts') minRestMinutes?: number | null;
}

export class CreateContractDto extends ContractRulesDto implements CreateContractRequest {
  @ApiPropertyOptional({
    format: 'uuid',
    nullable: true,
    description: 'null or absent: the whole organisation',
  })
  @IsOptional()
  @ValidateIf((_o, v) => v !== null)
  @IsUUID('all', { message: 'unitId must be a unit id' })
  unitId?: string | null;

  @ApiProperty({ example: 'Full-time 37.5 h', maxLength: 200 })
  @Transform(trim)
  @IsString()
  @IsNotEmpty()
  @MaxLength(200)
  name!: string;
}

export class UpdateContractDto extends ContractRulesDto implements UpdateContractRequest {
  @ApiPropertyOptional({ maxLength: 200 })
  @IsOptional()
  @Transform(trim)
  @IsString()
  @IsNotEmpty()
  @MaxLength(200)
  name?: string;
}

export class ContractQueryDto {
  @ApiPropertyOptional({ format: 'uuid', description: 'Only this unit and the organisation-wide contracts' })
  @IsOptional()
  @IsUUID('all', { message: 'unitId must be a unit id' })
  unitId?: string;
}

class ContractRulesResponse implements ContractRules {
  @ApiProperty({ type: 'object', additionalProperties: { type: 'integer' }, nullable: true })
  maxShiftsPerType!: Record<string, number> | null;
  @ApiProperty({ type: Number, nullable: true }) minPaidMinutes!: number | null;
  @ApiProperty({ type: Number, nullable: true }) maxPaidMinutes!: number | null;
  @ApiProperty({ type: Number, nullable: true }) targetPaidMinutes!: number | null;
  @ApiProperty({ type: Number, nullable: true }) maxConsecutiveWorkDays!: number | null;
  @ApiProperty({ type: Number, nullable: true }) minConsecutiveWorkDays!: number | null;
  @ApiProperty({ type: Number, nullable: true }) minConsecutiveDaysOff!: number | null;
  @ApiProperty({ type: Number, nullable: true }) maxWeekends!: number | null;
  @ApiProperty({ type: Number, nullable: true }) maxConsecutiveNights!: number | null;
  @ApiProperty({ type: Number, nullable: true }) minRestMinutes!: number | null;
}

export class ContractResponse extends ContractRulesResponse implements ContractDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
  @ApiProperty({ format: 'uuid', nullable: true, type: String }) unitId!: string | null;
  @ApiProperty() name!: string;
  @ApiProperty({
    type: [String],
    description: 'Limits beyond the working-time presets, each naming its risk (empty: within them)',
  })
  cautions!: string[];
}

export class ContractPresetResponse implements ContractPresetDto {
  @ApiProperty() key!: string;
  @ApiProperty() name!: string;
  @ApiProperty() basis!: string;
  @ApiProperty({ type: ContractRulesResponse }) rules!: ContractRules;
  @ApiProperty() caution!: string;
}
