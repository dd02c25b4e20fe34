import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import {
  type CreateStaffMemberRequest,
  type Page,
  STAFF_SORT_FIELDS,
  type StaffListQuery,
  type StaffMemberDto,
  type StaffSortField,
  type UpdateStaffMemberRequest,
} from '@rotaplex/contracts';
import { Transform } from 'class-transformer';
import {
  ArrayMaxSize,
  IsArray,
  IsBoolean,
  IsEmail,
  IsIn,
  IsNotEmpty,
  IsNumber,
  IsOptional,
  IsString,
  IsUUID,
  Max,
  MaxLength,
  Min,
  ValidateIf,
} from 'class-validator';
import { PageQueryDto } from '../../common/pagination';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);
const lowerTrim = ({ value }: { value: unknown }) =>
  typeof value === 'string' ? value.trim().toLowerCase() : value;
const bool = ({ value }: { value: unknown }) => (value === 'true' ? true : value === 'false' ? false : value);

class StaffFieldsDto {
  @ApiPropertyOptional({
    format: 'uuid',
    nullable: true,
    type: String,
    description: 'Sign-in user of the unit',
  })
  @IsOptional()
  @ValidateIf((_o, v) => v !== null)
  @IsUUID('all', { message: 'userId must be a user id' })
  userId?: string | null;

  @ApiPropertyOptional({ nullable: true, type: String })
  @IsOptional()
  @Transform(lowerTrim)
  @ValidateIf((_o, v) => v !== null)
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @MaxLength(254)
  email?: string | null;

  @ApiPropertyOptional({ format: 'uuid', nullable: true, type: String })
  @IsOptional()
  @ValidateIf((_o, v) => v !== null)
  @IsUUID('all', { message: 'contractId must be a contract id' })
  contractId?: string | null;

  @ApiPropertyOptional({ nullable: true, type: Number, minimum: 0 })
  @IsOptional()
  @ValidateIf((_o, v) => v !== null)
  @IsNumber({ allowNaN: false, allowInfinity: false, maxDecimalPlaces: 2 })
  @Min(0)
  @Max(100000)
  hourlyCost?: number | null;

  @ApiPropertyOptional({ default: true })
  @IsOptional()
  @IsBoolean()
  active?: boolean;
}

export class CreateStaffMemberDto extends StaffFieldsDto implements CreateStaffMemberRequest {
  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'unitId must be a unit id' })
  unitId!: string;

  @ApiProperty({ maxLength: 200 })
  @Transform(trim)
  @IsString()
  @IsNotEmpty()
  @MaxLength(200)
  name!: string;

  @ApiProperty({ type: [String], example: ['RN'], description: 'Skill codes' })
  @IsArray()
  @ArrayMaxSize(50)
  @IsString({ each: true })
  skills!: string[];
}

export class UpdateStaffMemberDto extends StaffFieldsDto implements UpdateStaffMemberRequest {
  @ApiPropertyOptional({ maxLength: 200 })
  @IsOptional()
  @Transform(trim)
  @IsString()
  @IsNotEmpty()
  @MaxLength(200)
  name?: string;

  @ApiPropertyOptional({ type: [String], description: 'Skill codes' })
  @IsOptional()
  @IsArray()
  @ArrayMaxSize(50)
  @IsString({ each: true })
  skills?: string[];
}

export class StaffQueryDto extends PageQueryDto implements StaffListQuery {
  @ApiPropertyOptional({ enum: STAFF_SORT_FIELDS, default: 'name' })
  @IsOptional()
  @IsIn(STAFF_SORT_FIELDS, { message: `sort must be one of ${STAFF_SORT_FIELDS.join(', ')}` })
  sort: StaffSortField = 'name';

  @ApiPropertyOptional({ format: 'uuid' })
  @IsOptional()
  @IsUUID('all', { message: 'unitId must be a unit id' })
  unitId?: string;

  @ApiPropertyOptional({ description: 'Skill code' })
  @IsOptional()
  @Transform(({ value }: { value: unknown }) =>
    typeof value === 'string' ? value.trim().toUpperCase() : value,
  )
  @IsString()
  @MaxLength(16)
  skill?: string;

  @ApiPropertyOptional()
  @IsOptional()
  @Transform(bool)
  @IsBoolean({ message: 'active must be true or false' })
  active?: boolean;
}

export class StaffExportQueryDto {
  @ApiPropertyOptional({ format: 'uuid', description: 'One unit; absent: every unit the caller plans' })
  @IsOptional()
  @IsUUID('all', { message: 'unitId must be a unit id' })
  unitId?: string;
}

export class StaffImportQueryDto {
  @ApiProperty({ format: 'uuid', description: 'The unit the people join' })
  @IsUUID('all', { message: 'unitId must be a unit id' })
  unitId!: string;

  @ApiPropertyOptional({ default: false, description: 'Only check the rows; save nothing' })
  @IsOptional()
  @Transform(bool)
  @IsBoolean({ message: 'dryRun must be true or false' })
  dryRun: boolean = false;
}

export class StaffMemberResponse implements StaffMemberDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
  @ApiProperty({ format: 'uuid' }) unitId!: string;
  @ApiProperty({ format: 'uuid', nullable: true, type: String }) userId!: string | null;
  @ApiProperty() name!: string;
  @ApiProperty({ nullable: true, type: String }) email!: string | null;
  @ApiProperty({ type: [String] }) skills!: string[];
  @ApiProperty({ format: 'uuid', nullable: true, type: String }) contractId!: string | null;
  @ApiProperty({ nullable: true, type: Number }) hourlyCost!: number | null;
  @ApiProperty() active!: boolean;
}

export class StaffPageResponse implements Page<StaffMemberDto> {
  @ApiProperty({ type: [StaffMemberResponse] }) items!: StaffMemberResponse[];
  @ApiProperty() total!: number;
  @ApiProperty() page!: number;
  @ApiProperty() pageSize!: number;
}
