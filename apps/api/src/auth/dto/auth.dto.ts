import { ApiProperty } from '@nestjs/swagger';
import {
  type AcceptInvitationRequest,
  type ChangePasswordRequest,
  type ConfirmPasswordResetRequest,
  type LoginRequest,
  PASSWORD_MAX_LENGTH,
  PASSWORD_MIN_LENGTH,
  type RequestPasswordResetRequest,
} from '@rotaplex/contracts';
import { Transform } from 'class-transformer';
import { IsEmail, IsNotEmpty, IsString, Length, MaxLength } from 'class-validator';

const lowerTrim = ({ value }: { value: unknown }) =>
  typeof value === 'string' ? value.trim().toLowerCase() : value;
const newPasswordMessage = `must be ${PASSWORD_MIN_LENGTH} to ${PASSWORD_MAX_LENGTH} characters long`;

export class LoginDto implements LoginRequest {
  @ApiProperty({ example: 'admin@example.com' })
  @Transform(lowerTrim)
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @MaxLength(254)
  email!: string;

  @ApiProperty({ example: 'rotaplex-demo' })
  @IsString()
  @IsNotEmpty()
  @MaxLength(PASSWORD_MAX_LENGTH)
  password!: string;
}

export class AcceptInvitationDto implements AcceptInvitationRequest {
  @ApiProperty()
  @IsString()
  @IsNotEmpty()
  @MaxLength(200)
  token!: string;

  @ApiProperty({ minLength: PASSWORD_MIN_LENGTH, maxLength: PASSWORD_MAX_LENGTH })
  @IsString()
  @Length(PASSWORD_MIN_LENGTH, PASSWORD_MAX_LENGTH, { message: `password ${newPasswordMessage}` })
  password!: string;
}

export class RequestPasswordResetDto implements RequestPasswordResetRequest {
  @ApiProperty()
  @Transform(lowerTrim)
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @MaxLength(254)
  email!: string;
}

export class ConfirmPasswordResetDto implements ConfirmPasswordResetRequest {
  @ApiProperty()
  @IsString()
  @IsNotEmpty()
  @MaxLength(200)
  token!: string;

  @ApiProperty({ minLength: PASSWORD_MIN_LENGTH, maxLength: PASSWORD_MAX_LENGTH })
  @IsString()
  @Length(PASSWORD_MIN_LENGTH, PASSWORD_MAX_LENGTH, { message: `password ${newPasswordMessage}` })
  password!: string;
}

export class ChangePasswordDto implements ChangePasswordRequest {
  @ApiProperty()
  @IsString()
  @IsNotEmpty()
  @MaxLength(PASSWORD_MAX_LENGTH)
  currentPassword!: string;

  @ApiProperty({ minLength: PASSWORD_MIN_LENGTH, maxLength: PASSWORD_MAX_LENGTH })
  @IsString()
  @Length(PASSWORD_MIN_LENGTH, PASSWORD_MAX_LENGTH, { message: `newPassword ${newPasswordMessage}` })
  newPassword!: string;
}
