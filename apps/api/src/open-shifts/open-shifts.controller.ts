import { Body, Controller, Get, Post, Query } from '@nestjs/common';
import {
  ApiConflictResponse,
  ApiCreatedResponse,
  ApiOkResponse,
  ApiProperty,
  ApiPropertyOptional,
  ApiTags,
} from '@nestjs/swagger';
import { type ClaimOpenShiftDto, type OpenShiftDto, type SwapRequestDto } from '@rotaplex/contracts';
import { IsOptional, IsString, IsUUID, MaxLength, ValidateIf } from 'class-validator';
import { type AuthUser } from '../common/auth-user';
import { RequirePermissions } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { OpenShiftsService } from './open-shifts.service';
import { IsIsoDate } from '../common/decorators/is-iso-date.decorator';

export class OpenShiftQuery {
  @ApiPropertyOptional({ format: 'uuid' })
  @IsOptional()
  @IsUUID('all', { message: 'rosterPeriodId must be a roster period id' })
  rosterPeriodId?: string;
}

export class ClaimOpenShiftBody implements ClaimOpenShiftDto {
  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'rosterPeriodId must be a roster period id' })
  rosterPeriodId!: string;

  @ApiProperty({ example: '2027-01-04' })
  @IsIsoDate()
  date!: string;

  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'shiftTypeId must be a shift type id' })
  shiftTypeId!: string;

  @ApiProperty({ format: 'uuid', nullable: true, type: String })
  @ValidateIf((_o, v) => v !== null)
  @IsUUID('all', { message: 'skillId must be a skill id or null' })
  skillId!: string | null;

  @ApiPropertyOptional({ maxLength: 500 })
  @IsOptional()
  @IsString()
  @MaxLength(500, { message: 'note must be at most 500 characters' })
  note?: string;
}

/** Cover still unmet on published rosters; staff see only what they may claim. */
@ApiTags('open-shifts')
@Controller('open-shifts')
export class OpenShiftsController {
  constructor(private readonly openShifts: OpenShiftsService) {}

  @Get()
  @RequirePermissions('rosters:read')
  @ApiOkResponse({
    description: 'Staff: open shifts they could claim; managers: every open shift of their units',
  })
  list(@CurrentUser() user: AuthUser, @Query() query: OpenShiftQuery): Promise<OpenShiftDto[]> {
    return this.openShifts.list(user, query.rosterPeriodId);
  }

  @Post('claims')
  @RequirePermissions('requests:own')
  @ApiCreatedResponse({ description: 'The claim, waiting for a manager' })
  @ApiConflictResponse({ description: 'The shift is no longer open' })
  claim(@CurrentUser() user: AuthUser, @Body() body: ClaimOpenShiftBody): Promise<SwapRequestDto> {
    return this.openShifts.claim(user, body);
  }
}
