import { Controller, Get, Query, Res } from '@nestjs/common';
import { ApiNotFoundResponse, ApiOkResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import { PAYROLL_CSV_COLUMNS, type PeriodReportDto } from '@rotaplex/contracts';
import { type Response } from 'express';
import { type AuthUser } from '../common/auth-user';
import { RequirePermissions } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ReportQueryDto } from './dto/report-query.dto';
import { PeriodReportResponse } from './dto/report-response.dto';
import { ReportsService } from './reports.service';

/** Reports of a roster period for planners (reports:read, own units only). */
@ApiTags('reports')
@Controller('reports')
export class ReportsController {
  constructor(private readonly reports: ReportsService) {}

  @Get()
  @RequirePermissions('reports:read')
  @ApiOkResponse({
    type: PeriodReportResponse,
    description:
      'Hours against contract, nights and weekends and labour cost per person; cover against needs per ' +
      "date, shift type and skill; requests honoured; totals; the checker's objective terms",
  })
  @ApiNotFoundResponse({ description: 'No such roster period' })
  report(@CurrentUser() user: AuthUser, @Query() query: ReportQueryDto): Promise<PeriodReportDto> {
    return this.reports.report(user, query.periodId);
  }

  @Get('payroll.csv')
  @RequirePermissions('reports:read')
  @ApiProduces('text/csv')
  @ApiOkResponse({
    description: `One row per person and shift worked; columns ${PAYROLL_CSV_COLUMNS.join(', ')}; formula cells neutralised`,
  })
  @ApiNotFoundResponse({ description: 'No such roster period' })
  async payroll(
    @CurrentUser() user: AuthUser,
    @Query() query: ReportQueryDto,
    @Res({ passthrough: true }) res: Response,
  ): Promise<string> {
    const { fileName, csv } = await this.reports.payroll(user, query.periodId);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
    res.setHeader('Cache-Control', 'no-store');
    return csv;
  }
}
