import { ApiProperty } from '@nestjs/swagger';
import { type UpdateOrganisationRequest } from '@rotaplex/contracts';
import { Transform } from 'class-transformer';
import { IsNotEmpty, IsString, MaxLength } from 'class-validator';

export class UpdateOrganisationDto implements UpdateOrganisationRequest {
  @ApiProperty({ maxLength: 200 })
  @Transform(({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value))
  @IsString()
  @IsNotEmpty()
  @MaxLength(200)
  name!: string;
}
