import { Body, Controller, Get, HttpCode, Param, Post, Put, Query, Req } from '@nestjs/common';
import {
  ApiBadRequestResponse,
  ApiBody,
  ApiConsumes,
  ApiCreatedResponse,
  ApiOkResponse,
  ApiTags,
} from '@nestjs/swagger';
import {
  type AcceptDemandPlanResultDto,
  type CsvImportResult,
  DEMAND_CSV_COLUMNS,
  type DemandAcceptanceDto,
  type DemandPlanDto,
  type UnitDemandDto,
} from '@rotaplex/contracts';
import { type Request } from 'express';
import { type AuthUser } from '../common/auth-user';
import { RequirePermissions } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';
import { readCsvBody } from '../common/csv';
import { CsvImportResponse } from '../common/csv-import.dto';
import { DemandService } from './demand.service';
import { AcceptDemandPlanDto, DemandImportQueryDto, PutUnitDemandDto } from './dto/demand.dto';

/** A unit's demand: contact forecast per interval, ward patients and ratios. Planners only. */
@ApiTags('demand')
@Controller('units/:unitId/demand')
export class UnitDemandController {
  constructor(private readonly demand: DemandService) {}

  @Get()
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ description: 'UnitDemandDto (both parts null when never saved)' })
  get(@CurrentUser() user: AuthUser, @Param('unitId', ParseIdPipe) unitId: string): Promise<UnitDemandDto> {
    return this.demand.get(user, unitId);
  }

  @Put()
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ description: 'UnitDemandDto: both parts replaced' })
  put(
    @CurrentUser() user: AuthUser,
    @Param('unitId', ParseIdPipe) unitId: string,
    @Body() body: PutUnitDemandDto,
  ): Promise<UnitDemandDto> {
    return this.demand.put(user, unitId, body);
  }

  @Post('contacts/import')
  @HttpCode(200)
  @RequirePermissions('rosters:plan')
  @ApiConsumes('text/csv')
  @ApiBody({
    schema: { type: 'string' },
    description: `CSV with a header line; columns ${DEMAND_CSV_COLUMNS.join(', ')} (aht in seconds)`,
  })
  @ApiOkResponse({ type: CsvImportResponse })
  @ApiBadRequestResponse({ type: CsvImportResponse, description: 'A bad row: nothing saved' })
  async importContacts(
    @CurrentUser() user: AuthUser,
    @Param('unitId', ParseIdPipe) unitId: string,
    @Query() query: DemandImportQueryDto,
    @Req() req: Request,
  ): Promise<CsvImportResult> {
    const body = await readCsvBody(req);
    return this.demand.importContacts(user, unitId, query, body);
  }
}

/** The requirement and covering plan of a roster period, and the step that accepts it. Planners only. */
@ApiTags('demand')
@Controller('roster-periods/:periodId/demand-plan')
export class DemandPlanController {
  constructor(private readonly demand: DemandService) {}

  @Get()
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({
    description: 'DemandPlanDto: requirement per interval, shift starts, cautions (nothing saved)',
  })
  plan(
    @CurrentUser() user: AuthUser,
    @Param('periodId', ParseIdPipe) periodId: string,
  ): Promise<DemandPlanDto> {
    return this.demand.plan(user, periodId);
  }

  @Post('accept')
  @RequirePermissions('rosters:plan')
  @ApiCreatedResponse({
    description: 'AcceptDemandPlanResultDto: the rows became date overrides of the cover needs',
  })
  accept(
    @CurrentUser() user: AuthUser,
    @Param('periodId', ParseIdPipe) periodId: string,
    @Body() body: AcceptDemandPlanDto,
  ): Promise<AcceptDemandPlanResultDto> {
    return this.demand.accept(user, periodId, body);
  }

  @Get('acceptances')
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ description: 'DemandAcceptanceDto[], newest first' })
  acceptances(
    @CurrentUser() user: AuthUser,
    @Param('periodId', ParseIdPipe) periodId: string,
  ): Promise<DemandAcceptanceDto[]> {
    return this.demand.listAcceptances(user, periodId);
  }
}
