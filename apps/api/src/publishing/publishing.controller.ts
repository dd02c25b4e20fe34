import { Body, Controller, Get, HttpCode, Param, ParseUUIDPipe, Post, Query, Res } from '@nestjs/common';
import {
  ApiAcceptedResponse,
  ApiConflictResponse,
  ApiOkResponse,
  ApiProduces,
  ApiProperty,
  ApiTags,
} from '@nestjs/swagger';
import {
  AUDIT_KINDS,
  type AuditEntryDto,
  type AuditKind,
  type Page,
  type PublishRequest,
  type PublishResultDto,
  REPAIR_TIME_LIMIT_MAX_SECONDS,
  REPAIR_TIME_LIMIT_MIN_SECONDS,
  type RepairRequest,
  type SolveRunStartedDto,
} from '@rotaplex/contracts';
import { IsInt, Max, Min } from 'class-validator';
import { type Response } from 'express';
import { ApiErrorResponse } from '../common/api-error.dto';
import { type AuthUser } from '../common/auth-user';
import { RequirePermissions } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { PageQueryDto } from '../common/pagination';
import { SolveRunStartedResponse } from '../solve-runs/dto/solve-run.dto';
import { PublishingService } from './publishing.service';

export class PublishDto implements PublishRequest {
  @ApiProperty({ description: "The period's version as last read (optimistic lock)", minimum: 1 })
  @IsInt({ message: 'version must be a whole number' })
  @Min(1, { message: 'version must be at least 1' })
  version!: number;
}

export class RepairDto implements RepairRequest {
  @ApiProperty({
    minimum: REPAIR_TIME_LIMIT_MIN_SECONDS,
    maximum: REPAIR_TIME_LIMIT_MAX_SECONDS,
    example: 10,
  })
  @IsInt({ message: 'timeLimitSeconds must be a whole number of seconds' })
  @Min(REPAIR_TIME_LIMIT_MIN_SECONDS, {
    message: `timeLimitSeconds must be at least ${REPAIR_TIME_LIMIT_MIN_SECONDS}`,
  })
  @Max(REPAIR_TIME_LIMIT_MAX_SECONDS, {
    message: `timeLimitSeconds must be at most ${REPAIR_TIME_LIMIT_MAX_SECONDS}`,
  })
  timeLimitSeconds!: number;
}

export class PublishResultResponse implements PublishResultDto {
  @ApiProperty({ format: 'uuid' }) rosterPeriodId!: string;
  @ApiProperty({ enum: ['published'] }) status!: 'published';
  @ApiProperty({ format: 'date-time' }) publishedAt!: string;
  @ApiProperty() version!: number;
  @ApiProperty({ description: 'People e-mailed their shifts (through the outbox)' }) emailed!: number;
}

export class AuditEntryResponse implements AuditEntryDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
  @ApiProperty({ format: 'uuid' }) rosterPeriodId!: string;
  @ApiProperty({ type: String, format: 'uuid', nullable: true }) actorUserId!: string | null;
  @ApiProperty() actorName!: string;
  @ApiProperty({ enum: AUDIT_KINDS }) kind!: AuditKind;
  @ApiProperty({ format: 'date-time' }) at!: string;
  @ApiProperty() summary!: string;
  @ApiProperty({ description: 'State before the change (JSON)', nullable: true }) before!: unknown;
  @ApiProperty({ description: 'State after the change (JSON)', nullable: true }) after!: unknown;
}

export class AuditPageResponse implements Page<AuditEntryDto> {
  @ApiProperty({ type: [AuditEntryResponse] }) items!: AuditEntryResponse[];
  @ApiProperty() total!: number;
  @ApiProperty() page!: number;
  @ApiProperty() pageSize!: number;
}

/** Publish and repair a period's roster; its audit trail and CSV export (planners of the unit). */
@ApiTags('publishing')
@Controller('roster-periods')
@RequirePermissions('rosters:plan')
export class PublishingController {
  constructor(private readonly publishing: PublishingService) {}

  @Post(':id/publish')
  @HttpCode(200)
  @ApiOkResponse({ type: PublishResultResponse })
  @ApiConflictResponse({
    description: 'Stale version, not a draft, or a solve is running',
    type: ApiErrorResponse,
  })
  publish(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() body: PublishDto,
  ): Promise<PublishResultDto> {
    return this.publishing.publish(user, id, body.version);
  }

  @Post(':id/repair')
  @HttpCode(202)
  @ApiAcceptedResponse({
    type: SolveRunStartedResponse,
    description: 'A repair solve run, queued; follow it by its id',
  })
  @ApiConflictResponse({
    description: 'Not published, or a solve is already running',
    type: ApiErrorResponse,
  })
  repair(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() body: RepairDto,
  ): Promise<SolveRunStartedDto> {
    return this.publishing.repair(user, id, body.timeLimitSeconds);
  }

  @Get(':id/audit')
  @ApiOkResponse({ type: AuditPageResponse })
  audit(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseUUIDPipe) id: string,
    @Query() query: PageQueryDto,
  ): Promise<Page<AuditEntryDto>> {
    return this.publishing.auditTrail(user, id, query);
  }

  @Get(':id/export')
  @ApiProduces('text/csv')
  @ApiOkResponse({ description: "The period's roster and its audit trail as CSV", type: String })
  async export(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseUUIDPipe) id: string,
    @Res({ passthrough: true }) res: Response,
  ): Promise<string> {
    const { filename, csv } = await this.publishing.exportCsv(user, id);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${filename}"`);
    return csv;
  }
}
