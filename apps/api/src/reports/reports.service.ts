import { Injectable } from '@nestjs/common';
import { type PeriodReportDto } from '@rotaplex/contracts';
import { type Roster } from '@rotaplex/roster-model';
import { DataSource } from 'typeorm';
import { rosterOf } from '../assignments/assignments.service';
import { type AuthUser } from '../common/auth-user';
import { PeriodWriter } from '../roster-periods/period-writer';
import { RosterPeriodsService } from '../roster-periods/roster-periods.service';
import { type RosterInput, RosterInputService } from '../roster-input/roster-input.service';
import { payrollCsv, payrollFileName } from './payroll-csv';
import { periodFigures } from './period-figures';

/** Reports of a period's current roster, and its payroll CSV. */
@Injectable()
export class ReportsService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly periods: RosterPeriodsService,
    private readonly input: RosterInputService,
    private readonly writer: PeriodWriter,
  ) {}

  async report(user: AuthUser, periodId: string): Promise<PeriodReportDto> {
    const { input, roster } = await this.load(user, periodId);
    return {
      periodId,
      unitId: input.unit.id,
      unitName: input.unit.name,
      startDate: input.period.startDate,
      days: input.period.days,
      status: input.period.status,
      dates: input.dates,
      ...periodFigures({ problem: input.problem, roster, dates: input.dates, shiftCodes: codes(input) }),
    };
  }

  async payroll(user: AuthUser, periodId: string): Promise<{ fileName: string; csv: string }> {
    const { input, roster } = await this.load(user, periodId);
    return {
      fileName: payrollFileName(input.unit.name, input.dates),
      csv: payrollCsv({ problem: input.problem, roster, dates: input.dates, shiftCodes: codes(input) }),
    };
  }

  /** The period's problem and stored roster, read in one transaction so a solve saving meanwhile cannot mix them. */
  private async load(user: AuthUser, periodId: string): Promise<{ input: RosterInput; roster: Roster }> {
    await this.periods.get(user, periodId); // 404 unknown, 403 another unit
    return this.dataSource.transaction(async (em) => {
      const input = await this.input.load(periodId, {}, em);
      const rows = await this.writer.rowsOf(periodId, em);
      return { input, roster: rosterOf(input, rows) };
    });
  }
}

function codes(input: RosterInput): Record<string, string> {
  return Object.fromEntries(input.shiftTypes.map((s) => [s.id, s.code]));
}
