import { Body, Controller, Delete, Get, HttpCode, Param, Patch, Post, Put, Query } from '@nestjs/common';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';
import {
  ApiConflictResponse,
  ApiCreatedResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiTags,
} from '@nestjs/swagger';
import {
  type AvailabilityDto,
  type DateRequestDto,
  type LeaveDto,
  type MyRequestsDto,
  type Page,
  type PeriodRequestsDto,
  type RequestPeriodDto,
  type RequestRowDto,
} from '@rotaplex/contracts';
import { type AuthUser } from '../common/auth-user';
import { Authenticated, RequirePermissions } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import {
  CreateDateRequestDto,
  CreateLeaveDto,
  DateRequestQueryDto,
  DecideLeaveDto,
  LeaveQueryDto,
  MyRequestsQueryDto,
  ReplaceAvailabilityDto,
  RequestListQueryDto,
  UpdateDateRequestDto,
  UpdateRequestLimitDto,
} from './dto/requests.dto';
import {
  AvailabilityResponse,
  DateRequestPageResponse,
  DateRequestResponse,
  LeavePageResponse,
  LeaveResponse,
  MyRequestsResponse,
  PeriodRequestsResponse,
  RequestPageResponse,
  RequestPeriodResponse,
} from './dto/requests-response.dto';
import { AvailabilityService } from './availability.service';
import { DateRequestsService } from './date-requests.service';
import { LeaveService } from './leave.service';
import { RequestViews } from './request-views.service';

/**
 * Staff input: weekly availability, date requests and leave. Staff change only their own (403 for
 * anyone else's); managers read their units' and approve or decline leave.
 */
@ApiTags('requests')
@Controller()
export class RequestsController {
  constructor(
    private readonly views: RequestViews,
    private readonly availabilityInput: AvailabilityService,
    private readonly dateRequests: DateRequestsService,
    private readonly leave: LeaveService,
  ) {}

  @Get('me/requests')
  @RequirePermissions('requests:own')
  @ApiOkResponse({
    type: MyRequestsResponse,
    description:
      'Your staff memberships and open periods, with a page of your date requests and of your leave (oldest first) and their totals',
  })
  mine(@CurrentUser() user: AuthUser, @Query() query: MyRequestsQueryDto): Promise<MyRequestsDto> {
    return this.views.mine(user, query);
  }

  @Get('staff/:staffMemberId/availability')
  @Authenticated()
  @ApiOkResponse({
    type: AvailabilityResponse,
    description: 'Weekly availability (yours, or of your units for managers)',
  })
  availability(
    @CurrentUser() user: AuthUser,
    @Param('staffMemberId', ParseIdPipe) staffMemberId: string,
  ): Promise<AvailabilityDto> {
    return this.availabilityInput.get(user, staffMemberId);
  }

  @Put('staff/:staffMemberId/availability')
  @RequirePermissions('requests:own')
  @ApiOkResponse({ type: AvailabilityResponse, description: 'The weekly availability as saved' })
  replaceAvailability(
    @CurrentUser() user: AuthUser,
    @Param('staffMemberId', ParseIdPipe) staffMemberId: string,
    @Body() body: ReplaceAvailabilityDto,
  ): Promise<AvailabilityDto> {
    return this.availabilityInput.replace(user, staffMemberId, body);
  }

  @Get('date-requests')
  @Authenticated()
  @ApiOkResponse({
    type: DateRequestPageResponse,
    description: 'A page of date requests, by date: your own, or those of your units for managers',
  })
  listDateRequests(
    @CurrentUser() user: AuthUser,
    @Query() query: DateRequestQueryDto,
  ): Promise<Page<DateRequestDto>> {
    return this.dateRequests.list(user, query);
  }

  @Post('date-requests')
  @RequirePermissions('requests:own')
  @ApiCreatedResponse({ type: DateRequestResponse })
  @ApiConflictResponse({
    description: 'Not a draft period, over the limit, or a request for that date exists',
  })
  createDateRequest(
    @CurrentUser() user: AuthUser,
    @Body() body: CreateDateRequestDto,
  ): Promise<DateRequestDto> {
    return this.dateRequests.create(user, body);
  }

  @Patch('date-requests/:id')
  @RequirePermissions('requests:own')
  @ApiOkResponse({ type: DateRequestResponse })
  updateDateRequest(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Body() body: UpdateDateRequestDto,
  ): Promise<DateRequestDto> {
    return this.dateRequests.update(user, id, body);
  }

  @Delete('date-requests/:id')
  @HttpCode(204)
  @RequirePermissions('requests:own')
  @ApiNoContentResponse()
  deleteDateRequest(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<void> {
    return this.dateRequests.delete(user, id);
  }

  @Get('leave')
  @Authenticated()
  @ApiOkResponse({
    type: LeavePageResponse,
    description: 'A page of leave, by first day: your own, or of your units for managers',
  })
  listLeave(@CurrentUser() user: AuthUser, @Query() query: LeaveQueryDto): Promise<Page<LeaveDto>> {
    return this.leave.list(user, query);
  }

  @Post('leave')
  @RequirePermissions('requests:own')
  @ApiCreatedResponse({ type: LeaveResponse, description: 'The leave request (pending)' })
  @ApiConflictResponse({ description: 'Overlaps your pending or approved leave' })
  createLeave(@CurrentUser() user: AuthUser, @Body() body: CreateLeaveDto): Promise<LeaveDto> {
    return this.leave.create(user, body);
  }

  @Delete('leave/:id')
  @RequirePermissions('requests:own')
  @ApiOkResponse({ type: LeaveResponse, description: 'The cancelled leave' })
  cancelLeave(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<LeaveDto> {
    return this.leave.cancel(user, id);
  }

  @Post('leave/:id/approve')
  @HttpCode(200)
  @RequirePermissions('requests:approve')
  @ApiOkResponse({ type: LeaveResponse, description: 'The approved leave' })
  @ApiConflictResponse({ description: 'Not pending' })
  approveLeave(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Body() body: DecideLeaveDto,
  ): Promise<LeaveDto> {
    return this.leave.decide(user, id, true, body.note);
  }

  @Post('leave/:id/decline')
  @HttpCode(200)
  @RequirePermissions('requests:approve')
  @ApiOkResponse({ type: LeaveResponse, description: 'The declined leave' })
  @ApiConflictResponse({ description: 'Not pending' })
  declineLeave(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Body() body: DecideLeaveDto,
  ): Promise<LeaveDto> {
    return this.leave.decide(user, id, false, body.note);
  }

  @Get('requests')
  @RequirePermissions('requests:approve')
  @ApiOkResponse({
    type: RequestPageResponse,
    description: 'Date requests and leave of your units, one table',
  })
  listRequests(
    @CurrentUser() user: AuthUser,
    @Query() query: RequestListQueryDto,
  ): Promise<Page<RequestRowDto>> {
    return this.views.listRequests(user, query);
  }

  @Get('roster-periods/:id/requests')
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ type: PeriodRequestsResponse })
  periodRequests(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
  ): Promise<PeriodRequestsDto> {
    return this.views.periodRequests(user, id);
  }

  @Put('roster-periods/:id/request-limit')
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ type: RequestPeriodResponse, description: 'The period with its new limit' })
  setRequestLimit(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Body() body: UpdateRequestLimitDto,
  ): Promise<RequestPeriodDto> {
    return this.views.setRequestLimit(user, id, body.requestLimit);
  }
}
