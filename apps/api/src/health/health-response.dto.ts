import { ApiProperty } from '@nestjs/swagger';
import { type HealthResponse } from '@rotaplex/contracts';

export class HealthResponseDto implements HealthResponse {
  @ApiProperty({ enum: ['ok', 'error'] }) status!: 'ok' | 'error';
  @ApiProperty({ enum: ['up', 'down'] }) database!: 'up' | 'down';
  @ApiProperty() version!: string;
}
