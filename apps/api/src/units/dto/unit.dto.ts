import { ApiProperty, PartialType } from '@nestjs/swagger';
import { type CreateUnitRequest, type UpdateUnitRequest } from '@rotaplex/contracts';
import { Transform } from 'class-transformer';
import { IsNotEmpty, IsString, MaxLength } from 'class-validator';
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
}

export class UpdateUnitDto extends PartialType(CreateUnitDto) implements UpdateUnitRequest {}
