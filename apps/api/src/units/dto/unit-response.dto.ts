import { ApiProperty } from '@nestjs/swagger';
import { type UnitDto } from '@rotaplex/contracts';

export class UnitResponse implements UnitDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
  @ApiProperty() name!: string;
  @ApiProperty({ example: 'Europe/London' }) timeZone!: string;
  @ApiProperty({ example: 42, description: 'Days of notice the unit aims to give before a period starts' })
  publishLeadDays!: number;
  @ApiProperty({ format: 'date-time' }) createdAt!: string;
}
