import { ApiProperty } from '@nestjs/swagger';
import {
  NOTICE_WINDOW_DAYS_MAX,
  NOTICE_WINDOW_DAYS_MIN,
  type NoticeWindowSettingsDto,
  PREDICTABILITY_PAY_HOURS_MAX,
  PREDICTABILITY_PAY_RULE_MAX_LENGTH,
  type UpdateNoticeWindowSettingsRequest,
} from '@rotaplex/contracts';
import { Transform } from 'class-transformer';
import { IsBoolean, IsInt, IsNumber, IsString, Max, MaxLength, Min } from 'class-validator';

/** The organisation's notice window and predictability-pay setting; every field is required. */
export class UpdateNoticeWindowDto implements UpdateNoticeWindowSettingsRequest {
  @ApiProperty({ minimum: NOTICE_WINDOW_DAYS_MIN, maximum: NOTICE_WINDOW_DAYS_MAX, example: 14 })
  @IsInt()
  @Min(NOTICE_WINDOW_DAYS_MIN)
  @Max(NOTICE_WINDOW_DAYS_MAX)
  noticeWindowDays!: number;

  @ApiProperty()
  @IsBoolean()
  recordPredictabilityPay!: boolean;

  @ApiProperty({
    minimum: 0,
    maximum: PREDICTABILITY_PAY_HOURS_MAX,
    example: 1,
    description: 'Quarter hours',
  })
  @IsNumber({ allowNaN: false, allowInfinity: false, maxDecimalPlaces: 2 })
  @Min(0)
  @Max(PREDICTABILITY_PAY_HOURS_MAX)
  predictabilityPayHours!: number;

  @ApiProperty({ maxLength: PREDICTABILITY_PAY_RULE_MAX_LENGTH })
  @Transform(({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value))
  @IsString()
  @MaxLength(PREDICTABILITY_PAY_RULE_MAX_LENGTH)
  predictabilityPayRule!: string;
}

export class NoticeWindowResponse implements NoticeWindowSettingsDto {
  @ApiProperty() noticeWindowDays!: number;
  @ApiProperty() recordPredictabilityPay!: boolean;
  @ApiProperty() predictabilityPayHours!: number;
  @ApiProperty() predictabilityPayRule!: string;
}
