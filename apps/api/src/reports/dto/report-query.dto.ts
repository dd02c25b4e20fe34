import { ApiProperty } from '@nestjs/swagger';
import { type ReportQuery } from '@rotaplex/contracts';
import { IsUUID } from 'class-validator';

export class ReportQueryDto implements ReportQuery {
  @ApiProperty({ format: 'uuid', description: 'The roster period to report on' })
  @IsUUID('all', { message: 'periodId must be a roster period id' })
  periodId!: string;
}
