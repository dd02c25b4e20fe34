import { Body, Controller, Delete, Get, HttpCode, Param, Patch, Post, Query } from '@nestjs/common';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';
import {
  ApiConflictResponse,
  ApiCreatedResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiTags,
} from '@nestjs/swagger';
import { type LateChangesDto, type Page, type RosterPeriodDto } from '@rotaplex/contracts';
import { type AuthUser } from '../common/auth-user';
import { RequirePermissions } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import {
  CreateRosterPeriodDto,
  RosterPeriodQueryDto,
  RosterPeriodPageResponse,
  RosterPeriodResponse,
  UpdateRosterPeriodDto,
} from './dto/roster-period.dto';
import { RosterPeriodsService } from './roster-periods.service';

/** Roster periods. Planners see and change every period of their units; staff see published and archived ones. */
@ApiTags('roster periods')
@Controller('roster-periods')
export class RosterPeriodsController {
  constructor(private readonly periods: RosterPeriodsService) {}

  @Get()
  @RequirePermissions('rosters:read')
  @ApiOkResponse({ type: RosterPeriodPageResponse, description: 'A page of periods, newest first' })
  list(@CurrentUser() user: AuthUser, @Query() query: RosterPeriodQueryDto): Promise<Page<RosterPeriodDto>> {
    return this.periods.list(user, query);
  }

  @Get(':id')
  @RequirePermissions('rosters:read')
  @ApiOkResponse({ type: RosterPeriodResponse })
  get(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<RosterPeriodDto> {
    return this.periods.get(user, id);
  }

  @Get(':id/late-changes')
  @RequirePermissions('reports:read')
  @ApiOkResponse({
    description:
      'Changes to the published roster inside the notice window, who they came from, and the ' +
      'predictability pay recorded per person (the organisation records it; local law decides)',
  })
  lateChanges(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<LateChangesDto> {
    return this.periods.lateChanges(user, id);
  }

  @Post()
  @RequirePermissions('rosters:plan')
  @ApiCreatedResponse({ type: RosterPeriodResponse })
  @ApiConflictResponse({ description: 'Overlaps another period of the unit' })
  create(@CurrentUser() user: AuthUser, @Body() body: CreateRosterPeriodDto): Promise<RosterPeriodDto> {
    return this.periods.create(user, body);
  }

  @Patch(':id')
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ type: RosterPeriodResponse })
  @ApiConflictResponse({ description: 'Not a draft, changed meanwhile, or overlapping' })
  update(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Body() body: UpdateRosterPeriodDto,
  ): Promise<RosterPeriodDto> {
    return this.periods.update(user, id, body);
  }

  @Post(':id/archive')
  @HttpCode(200)
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ type: RosterPeriodResponse })
  archive(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<RosterPeriodDto> {
    return this.periods.archive(user, id);
  }

  @Delete(':id')
  @HttpCode(204)
  @RequirePermissions('rosters:plan')
  @ApiNoContentResponse()
  @ApiConflictResponse({ description: 'Only drafts can be deleted' })
  remove(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<void> {
    return this.periods.remove(user, id);
  }
}
