import { ApiProperty, ApiPropertyOptional, PartialType } from '@nestjs/swagger';
import {
  type CreateUnitRequest,
  PUBLISH_LEAD_DAYS_DEFAULT,
  PUBLISH_LEAD_DAYS_MAX,
  type UpdateUnitRequest,
} from '@rotaplex/contracts';
import { Transform } from 'class-transformer';
import { IsInt, IsNotEmpty, IsOptional, IsString, Max, MaxLength, Min } from 'class-validator';
import { IsIanaTimeZone } from '../../common/decorators/is-iana-time-zone.decorator';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);

export class CreateUnitDto implements CreateUnitRequest {
  @ApiProperty({ maxLength: 200, example: 'Ward 7 Acute Medicine' })
  @Transform(trim)
  @IsString()
  @IsNotEmpty()
  @MaxLength(200)
  name!: string;

  @ApiProperty({ example: 'Europe/London', description: 'IANA time zone name' })
  @Transform(trim)
  @IsIanaTimeZone()
  timeZone!: string;

  @ApiPropertyOptional({
    minimum: 0,
    maximum: PUBLISH_LEAD_DAYS_MAX,
    default: PUBLISH_LEAD_DAYS_DEFAULT,
    description: 'Days before a period starts by which its roster should be published',
  })
  @IsOptional()
  @IsInt({ message: 'publishLeadDays must be a whole number of days' })
  @Min(0, { message: 'publishLeadDays must be at least 0' })
  @Max(PUBLISH_LEAD_DAYS_MAX, { message: `publishLeadDays must be at most ${PUBLISH_LEAD_DAYS_MAX}` })
  publishLeadDays?: number;
}

export class UpdateUnitDto extends PartialType(CreateUnitDto) implements UpdateUnitRequest {}
