import { ApiProperty } from '@nestjs/swagger';
import { type MeResponse, PERMISSIONS, type Permission, type TokenResponse } from '@rotaplex/contracts';
import { OrganisationResponse } from '../../organisation/dto/organisation-response.dto';
import { UserResponse } from '../../users/dto/user-response.dto';

export class MeResponseDto extends UserResponse implements MeResponse {
  @ApiProperty({ enum: PERMISSIONS, isArray: true }) permissions!: Permission[];
  @ApiProperty({ type: OrganisationResponse }) organisation!: OrganisationResponse;
}

export class TokenResponseDto implements TokenResponse {
  @ApiProperty({ description: 'JWT (HS256) for the Authorization: Bearer header' }) accessToken!: string;
  @ApiProperty({ description: 'Seconds until the access token expires', example: 900 }) expiresIn!: number;
  @ApiProperty({ type: MeResponseDto }) user!: MeResponseDto;
}
