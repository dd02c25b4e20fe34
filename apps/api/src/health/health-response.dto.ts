import { ApiProperty } from '@nestjs/swagger';
import { type HealthResponse, type QueueHealthDto } from '@rotaplex/contracts';

export class QueueHealthResponse {
  @ApiProperty({
    enum: ['in-process', 'redis'],
    description: "This process's worker pool, or the Redis queue",
  })
  kind!: QueueHealthDto['kind'];
  @ApiProperty({ enum: ['up', 'down'] }) state!: 'up' | 'down';
  @ApiProperty({ description: 'Solves waiting for a worker' }) waiting!: number;
  @ApiProperty({ description: 'Solves running' }) active!: number;
  @ApiProperty({ description: 'In-process: worker threads; redis: solver worker processes connected' })
  workers!: number;
}

export class HealthResponseDto implements HealthResponse {
  @ApiProperty({ enum: ['ok', 'error'] }) status!: 'ok' | 'error';
  @ApiProperty({ enum: ['up', 'down'] }) database!: 'up' | 'down';
  @ApiProperty() version!: string;
  @ApiProperty({ type: QueueHealthResponse }) queue!: QueueHealthDto;
}
