import { ApiProperty, PartialType } from '@nestjs/swagger';
import {
  type CreateSkillRequest,
  SKILL_CODE_PATTERN,
  type SkillDto,
  type UpdateSkillRequest,
} from '@rotaplex/contracts';
import { Transform } from 'class-transformer';
import { IsBoolean, IsNotEmpty, IsOptional, IsString, Matches, MaxLength } from 'class-validator';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);
const upperTrim = ({ value }: { value: unknown }) =>
  typeof value === 'string' ? value.trim().toUpperCase() : value;

export class CreateSkillDto implements CreateSkillRequest {
  @ApiProperty({ example: 'RN', description: '1-16 letters, digits, - or _; stored upper case' })
  @Transform(upperTrim)
  @IsString()
  @Matches(SKILL_CODE_PATTERN, { message: 'code must be 1-16 letters, digits, - or _' })
  code!: string;

  @ApiProperty({ example: 'Registered nurse', maxLength: 200 })
  @Transform(trim)
  @IsString()
  @IsNotEmpty()
  @MaxLength(200)
  name!: string;

  @ApiProperty({
    required: false,
    default: false,
    description:
      'A registered (licensed) professional skill, such as registered nurse: shortfalls of it are checked ' +
      'for the red flags of safe staffing (NICE SG1 2014) on the board, in the publish check and on the home page',
  })
  @IsOptional()
  @IsBoolean({ message: 'registered must be true or false' })
  registered?: boolean;
}

export class UpdateSkillDto extends PartialType(CreateSkillDto) implements UpdateSkillRequest {}

export class SkillResponse implements SkillDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
  @ApiProperty() code!: string;
  @ApiProperty() name!: string;
  @ApiProperty() registered!: boolean;
}
