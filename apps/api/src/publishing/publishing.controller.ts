import { Body, Controller, Get, HttpCode, Param, Post, Query, Res } from '@nestjs/common';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';
import { RedFlagResponse } from '../common/red-flag.dto';
import {
  ApiAcceptedResponse,
  ApiConflictResponse,
  ApiOkResponse,
  ApiProduces,
  ApiProperty,
  ApiTags,
  ApiUnprocessableEntityResponse,
} from '@nestjs/swagger';
import {
  AUDIT_KINDS,
  type AuditEntryDto,
  type AuditKind,
  type Page,
  type BelowMinimumShiftDto,
  type PublishCheckDto,
  PUBLISH_REASON_MAX_LENGTH,
  type PublishRequest,
  type PublishResultDto,
  type RosterViolationDto,
  type UnhonouredLeaveDto,
  REPAIR_TIME_LIMIT_MAX_SECONDS,
  REPAIR_TIME_LIMIT_MIN_SECONDS,
  type RepairRequest,
  type SolveRunStartedDto,
} from '@rotaplex/contracts';
import {
  IsBoolean,
  IsInt,
  IsOptional,
  IsString,
  Matches,
  Max,
  MaxLength,
  Min,
  ValidateIf,
} from 'class-validator';
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

  @ApiProperty({
    required: false,
    description:
      'Must be true to publish a roster with shifts below minimum cover (a reason is then required)',
  })
  @IsOptional()
  @IsBoolean({ message: 'acknowledgeBelowMinimum must be true or false' })
  acknowledgeBelowMinimum?: boolean;

  @ApiProperty({
    required: false,
    maxLength: PUBLISH_REASON_MAX_LENGTH,
    description: 'Why the roster is published below minimum cover; kept in the audit trail',
  })
  @ValidateIf((o: PublishDto) => o.acknowledgeBelowMinimum === true || o.reason !== undefined)
  @IsString({ message: 'reason must be text saying why the roster is published below minimum cover' })
  @Matches(/\S/, { message: 'reason must say why the roster is published below minimum cover' })
  @MaxLength(PUBLISH_REASON_MAX_LENGTH, {
    message: `reason must be at most ${PUBLISH_REASON_MAX_LENGTH} characters`,
  })
  reason?: string;
}

class BelowMinimumShiftResponse implements BelowMinimumShiftDto {
  @ApiProperty() date!: string;
  @ApiProperty({ format: 'uuid' }) shiftTypeId!: string;
  @ApiProperty() shiftCode!: string;
  @ApiProperty() shiftName!: string;
  @ApiProperty({ type: String, nullable: true }) skillId!: string | null;
  @ApiProperty({ type: String, nullable: true }) skillCode!: string | null;
  @ApiProperty() min!: number;
  @ApiProperty() onShift!: number;
  @ApiProperty({ description: 'Nobody of the required skill is on the shift' }) none!: boolean;
  @ApiProperty({ type: [String] }) reasons!: string[];
}

class FindingResponse implements RosterViolationDto {
  @ApiProperty() rule!: string;
  @ApiProperty() staffMemberId!: string;
  @ApiProperty({ type: [String] }) dates!: string[];
  @ApiProperty() message!: string;
  @ApiProperty({ nullable: true, type: String }) warning!: string | null;
}

class UnhonouredLeaveResponse implements UnhonouredLeaveDto {
  @ApiProperty() staffMemberId!: string;
  @ApiProperty() name!: string;
  @ApiProperty() date!: string;
  @ApiProperty() shiftTypeId!: string;
  @ApiProperty() shiftCode!: string;
}

export class PublishCheckResponse implements PublishCheckDto {
  @ApiProperty({ format: 'uuid' }) rosterPeriodId!: string;
  @ApiProperty() version!: number;
  @ApiProperty() shifts!: number;
  @ApiProperty() people!: number;
  @ApiProperty({
    type: [RedFlagResponse],
    description: 'Red flags of safe staffing (NICE SG1 2014) on shifts needing a registered skill',
  })
  redFlags!: RedFlagResponse[];
  @ApiProperty({ type: [BelowMinimumShiftResponse] }) belowMinimum!: BelowMinimumShiftResponse[];
  @ApiProperty({ type: [FindingResponse] }) ruleFindings!: FindingResponse[];
  @ApiProperty({ type: [UnhonouredLeaveResponse] }) unhonouredLeave!: UnhonouredLeaveResponse[];
  @ApiProperty({ type: String, nullable: true }) lateNotice!: string | null;
  @ApiProperty({ type: [String] }) cautions!: string[];
  @ApiProperty({ type: [String] }) blockers!: string[];
  @ApiProperty() needsAcknowledgement!: boolean;
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

  @Get(':id/publish-check')
  @ApiOkResponse({
    type: PublishCheckResponse,
    description: 'Shifts below minimum cover, rule findings, unhonoured leave and cautions before publishing',
  })
  publishCheck(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
  ): Promise<PublishCheckDto> {
    return this.publishing.publishCheck(user, id);
  }

  @Post(':id/publish')
  @HttpCode(200)
  @ApiOkResponse({ type: PublishResultResponse })
  @ApiConflictResponse({
    description: 'Stale version, not a draft, or a solve is running',
    type: ApiErrorResponse,
  })
  @ApiUnprocessableEntityResponse({
    description: 'No shifts at all, or shifts below minimum cover without acknowledgement and reason',
    type: ApiErrorResponse,
  })
  publish(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Body() body: PublishDto,
  ): Promise<PublishResultDto> {
    return this.publishing.publish(user, id, body);
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
    @Param('id', ParseIdPipe) id: string,
    @Body() body: RepairDto,
  ): Promise<SolveRunStartedDto> {
    return this.publishing.repair(user, id, body.timeLimitSeconds);
  }

  @Get(':id/audit')
  @ApiOkResponse({ type: AuditPageResponse })
  audit(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Query() query: PageQueryDto,
  ): Promise<Page<AuditEntryDto>> {
    return this.publishing.auditTrail(user, id, query);
  }

  @Get(':id/export')
  @ApiProduces('text/csv')
  @ApiOkResponse({ description: "The period's roster and its audit trail as CSV", type: String })
  async export(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Res({ passthrough: true }) res: Response,
  ): Promise<string> {
    const { filename, csv } = await this.publishing.exportCsv(user, id);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${filename}"`);
    return csv;
  }
}
