import { Body, Controller, Delete, Get, HttpCode, Param, Post, Put, Query, Req } from '@nestjs/common';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';
import {
  ApiBadRequestResponse,
  ApiBody,
  ApiConsumes,
  ApiCreatedResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiTags,
} from '@nestjs/swagger';
import {
  COVER_CSV_COLUMNS,
  type CoverNeedsDto,
  type CoverOverrideDto,
  type CsvImportResult,
} from '@rotaplex/contracts';
import { type Request } from 'express';
import { type AuthUser } from '../common/auth-user';
import { RequirePermissions } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { readCsvBody } from '../common/csv';
import { CsvImportResponse } from '../common/csv-import.dto';
import { CoverNeedsService } from './cover-needs.service';
import {
  CoverImportQueryDto,
  CoverNeedsResponse,
  CoverOverrideResponse,
  CreateCoverOverrideDto,
  ReplaceCoverPatternDto,
} from './dto/cover-need.dto';

/** Cover needs of a unit: a weekly pattern and date overrides, per shift type and skill. Planners only. */
@ApiTags('cover needs')
@Controller('units/:unitId/cover-needs')
export class CoverNeedsController {
  constructor(private readonly needs: CoverNeedsService) {}

  @Get()
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ type: CoverNeedsResponse })
  get(@CurrentUser() user: AuthUser, @Param('unitId', ParseIdPipe) unitId: string): Promise<CoverNeedsDto> {
    return this.needs.get(user, unitId);
  }

  @Put('pattern')
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ type: CoverNeedsResponse, description: 'The whole pattern was replaced' })
  replacePattern(
    @CurrentUser() user: AuthUser,
    @Param('unitId', ParseIdPipe) unitId: string,
    @Body() body: ReplaceCoverPatternDto,
  ): Promise<CoverNeedsDto> {
    return this.needs.replacePattern(user, unitId, body.rows);
  }

  @Post('overrides')
  @RequirePermissions('rosters:plan')
  @ApiCreatedResponse({
    type: CoverOverrideResponse,
    description: 'Replaces one with the same date, shift and skill',
  })
  putOverride(
    @CurrentUser() user: AuthUser,
    @Param('unitId', ParseIdPipe) unitId: string,
    @Body() body: CreateCoverOverrideDto,
  ): Promise<CoverOverrideDto> {
    return this.needs.putOverride(user, unitId, body);
  }

  @Delete('overrides/:id')
  @HttpCode(204)
  @RequirePermissions('rosters:plan')
  @ApiNoContentResponse()
  removeOverride(
    @CurrentUser() user: AuthUser,
    @Param('unitId', ParseIdPipe) unitId: string,
    @Param('id', ParseIdPipe) id: string,
  ): Promise<void> {
    return this.needs.removeOverride(user, unitId, id);
  }

  @Post('import')
  @HttpCode(200)
  @RequirePermissions('rosters:plan')
  @ApiConsumes('text/csv')
  @ApiBody({
    schema: { type: 'string' },
    description: `CSV with a header line; columns ${COVER_CSV_COLUMNS.join(', ')} (skill may be empty)`,
  })
  @ApiOkResponse({ type: CsvImportResponse })
  @ApiBadRequestResponse({ type: CsvImportResponse, description: 'A bad row: nothing saved' })
  async importCsv(
    @CurrentUser() user: AuthUser,
    @Param('unitId', ParseIdPipe) unitId: string,
    @Query() query: CoverImportQueryDto,
    @Req() req: Request,
  ): Promise<CsvImportResult> {
    const body = await readCsvBody(req);
    return this.needs.importCsv(user, unitId, query, body);
  }
}
