import { ApiProperty } from '@nestjs/swagger';
import { type MailMessageDto, type MailMessageSummaryDto, type Page } from '@rotaplex/contracts';

export class MailMessageSummaryResponse implements MailMessageSummaryDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
  @ApiProperty() from!: string;
  @ApiProperty({ type: [String] }) to!: string[];
  @ApiProperty() subject!: string;
  @ApiProperty({ format: 'date-time' }) receivedAt!: string;
}

export class MailMessageResponse extends MailMessageSummaryResponse implements MailMessageDto {
  @ApiProperty() text!: string;
  @ApiProperty({ type: String, nullable: true }) html!: string | null;
}

export class MailPageResponse implements Page<MailMessageSummaryDto> {
  @ApiProperty({ type: [MailMessageSummaryResponse] }) items!: MailMessageSummaryResponse[];
  @ApiProperty() total!: number;
  @ApiProperty() page!: number;
  @ApiProperty() pageSize!: number;
}
