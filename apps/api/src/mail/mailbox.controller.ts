import { Controller, Get, NotFoundException, Param, Query } from '@nestjs/common';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';
import { ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { type MailMessageDto, type MailMessageSummaryDto, type Page } from '@rotaplex/contracts';
import { InjectRepository } from '@nestjs/typeorm';
import { Repository } from 'typeorm';
import { RequirePermissions } from '../common/decorators/access.decorator';
import { likePattern, PageQueryDto, toPage } from '../common/pagination';
import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsOptional } from 'class-validator';

export class MailboxQueryDto extends PageQueryDto {
  @ApiPropertyOptional({
    enum: ['asc', 'desc'],
    default: 'desc',
    description: 'By time received; newest first by default',
  })
  @IsOptional()
  @IsIn(['asc', 'desc'])
  override order: 'asc' | 'desc' = 'desc';
}
import { MailCatcherService } from './mail-catcher.service';
import { MailMessageEntity } from './mail-message.entity';
import { MailMessageResponse, MailPageResponse } from './dto/mail-message-response.dto';

/** The local mail catcher's messages, newest first (admins). */
@ApiTags('mailbox')
@Controller('mailbox')
@RequirePermissions('mailbox:read')
export class MailboxController {
  constructor(
    @InjectRepository(MailMessageEntity) private readonly messages: Repository<MailMessageEntity>,
    private readonly catcher: MailCatcherService,
  ) {}

  @Get()
  @ApiOkResponse({ type: MailPageResponse })
  async list(@Query() query: MailboxQueryDto): Promise<Page<MailMessageSummaryDto>> {
    const qb = this.messages
      .createQueryBuilder('m')
      .select(['m.id', 'm.from', 'm.to', 'm.subject', 'm.receivedAt'])
      .orderBy('m.receivedAt', query.order === 'asc' ? 'ASC' : 'DESC')
      .addOrderBy('m.id', 'ASC')
      .skip((query.page - 1) * query.pageSize)
      .take(query.pageSize);
    if (query.q) {
      qb.where(
        `(LOWER(m.subject) LIKE LOWER(:q) ESCAPE '\\' OR LOWER(m."to") LIKE LOWER(:q) ESCAPE '\\' OR LOWER(m."from") LIKE LOWER(:q) ESCAPE '\\')`,
        {
          q: likePattern(query.q),
        },
      );
    }
    const [rows, total] = await qb.getManyAndCount();
    return toPage(rows.map(toSummary), total, query);
  }

  @Get(':id')
  @ApiOkResponse({ type: MailMessageResponse })
  async get(@Param('id', ParseIdPipe) id: string): Promise<MailMessageDto> {
    const m = await this.messages.findOneBy({ id });
    if (!m) throw new NotFoundException('Message not found');
    return { ...toSummary(m), ...this.catcher.readBodies(m) };
  }
}

function toSummary(m: MailMessageEntity): MailMessageSummaryDto {
  return { id: m.id, from: m.from, to: m.to, subject: m.subject, receivedAt: m.receivedAt.toISOString() };
}
