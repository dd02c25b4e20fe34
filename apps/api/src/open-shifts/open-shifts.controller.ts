import { Body, Controller, Get, HttpCode, Param, Post, Query } from '@nestjs/common';
import {
  ApiConflictResponse,
  ApiCreatedResponse,
  ApiNotFoundResponse,
  ApiOkResponse,
  ApiTags,
} from '@nestjs/swagger';
import {
  type NotifyOpenShiftResultDto,
  type OpenShiftDto,
  type OutsideOfferDto,
  type Page,
  type SwapRequestDto,
  type WhatItWouldTakeDto,
} from '@rotaplex/contracts';
import { type AuthUser } from '../common/auth-user';
import { RequirePermissions } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';
import {
  ClaimOpenShiftBody,
  NotifyOpenShiftBody,
  NotifyOpenShiftResponse,
  OpenShiftPageResponse,
  OpenShiftQuery,
} from './dto/open-shift.dto';
import {
  CreateOutsideOfferBody,
  FillOutsideOfferBody,
  OutsideOfferResponse,
  WhatItWouldTakeQueryDto,
  WhatItWouldTakeResponse,
} from './dto/outside-offer.dto';
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

  @Get('what-it-would-take')
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({
    type: WhatItWouldTakeResponse,
    description:
      'For one open shift: each person of the unit with the skill, not away that day, and the rules taking it would break, nearest first',
  })
  @ApiConflictResponse({ description: 'The shift is not open' })
  whatItWouldTake(
    @CurrentUser() user: AuthUser,
    @Query() query: WhatItWouldTakeQueryDto,
  ): Promise<WhatItWouldTakeDto> {
    return this.openShifts.whatItWouldTake(user, query);
  }

  @Post('outside-offers')
  @RequirePermissions('rosters:plan')
  @ApiCreatedResponse({ type: OutsideOfferResponse, description: 'The offer outside the roster, recorded' })
  @ApiConflictResponse({ description: 'The shift is not open, or already offered outside the roster' })
  offerOutside(
    @CurrentUser() user: AuthUser,
    @Body() body: CreateOutsideOfferBody,
  ): Promise<OutsideOfferDto> {
    return this.openShifts.createOutsideOffer(user, body);
  }

  @Post('outside-offers/:id/withdraw')
  @HttpCode(200)
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ type: OutsideOfferResponse, description: 'The offer, withdrawn' })
  @ApiNotFoundResponse({ description: 'No such offer' })
  @ApiConflictResponse({ description: 'Already withdrawn' })
  withdrawOutside(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
  ): Promise<OutsideOfferDto> {
    return this.openShifts.withdrawOutsideOffer(user, id);
  }

  @Post('outside-offers/:id/filled')
  @HttpCode(200)
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ type: OutsideOfferResponse, description: 'The offer, filled by people from outside' })
  @ApiNotFoundResponse({ description: 'No such offer' })
  @ApiConflictResponse({ description: 'Not waiting for an answer, or the shift is no longer open' })
  fillOutside(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Body() body: FillOutsideOfferBody,
  ): Promise<OutsideOfferDto> {
    return this.openShifts.fillOutsideOffer(user, id, body);
  }
}
