import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import {
  type InviteUserRequest,
  ROLES,
  type Role,
  type UpdateUserRequest,
  USER_SORT_FIELDS,
  type UserListQuery,
  type UserSortField,
} from '@rotaplex/contracts';
import { Transform } from 'class-transformer';
import {
  ArrayMaxSize,
  IsArray,
  IsBoolean,
  IsEmail,
  IsIn,
  IsNotEmpty,
  IsOptional,
  IsString,
  IsUUID,
  MaxLength,
} from 'class-validator';
import { PageQueryDto } from '../../common/pagination';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);
const lowerTrim = ({ value }: { value: unknown }) =>
  typeof value === 'string' ? value.trim().toLowerCase() : value;

export class InviteUserDto implements InviteUserRequest {
  @ApiProperty({ example: 'sam.jones@example.com' })
  @Transform(lowerTrim)
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @MaxLength(254)
  email!: string;

  @ApiProperty({ maxLength: 200 })
  @Transform(trim)
  @IsString()
  @IsNotEmpty()
  @MaxLength(200)
  displayName!: string;

  @ApiProperty({ enum: ROLES })
  @IsIn(ROLES, { message: `role must be one of ${ROLES.join(', ')}` })
  role!: Role;

  @ApiProperty({ type: [String], format: 'uuid' })
  @IsArray()
  @ArrayMaxSize(100)
  @IsUUID('all', { each: true, message: 'each value in unitIds must be a unit id' })
  unitIds!: string[];
}

export class UpdateUserDto implements UpdateUserRequest {
  @ApiPropertyOptional({ maxLength: 200 })
  @IsOptional()
  @Transform(trim)
  @IsString()
  @IsNotEmpty()
  @MaxLength(200)
  displayName?: string;

  @ApiPropertyOptional({ enum: ROLES })
  @IsOptional()
  @IsIn(ROLES, { message: `role must be one of ${ROLES.join(', ')}` })
  role?: Role;

  @ApiPropertyOptional({ type: [String], format: 'uuid' })
  @IsOptional()
  @IsArray()
  @ArrayMaxSize(100)
  @IsUUID('all', { each: true, message: 'each value in unitIds must be a unit id' })
  unitIds?: string[];
}

export class UsersQueryDto extends PageQueryDto implements UserListQuery {
  @ApiPropertyOptional({ enum: USER_SORT_FIELDS, default: 'displayName' })
  @IsOptional()
  @IsIn(USER_SORT_FIELDS, { message: `sort must be one of ${USER_SORT_FIELDS.join(', ')}` })
  sort: UserSortField = 'displayName';

  @ApiPropertyOptional({ enum: ROLES })
  @IsOptional()
  @IsIn(ROLES, { message: `role must be one of ${ROLES.join(', ')}` })
  role?: Role;

  @ApiPropertyOptional({ format: 'uuid' })
  @IsOptional()
  @IsUUID('all', { message: 'unitId must be a unit id' })
  unitId?: string;

  @ApiPropertyOptional()
  @IsOptional()
  @Transform(({ value }: { value: unknown }) => (value === 'true' ? true : value === 'false' ? false : value))
  @IsBoolean({ message: 'active must be true or false' })
  active?: boolean;
}
