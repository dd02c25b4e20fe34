import { ApiProperty } from '@nestjs/swagger';
import { type OrganisationDto } from '@rotaplex/contracts';

export class OrganisationResponse implements OrganisationDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
  @ApiProperty() name!: string;
}
