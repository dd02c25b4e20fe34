import {
  ConflictException,
  Controller,
  Get,
  HttpCode,
  NotFoundException,
  Param,
  Post,
  Query,
} from '@nestjs/common';
import { ParseIdPipe } from '../../common/pipes/parse-id.pipe';
import { ApiOkResponse, ApiProperty, ApiPropertyOptional, ApiTags } from '@nestjs/swagger';
import { InjectRepository } from '@nestjs/typeorm';
import { OUTBOX_STATUSES, type OutboxMessageDto, type OutboxStatus, type Page } from '@rotaplex/contracts';
import { IsIn, IsOptional } from 'class-validator';
import { Repository } from 'typeorm';
import { RequirePermissions } from '../../common/decorators/access.decorator';
import { likePattern, PageQueryDto, toPage } from '../../common/pagination';
import { OutboxDeliveryService } from './outbox-delivery.service';
import { OutboxMessageEntity } from './outbox-message.entity';

export class OutboxQueryDto extends PageQueryDto {
  @ApiPropertyOptional({ enum: OUTBOX_STATUSES, description: 'Only messages in this state' })
  @IsOptional()
  @IsIn(OUTBOX_STATUSES)
  status?: OutboxStatus;

  @ApiPropertyOptional({
    enum: ['asc', 'desc'],
    default: 'desc',
    description: 'By time queued; newest first by default',
  })
  @IsOptional()
  @IsIn(['asc', 'desc'])
  override order: 'asc' | 'desc' = 'desc';
}

export class OutboxMessageResponse implements OutboxMessageDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
  @ApiProperty() to!: string;
  @ApiProperty() subject!: string;
  @ApiProperty({ enum: OUTBOX_STATUSES }) status!: OutboxStatus;
  @ApiProperty() attempts!: number;
  @ApiProperty({ type: String, format: 'date-time', nullable: true }) nextAttemptAt!: string | null;
  @ApiProperty({ type: String, nullable: true }) lastError!: string | null;
  @ApiProperty({ format: 'date-time' }) createdAt!: string;
  @ApiProperty({ type: String, format: 'date-time', nullable: true }) sentAt!: string | null;
}

export class OutboxPageResponse implements Page<OutboxMessageDto> {
  @ApiProperty({ type: [OutboxMessageResponse] }) items!: OutboxMessageResponse[];
  @ApiProperty() total!: number;
  @ApiProperty() page!: number;
  @ApiProperty() pageSize!: number;
}

/** Every e-mail the product sent or is trying to send, with failures (admins). */
@ApiTags('outbox')
@Controller('outbox')
@RequirePermissions('mailbox:read')
export class OutboxController {
  constructor(
    @InjectRepository(OutboxMessageEntity) private readonly messages: Repository<OutboxMessageEntity>,
    private readonly delivery: OutboxDeliveryService,
  ) {}

  @Get()
  @ApiOkResponse({ type: OutboxPageResponse })
  async list(@Query() query: OutboxQueryDto): Promise<Page<OutboxMessageDto>> {
    const qb = this.messages
      .createQueryBuilder('m')
      .select([
        'm.id',
        'm.to',
        'm.subject',
        'm.status',
        'm.attempts',
        'm.nextAttemptAt',
        'm.lastError',
        'm.createdAt',
        'm.sentAt',
      ])
      .orderBy('m.createdAt', query.order === 'asc' ? 'ASC' : 'DESC')
      .addOrderBy('m.id', 'ASC')
      .skip((query.page - 1) * query.pageSize)
      .take(query.pageSize);
    if (query.status) qb.andWhere('m.status = :status', { status: query.status });
    if (query.q) {
      qb.andWhere(
        `(LOWER(m.subject) LIKE LOWER(:q) ESCAPE '\\' OR LOWER(m."to") LIKE LOWER(:q) ESCAPE '\\')`,
        {
          q: likePattern(query.q),
        },
      );
    }
    const [rows, total] = await qb.getManyAndCount();
    return toPage(rows.map(toOutboxDto), total, query);
  }

  /** Queues a failed (or waiting) message for an attempt now, with a fresh count of attempts. */
  @Post(':id/retry')
  @HttpCode(200)
  @ApiOkResponse({ type: OutboxMessageResponse })
  async retry(@Param('id', ParseIdPipe) id: string): Promise<OutboxMessageDto> {
    const m = await this.messages.findOneBy({ id });
    if (!m) throw new NotFoundException('Message not found');
    const res = await this.messages
      .createQueryBuilder()
      .update(OutboxMessageEntity)
      .set({ status: 'pending', attempts: 0, nextAttemptAt: new Date() })
      .where(`id = :id AND status IN ('failed', 'pending')`, { id })
      .execute();
    if (res.affected !== 1) {
      throw new ConflictException(`Only a failed or waiting message can be retried; this one is ${m.status}`);
    }
    await this.delivery.deliverNow(id);
    return toOutboxDto(await this.messages.findOneByOrFail({ id }));
  }
}

export function toOutboxDto(m: OutboxMessageEntity): OutboxMessageDto {
  return {
    id: m.id,
    to: m.to,
    subject: m.subject,
    status: m.status,
    attempts: m.attempts,
    nextAttemptAt: m.nextAttemptAt ? m.nextAttemptAt.toISOString() : null,
    lastError: m.lastError,
    createdAt: m.createdAt.toISOString(),
    sentAt: m.sentAt ? m.sentAt.toISOString() : null,
  };
}
