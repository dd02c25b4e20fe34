import { ApiProperty } from '@nestjs/swagger';
import { type Page, ROLES, type Role, type UserDto } from '@rotaplex/contracts';

export class UserResponse implements UserDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
  @ApiProperty() email!: string;
  @ApiProperty() displayName!: string;
  @ApiProperty({ enum: ROLES }) role!: Role;
  @ApiProperty({ type: [String], format: 'uuid' }) unitIds!: string[];
  @ApiProperty() active!: boolean;
  @ApiProperty({ description: 'The invitation was accepted and a password set' }) activated!: boolean;
  @ApiProperty({ format: 'date-time' }) createdAt!: string;
}

export class UserPageResponse implements Page<UserDto> {
  @ApiProperty({ type: [UserResponse] }) items!: UserResponse[];
  @ApiProperty() total!: number;
  @ApiProperty() page!: number;
  @ApiProperty() pageSize!: number;
}
