import { Controller, Get, HttpCode, Post, Query, Req } from '@nestjs/common';
import { ApiBadRequestResponse, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import { type CalendarFeedDto, type MyRosterDto } from '@rotaplex/contracts';
import { type Request } from 'express';
import { ApiErrorResponse } from '../common/api-error.dto';
import { type AuthUser } from '../common/auth-user';
import { RequirePermissions } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { CalendarFeedsService } from './calendar-feeds.service';
import { CalendarFeedResponse, MyRosterQueryDto, MyRosterResponse } from './dto/my-roster.dto';
import { MyRosterService } from './my-roster.service';

/** Origin of the request, for feed URLs when PUBLIC_URL is not set. */
const originOf = (req: Request) => `${req.protocol}://${req.get('host') ?? 'localhost'}`;

/** The caller's own roster and calendar feed. */
@ApiTags('my roster')
@Controller('me')
@RequirePermissions('rosters:read')
export class MyRosterController {
  constructor(
    private readonly roster: MyRosterService,
    private readonly feeds: CalendarFeedsService,
  ) {}

  @Get('shifts')
  @ApiOperation({
    summary: "My published shifts and my units' published shifts (colleagues: name and shift only)",
  })
  @ApiOkResponse({ type: MyRosterResponse })
  @ApiBadRequestResponse({
    type: ApiErrorResponse,
    description: 'from/to malformed, reversed or too far apart',
  })
  shifts(@CurrentUser() user: AuthUser, @Query() query: MyRosterQueryDto): Promise<MyRosterDto> {
    return this.roster.shifts(user, query);
  }

  @Get('calendar-feed')
  @ApiOperation({ summary: 'The secret URL of my iCalendar feed (created on first use)' })
  @ApiOkResponse({ type: CalendarFeedResponse })
  calendarFeed(@CurrentUser() user: AuthUser, @Req() req: Request): Promise<CalendarFeedDto> {
    return this.feeds.url(user, originOf(req));
  }

  @Post('calendar-feed/regenerate')
  @HttpCode(200)
  @ApiOperation({ summary: 'A new secret feed URL; the old one stops working' })
  @ApiOkResponse({ type: CalendarFeedResponse })
  regenerate(@CurrentUser() user: AuthUser, @Req() req: Request): Promise<CalendarFeedDto> {
    return this.feeds.regenerate(user, originOf(req));
  }
}
