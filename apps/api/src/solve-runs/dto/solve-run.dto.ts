import { ApiProperty, ApiPropertyOptional, OmitType, PickType } from '@nestjs/swagger';
import {
  type Page,
  SOLVE_RUN_MODES,
  SOLVE_RUN_STATUSES,
  SOLVE_TIME_LIMIT_MAX_SECONDS,
  SOLVE_TIME_LIMIT_MIN_SECONDS,
  SOLVE_WEIGHT_MAX,
  type SolveProgressDto,
  type SolveRunDto,
  type SolveRunModeName,
  type SolveRunResultDto,
  type SolveRunStartedDto,
  type SolveRunStatus,
  type SolveRunSummaryDto,
  type SolveWeights,
  type StartSolveRunRequest,
} from '@rotaplex/contracts';
import { Type } from 'class-transformer';
import { IsInt, IsNumber, IsObject, IsOptional, Max, Min, ValidateNested } from 'class-validator';
import { PageQueryDto } from '../../common/pagination';

const weight = () => {
  const decorators = [
    ApiPropertyOptional({ minimum: 0, maximum: SOLVE_WEIGHT_MAX }),
    IsOptional(),
    IsNumber({ allowNaN: false, allowInfinity: false }),
    Min(0),
    Max(SOLVE_WEIGHT_MAX),
  ];
  return (target: object, key: string) => decorators.forEach((d) => d(target, key));
};

/** Weights of the goals; an absent weight keeps the model's default. */
export class SolveWeightsDto implements SolveWeights {
  @weight() coverUnderMin?: number;
  @weight() coverUnderTarget?: number;
  @weight() coverOver?: number;
  @weight() requests?: number;
  @weight() fairNights?: number;
  @weight() fairWeekends?: number;
  @weight() hoursDeviation?: number;
  @weight() labourCost?: number;
}

export class StartSolveRunDto implements StartSolveRunRequest {
  @ApiProperty({ minimum: SOLVE_TIME_LIMIT_MIN_SECONDS, maximum: SOLVE_TIME_LIMIT_MAX_SECONDS, example: 30 })
  @IsInt({ message: 'timeLimitSeconds must be a whole number of seconds' })
  @Min(SOLVE_TIME_LIMIT_MIN_SECONDS, {
    message: `timeLimitSeconds must be at least ${SOLVE_TIME_LIMIT_MIN_SECONDS}`,
  })
  @Max(SOLVE_TIME_LIMIT_MAX_SECONDS, {
    message: `timeLimitSeconds must be at most ${SOLVE_TIME_LIMIT_MAX_SECONDS}`,
  })
  timeLimitSeconds!: number;

  @ApiPropertyOptional({ type: SolveWeightsDto })
  @IsOptional()
  @IsObject({ message: 'weights must be an object' })
  @ValidateNested()
  @Type(() => SolveWeightsDto)
  weights?: SolveWeightsDto;
}

export class SolveRunStartedResponse implements SolveRunStartedDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
}

class SolveProgressResponse implements SolveProgressDto {
  @ApiProperty() elapsedSeconds!: number;
  @ApiProperty({ nullable: true, type: Number }) objective!: number | null;
  @ApiProperty({ nullable: true, type: Number }) bound!: number | null;
  @ApiProperty({ nullable: true, type: Number }) gap!: number | null;
}

export class SolveRunResponse implements SolveRunDto {
  @ApiProperty({ format: 'uuid' }) id!: string;
  @ApiProperty({ format: 'uuid' }) rosterPeriodId!: string;
  @ApiProperty({ enum: SOLVE_RUN_STATUSES }) status!: SolveRunStatus;
  @ApiProperty({ enum: SOLVE_RUN_MODES }) mode!: SolveRunModeName;
  @ApiProperty({ nullable: true, type: String }) requestedById!: string | null;
  @ApiProperty() timeLimitSeconds!: number;
  @ApiProperty({ type: SolveWeightsDto }) weights!: SolveWeights;
  @ApiProperty({ type: SolveProgressResponse, nullable: true }) progress!: SolveProgressDto | null;
  @ApiProperty({
    type: 'object',
    nullable: true,
    description:
      'solverStatus, objective, bound, gap, quality, staffing, staffingStatement, explanations, terms',
    additionalProperties: true,
  })
  result!: SolveRunResultDto | null;
  @ApiProperty({ nullable: true, type: String }) errorMessage!: string | null;
  @ApiProperty() createdAt!: string;
  @ApiProperty({ nullable: true, type: String }) startedAt!: string | null;
  @ApiProperty({ nullable: true, type: String }) finishedAt!: string | null;
}

export class SolveRunSummaryResponse
  extends OmitType(SolveRunResponse, ['result'] as const)
  implements SolveRunSummaryDto {}

export class SolveRunPageResponse implements Page<SolveRunSummaryDto> {
  @ApiProperty({ type: [SolveRunSummaryResponse] }) items!: SolveRunSummaryResponse[];
  @ApiProperty() total!: number;
  @ApiProperty() page!: number;
  @ApiProperty() pageSize!: number;
}

/** page (from 1) and pageSize (1 to MAX_PAGE_SIZE, default 20); the runs come newest first. */
export class SolveRunListQuery extends PickType(PageQueryDto, ['page', 'pageSize'] as const) {}
