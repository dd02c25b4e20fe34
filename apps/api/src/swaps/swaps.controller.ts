import { Body, Controller, Get, HttpCode, Param, Post, Query } from '@nestjs/common';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';
import {
  ApiConflictResponse,
  ApiCreatedResponse,
  ApiOkResponse,
  ApiTags,
  ApiUnprocessableEntityResponse,
} from '@nestjs/swagger';
import {
  type Page,
  type SwapLinkViewDto,
  type SwapOptionsDto,
  type SwapPreviewDto,
  type SwapRequestDto,
} from '@rotaplex/contracts';
import { type AuthUser } from '../common/auth-user';
import { Authenticated, RequirePermissions } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Public } from '../common/decorators/public.decorator';
import {
  ProposeSwapBody,
  SwapDecisionBody,
  SwapLinkDecisionBody,
  SwapLinkQuery,
  SwapListQuery,
  SwapOptionsQuery,
} from './dto/swap.dto';
import { SwapDecisions } from './swap-decisions.service';
import { SwapPlanning } from './swap-planning.service';
import { SwapReads } from './swap-reads.service';

/** Swaps and offers between staff of a published roster, and their approval by a manager. */
@ApiTags('swaps')
@Controller('swaps')
export class SwapsController {
  constructor(
    private readonly reads: SwapReads,
    private readonly planning: SwapPlanning,
    private readonly decisions: SwapDecisions,
  ) {}

  @Get()
  @Authenticated()
  @ApiOkResponse({
    description:
      'A page of { items, total, page, pageSize }, newest first. Staff: requests they are part of; managers: requests of their units',
  })
  list(@CurrentUser() user: AuthUser, @Query() query: SwapListQuery): Promise<Page<SwapRequestDto>> {
    return this.reads.list(user, query);
  }

  @Get('options')
  @RequirePermissions('requests:own')
  @ApiOkResponse({ description: 'My shifts in a published period and colleagues to swap with' })
  options(@CurrentUser() user: AuthUser, @Query() query: SwapOptionsQuery): Promise<SwapOptionsDto> {
    return this.reads.options(user, query.rosterPeriodId);
  }

  @Post('preview')
  @HttpCode(200)
  @RequirePermissions('requests:own')
  @ApiOkResponse({ description: "The checker's findings for both people after the change; nothing is saved" })
  preview(@CurrentUser() user: AuthUser, @Body() body: ProposeSwapBody): Promise<SwapPreviewDto> {
    return this.planning.preview(user, body);
  }

  @Post()
  @RequirePermissions('requests:own')
  @ApiCreatedResponse({ description: 'The request, waiting for the colleague' })
  @ApiUnprocessableEntityResponse({ description: 'The change breaks a hard rule (findings in the body)' })
  propose(@CurrentUser() user: AuthUser, @Body() body: ProposeSwapBody): Promise<SwapRequestDto> {
    return this.planning.propose(user, body);
  }

  @Get(':id')
  @Authenticated()
  @ApiOkResponse({ description: 'One swap, offer or open-shift claim the caller takes part in or manages' })
  get(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<SwapRequestDto> {
    return this.reads.get(user, id);
  }

  @Post(':id/decision')
  @HttpCode(200)
  @Authenticated()
  @ApiOkResponse({ description: 'The request after the decision' })
  @ApiConflictResponse({ description: 'Already decided, or the roster changed since the proposal' })
  decide(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Body() body: SwapDecisionBody,
  ): Promise<SwapRequestDto> {
    return this.decisions.decide(user, id, body);
  }

  @Post(':id/cancel')
  @HttpCode(200)
  @Authenticated() // only the proposer may cancel: checked by the service
  @ApiOkResponse({ description: 'The cancelled request' })
  cancel(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<SwapRequestDto> {
    return this.decisions.cancel(user, id);
  }
}

/**
 * E-mailed decision links (no sign-in): GET shows what the link decides and changes nothing, so a
 * mail scanner fetching it decides nothing; POST makes the decision and uses the link up.
 */
@ApiTags('swaps')
@Controller('swap-links')
export class SwapLinksController {
  constructor(private readonly decisions: SwapDecisions) {}

  @Get()
  @Public()
  view(@Query() query: SwapLinkQuery): Promise<SwapLinkViewDto> {
    return this.decisions.viewLink(query.token);
  }

  @Post()
  @Public()
  @HttpCode(200)
  decide(@Body() body: SwapLinkDecisionBody): Promise<SwapRequestDto> {
    const { token, ...decision } = body;
    return this.decisions.decideByLink(token, decision);
  }
}
