import { ApiProperty } from '@nestjs/swagger';
import { type UnitDto } from '@rotaplex/contracts';

export class UnitResponse implements UnitDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
  @ApiProperty() name!: string;
  @ApiProperty({ example: 'Europe/London' }) timeZone!: string;
  @ApiProperty({ format: 'date-time' }) createdAt!: string;
}
