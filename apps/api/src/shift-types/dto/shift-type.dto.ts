import { ApiProperty, ApiPropertyOptional, PartialType } from '@nestjs/swagger';
import {
  type CreateShiftTypeRequest,
  SHIFT_CODE_PATTERN,
  SHIFT_COLOURS,
  type ShiftColour,
  type ShiftTypeDto,
  TIME_OF_DAY_PATTERN,
  type UpdateShiftTypeRequest,
} from '@rotaplex/contracts';
import { Transform } from 'class-transformer';
import {
  IsBoolean,
  IsIn,
  IsInt,
  IsNotEmpty,
  IsOptional,
  IsString,
  Matches,
  Max,
  MaxLength,
  Min,
  ValidateIf,
} from 'class-validator';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);
const upperTrim = ({ value }: { value: unknown }) =>
  typeof value === 'string' ? value.trim().toUpperCase() : value;

export class CreateShiftTypeDto implements CreateShiftTypeRequest {
  @ApiProperty({ example: 'E', description: '1-4 letters or digits, unique in the unit; stored upper case' })
  @Transform(upperTrim)
  @IsString()
  @Matches(SHIFT_CODE_PATTERN, { message: 'code must be 1-4 letters or digits' })
  code!: string;

  @ApiProperty({ example: 'Early', maxLength: 200 })
  @Transform(trim)
  @IsString()
  @IsNotEmpty()
  @MaxLength(200)
  name!: string;

  @ApiProperty({ example: '07:00', description: 'HH:mm, wall clock in the unit time zone' })
  @IsString()
  @Matches(TIME_OF_DAY_PATTERN, { message: 'start must be a time HH:mm (00:00-23:59)' })
  start!: string;

  @ApiProperty({ example: '15:00', description: 'HH:mm; not after start means the next day' })
  @IsString()
  @Matches(TIME_OF_DAY_PATTERN, { message: 'end must be a time HH:mm (00:00-23:59)' })
  end!: string;

  @ApiProperty({ example: 450, description: 'Paid minutes, at most the length of the shift' })
  @IsInt({ message: 'paidMinutes must be a whole number of minutes' })
  @Min(0)
  @Max(1440)
  paidMinutes!: number;

  @ApiProperty({ enum: SHIFT_COLOURS })
  @IsIn(SHIFT_COLOURS, { message: `colour must be one of ${SHIFT_COLOURS.join(', ')}` })
  colour!: ShiftColour;

  @ApiPropertyOptional({
    type: Boolean,
    nullable: true,
    description: 'null or absent: derived from the times',
  })
  @IsOptional()
  @ValidateIf((_o, v) => v !== null)
  @IsBoolean({ message: 'night must be true, false or null' })
  night?: boolean | null;
}

export class UpdateShiftTypeDto extends PartialType(CreateShiftTypeDto) implements UpdateShiftTypeRequest {}

export class ShiftTypeResponse implements ShiftTypeDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
  @ApiProperty({ format: 'uuid' }) unitId!: string;
  @ApiProperty() code!: string;
  @ApiProperty() name!: string;
  @ApiProperty({ example: '07:00' }) start!: string;
  @ApiProperty({ example: '15:00' }) end!: string;
  @ApiProperty() paidMinutes!: number;
  @ApiProperty({ enum: SHIFT_COLOURS }) colour!: ShiftColour;
  @ApiProperty({ type: Boolean, nullable: true }) night!: boolean | null;
  @ApiProperty({ type: [String], description: 'Guard-rail cautions, e.g. a shift longer than 12 hours' })
  cautions!: string[];
}
