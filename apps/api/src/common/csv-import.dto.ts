import { ApiProperty } from '@nestjs/swagger';
import { type CsvImportResult, type CsvRowError } from '@rotaplex/contracts';

/** The OpenAPI shape of a CSV import's answer (staff, cover needs, demand). */
export class CsvRowErrorResponse implements CsvRowError {
  @ApiProperty({ description: 'Line in the file (1 = header)' }) line!: number;
  @ApiProperty() field!: string;
  @ApiProperty() message!: string;
}

export class CsvImportResponse implements CsvImportResult {
  @ApiProperty() dryRun!: boolean;
  @ApiProperty() rows!: number;
  @ApiProperty() saved!: number;
  @ApiProperty({ type: [CsvRowErrorResponse] }) errors!: CsvRowErrorResponse[];
  @ApiProperty({
    type: [String],
    required: false,
    description: 'Cautions on what the file sets (a cover minimum lowered to 0), also on a dry run',
  })
  cautions?: string[];
}
