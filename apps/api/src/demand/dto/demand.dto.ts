import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import {
  type AcceptDemandPlanRequest,
  type AcceptedCoverRowDto,
  type AcuityMixDto,
  type ContactCentreDemandDto,
  type ContactDateDto,
  type ContactIntervalDto,
  type ContactWeekdayDto,
  DEMAND_INTERVAL_MINUTES,
  DEMAND_LIMITS,
  type DemandIntervalMinutes,
  type PutUnitDemandRequest,
  type ServiceTargetDto,
  TIME_OF_DAY_PATTERN,
  type WardDemandDto,
  type WardPatientsDto,
  type WardRatioDto,
} from '@rotaplex/contracts';
import { Transform, Type } from 'class-transformer';
import {
  ArrayMaxSize,
  ArrayMinSize,
  IsArray,
  IsBoolean,
  IsIn,
  IsInt,
  IsNumber,
  IsObject,
  IsOptional,
  IsString,
  IsUUID,
  Matches,
  Max,
  MaxLength,
  Min,
  ValidateIf,
  ValidateNested,
} from 'class-validator';
import { IsIsoDate } from '../../common/decorators/is-iso-date.decorator';

const NUMBER = { allowNaN: false, allowInfinity: false, maxDecimalPlaces: 3 };

export class ServiceTargetBody implements ServiceTargetDto {
  @ApiProperty({ example: 80, minimum: 1, maximum: 99.9 })
  @IsNumber(NUMBER)
  @Min(1)
  @Max(99.9)
  targetPercent!: number;

  @ApiProperty({ example: 20, minimum: 0, maximum: DEMAND_LIMITS.maxTargetSeconds })
  @IsInt()
  @Min(0)
  @Max(DEMAND_LIMITS.maxTargetSeconds)
  targetSeconds!: number;

  @ApiProperty({ example: 85, minimum: 50, maximum: 100 })
  @IsNumber(NUMBER)
  @Min(50)
  @Max(100)
  maxOccupancyPercent!: number;

  @ApiProperty({ example: 30, minimum: 0, maximum: 80 })
  @IsNumber(NUMBER)
  @Min(0)
  @Max(80)
  shrinkagePercent!: number;
}

export class ContactIntervalBody implements ContactIntervalDto {
  @ApiProperty({ example: '09:00' })
  @IsString()
  @Matches(TIME_OF_DAY_PATTERN, { message: 'start must be a time HH:mm' })
  start!: string;

  @ApiProperty({ minimum: 0, maximum: DEMAND_LIMITS.maxContacts })
  @IsNumber(NUMBER)
  @Min(0)
  @Max(DEMAND_LIMITS.maxContacts)
  contacts!: number;

  @ApiProperty({ minimum: DEMAND_LIMITS.minAhtSeconds, maximum: DEMAND_LIMITS.maxAhtSeconds })
  @IsInt()
  @Min(DEMAND_LIMITS.minAhtSeconds)
  @Max(DEMAND_LIMITS.maxAhtSeconds)
  ahtSeconds!: number;
}

export class ContactWeekdayBody implements ContactWeekdayDto {
  @ApiProperty({ minimum: 0, maximum: 6, description: '0 = Sunday … 6 = Saturday' })
  @IsInt()
  @Min(0)
  @Max(6)
  weekday!: number;

  @ApiProperty({ type: [ContactIntervalBody] })
  @IsArray()
  @ArrayMaxSize(96)
  @ValidateNested({ each: true })
  @Type(() => ContactIntervalBody)
  intervals!: ContactIntervalBody[];
}

export class ContactDateBody implements ContactDateDto {
  @ApiProperty({ example: '2027-01-04' })
  @IsIsoDate()
  date!: string;

  @ApiProperty({ type: [ContactIntervalBody] })
  @IsArray()
  @ArrayMaxSize(96)
  @ValidateNested({ each: true })
  @Type(() => ContactIntervalBody)
  intervals!: ContactIntervalBody[];
}

export class ContactCentreDemandBody implements ContactCentreDemandDto {
  @ApiProperty({ enum: DEMAND_INTERVAL_MINUTES })
  @IsIn(DEMAND_INTERVAL_MINUTES, { message: 'intervalMinutes must be 15, 30 or 60' })
  intervalMinutes!: DemandIntervalMinutes;

  @ApiProperty({ format: 'uuid', nullable: true, type: String })
  @ValidateIf((_o, v) => v !== null)
  @IsUUID('all', { message: 'skillId must be a skill id or null' })
  skillId!: string | null;

  @ApiProperty({ type: ServiceTargetBody })
  @IsObject()
  @ValidateNested()
  @Type(() => ServiceTargetBody)
  service!: ServiceTargetBody;

  @ApiProperty({ type: [ContactWeekdayBody] })
  @IsArray()
  @ArrayMaxSize(7)
  @ValidateNested({ each: true })
  @Type(() => ContactWeekdayBody)
  pattern!: ContactWeekdayBody[];

  @ApiProperty({ type: [ContactDateBody] })
  @IsArray()
  @ArrayMaxSize(366)
  @ValidateNested({ each: true })
  @Type(() => ContactDateBody)
  dates!: ContactDateBody[];

  @ApiProperty({ type: [String], description: 'Shift types the covering may open; empty = all' })
  @IsArray()
  @ArrayMaxSize(50)
  @IsUUID('all', { each: true, message: 'shiftTypeIds must be shift type ids' })
  shiftTypeIds!: string[];

  @ApiProperty({ nullable: true, type: Number, minimum: 1, maximum: DEMAND_LIMITS.maxPeoplePerDay })
  @ValidateIf((_o, v) => v !== null)
  @IsInt()
  @Min(1)
  @Max(DEMAND_LIMITS.maxPeoplePerDay)
  maxPeoplePerDay!: number | null;
}

export class AcuityMixBody implements AcuityMixDto {
  @ApiProperty() @IsNumber(NUMBER) @Min(0) @Max(DEMAND_LIMITS.maxPatients) low!: number;
  @ApiProperty() @IsNumber(NUMBER) @Min(0) @Max(DEMAND_LIMITS.maxPatients) medium!: number;
  @ApiProperty() @IsNumber(NUMBER) @Min(0) @Max(DEMAND_LIMITS.maxPatients) high!: number;
}

export class RatioMixBody implements AcuityMixDto {
  @ApiProperty() @IsNumber(NUMBER) @Min(1) @Max(DEMAND_LIMITS.maxPatientsPerStaff) low!: number;
  @ApiProperty() @IsNumber(NUMBER) @Min(1) @Max(DEMAND_LIMITS.maxPatientsPerStaff) medium!: number;
  @ApiProperty() @IsNumber(NUMBER) @Min(1) @Max(DEMAND_LIMITS.maxPatientsPerStaff) high!: number;
}

export class WardPatientsBody implements WardPatientsDto {
  @ApiProperty({ nullable: true, type: Number, description: '0 = Sunday … 6 = Saturday; null with a date' })
  @ValidateIf((_o, v) => v !== null)
  @IsInt()
  @Min(0)
  @Max(6)
  weekday!: number | null;

  @ApiProperty({ nullable: true, type: String, description: 'YYYY-MM-DD; null for the weekly pattern' })
  @ValidateIf((_o, v) => v !== null)
  @IsIsoDate()
  date!: string | null;

  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'shiftTypeId must be a shift type id' })
  shiftTypeId!: string;

  @ApiProperty({ type: AcuityMixBody })
  @IsObject()
  @ValidateNested()
  @Type(() => AcuityMixBody)
  patients!: AcuityMixBody;
}

export class WardRatioBody implements WardRatioDto {
  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'skillId must be a skill id' })
  skillId!: string;

  @ApiProperty({ type: RatioMixBody, description: 'Patients one person cares for, per acuity level' })
  @IsObject()
  @ValidateNested()
  @Type(() => RatioMixBody)
  patientsPerStaff!: RatioMixBody;

  @ApiProperty({
    minimum: 0,
    maximum: 50,
    description: 'People with the skill on every shift whatever the patients',
  })
  @IsInt()
  @Min(0)
  @Max(50)
  minimumPerShift!: number;

  @ApiProperty({ maxLength: 300, example: 'California Title 22 CCR 70217 (medical/surgical 1:5)' })
  @IsString()
  @MaxLength(300)
  source!: string;
}

export class WardDemandBody implements WardDemandDto {
  @ApiProperty({ type: [WardPatientsBody] })
  @IsArray()
  @ArrayMaxSize(2000)
  @ValidateNested({ each: true })
  @Type(() => WardPatientsBody)
  patients!: WardPatientsBody[];

  @ApiProperty({ type: [WardRatioBody] })
  @IsArray()
  @ArrayMaxSize(20)
  @ValidateNested({ each: true })
  @Type(() => WardRatioBody)
  ratios!: WardRatioBody[];
}

export class PutUnitDemandDto implements PutUnitDemandRequest {
  @ApiProperty({ type: ContactCentreDemandBody, nullable: true })
  @ValidateIf((_o, v) => v !== null)
  @IsObject({ message: 'contactCentre must be an object or null' })
  @ValidateNested()
  @Type(() => ContactCentreDemandBody)
  contactCentre!: ContactCentreDemandBody | null;

  @ApiProperty({ type: WardDemandBody, nullable: true })
  @ValidateIf((_o, v) => v !== null)
  @IsObject({ message: 'ward must be an object or null' })
  @ValidateNested()
  @Type(() => WardDemandBody)
  ward!: WardDemandBody | null;
}

export class AcceptedCoverRowBody implements AcceptedCoverRowDto {
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

export class AcceptDemandPlanDto implements AcceptDemandPlanRequest {
  @ApiProperty({ type: [AcceptedCoverRowBody] })
  @IsArray()
  @ArrayMinSize(1)
  @ArrayMaxSize(84 * 20)
  @ValidateNested({ each: true })
  @Type(() => AcceptedCoverRowBody)
  rows!: AcceptedCoverRowBody[];
}

export class DemandImportQueryDto {
  @ApiPropertyOptional({ default: false })
  @IsOptional()
  @Transform(({ value }: { value: unknown }) => (value === 'true' ? true : value === 'false' ? false : value))
  @IsBoolean({ message: 'dryRun must be true or false' })
  dryRun: boolean = false;
}
