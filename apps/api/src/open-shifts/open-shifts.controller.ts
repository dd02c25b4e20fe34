import { Body, Controller, Get, Post, Query } from '@nestjs/common';
import { ApiConflictResponse, ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import {
  type NotifyOpenShiftResultDto,
  type OpenShiftDto,
  type Page,
  type SwapRequestDto,
} from '@rotaplex/contracts';
import { type AuthUser } from '../common/auth-user';
import { RequirePermissions } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import {
  ClaimOpenShiftBody,
  NotifyOpenShiftBody,
  NotifyOpenShiftResponse,
  OpenShiftPageResponse,
  OpenShiftQuery,
} from './dto/open-shift.dto';
import { OpenShiftsService } from './open-shifts.service';

/** Cover still unmet on published rosters; staff see only what they may claim. */
@ApiTags('open-shifts')
@Controller('open-shifts')
export class OpenShiftsController {
  constructor(private readonly openShifts: OpenShiftsService) {}

  @Get()
  @RequirePermissions('rosters:read')
  @ApiOkResponse({
    type: OpenShiftPageResponse,
    description:
      'Staff: open shifts they could claim; managers: every open shift of their units. By date, then unit, shift and skill.',
  })
  list(@CurrentUser() user: AuthUser, @Query() query: OpenShiftQuery): Promise<Page<OpenShiftDto>> {
    return this.openShifts.list(user, query);
  }

  @Post('notify')
  @RequirePermissions('rosters:plan')
  @ApiCreatedResponse({
    type: NotifyOpenShiftResponse,
    description: 'How many people who may take it were e-mailed',
  })
  @ApiConflictResponse({ description: 'The shift is not open' })
  notify(
    @CurrentUser() user: AuthUser,
    @Body() body: NotifyOpenShiftBody,
  ): Promise<NotifyOpenShiftResultDto> {
    return this.openShifts.notify(user, body);
  }

  @Post('claims')
  @RequirePermissions('requests:own')
  @ApiCreatedResponse({ description: 'The claim, waiting for a manager' })
  @ApiConflictResponse({ description: 'The shift is no longer open' })
  claim(@CurrentUser() user: AuthUser, @Body() body: ClaimOpenShiftBody): Promise<SwapRequestDto> {
    return this.openShifts.claim(user, body);
  }
}
