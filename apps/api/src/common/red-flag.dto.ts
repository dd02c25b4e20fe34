import { ApiProperty } from '@nestjs/swagger';
import { RED_FLAG_RULES, type RedFlagDto, type RedFlagRule } from '@rotaplex/contracts';

/** A red flag of safe staffing (NICE SG1 2014) in the OpenAPI document: the publish check and open shifts. */
export class RedFlagResponse implements RedFlagDto {
  @ApiProperty() date!: string;
  @ApiProperty({ format: 'uuid' }) shiftTypeId!: string;
  @ApiProperty() shiftCode!: string;
  @ApiProperty() shiftName!: string;
  @ApiProperty({ format: 'uuid' }) skillId!: string;
  @ApiProperty() skillCode!: string;
  @ApiProperty() skillName!: string;
  @ApiProperty({ description: "The shift's minimum cover of the registered skill" }) need!: number;
  @ApiProperty() onShift!: number;
  @ApiProperty({ description: "People short times the shift's paid hours" }) shortHours!: number;
  @ApiProperty({ description: 'People short over the need (0-1)' }) shortShare!: number;
  @ApiProperty({ enum: RED_FLAG_RULES, isArray: true }) rules!: RedFlagRule[];
  @ApiProperty() text!: string;
}
