/**
 * The payroll CSV of a period.
 *
 * Layout: one row per person and shift worked, a timesheet line (staff id, date, start, end, paid
 * hours, cost). Payroll clerks import time entries line by line, because pay rules depend on each
 * line: night and weekend premiums, public-holiday rates, which pay week a night that crosses
 * midnight falls in (common practice). A totals-per-person file would hide exactly what those rules
 * need, while the totals are one SUM or pivot away from the lines. No total rows are mixed in, so
 * every row has the same meaning and an import never mistakes a total for a shift.
 *
 * Cells that a spreadsheet would run as a formula are neutralised as in the staff export
 * (OWASP "CSV Injection"); numbers are written as plain numbers (digits and a point only).
 */
import { PAYROLL_CSV_COLUMNS } from '@rotaplex/contracts';
import { ProblemIndex, type Roster, type RosterProblem } from '@rotaplex/roster-model';
import { stringify } from 'csv-stringify/sync';
import { neutraliseCell } from '../common/csv';
import { addDays } from '../common/dates';
import { cents } from './period-figures';

export interface PayrollSource {
  problem: RosterProblem;
  roster: Roster;
  dates: string[];
  shiftCodes: Record<string, string>;
}

/** The data rows (no header), people in the problem's order, shifts by date. */
export function payrollRows(source: PayrollSource): (string | number)[][] {
  const { problem, roster, dates, shiftCodes } = source;
  const index = new ProblemIndex(problem);
  const { grid } = index.toGrid(roster);
  const weekendDays = new Set(index.weekends.flat());
  const rows: (string | number)[][] = [];
  problem.people.forEach((person, p) => {
    grid[p].forEach((s, d) => {
      if (s < 0) return;
      const shift = problem.shiftTypes[s];
      // A shift whose end is not after its start ends the next day (the roster model's convention).
      const endDate = shift.end <= shift.start ? addDays(dates[d], 1) : dates[d];
      const paid = index.paid[s];
      const rate = person.hourlyCost;
      rows.push([
        person.id,
        text(person.name),
        dates[d],
        text(shiftCodes[shift.id] ?? shift.id),
        text(shift.name),
        `${dates[d]} ${shift.start}`,
        `${endDate} ${shift.end}`,
        (paid / 60).toFixed(2),
        index.night[s] ? 'yes' : 'no',
        weekendDays.has(d) ? 'yes' : 'no',
        rate === undefined ? '' : rate.toFixed(2),
        rate === undefined ? '' : cents((rate * paid) / 60).toFixed(2),
      ]);
    });
  });
  return rows;
}

function text(value: string): string {
  return neutraliseCell(value);
}

/** CSV text with the header, RFC 4180 quoting and CRLF line ends (as the staff export). */
export function payrollCsv(source: PayrollSource): string {
  return stringify([[...PAYROLL_CSV_COLUMNS], ...payrollRows(source)], {
    record_delimiter: '\r\n',
    quoted_match: /[\r\n]/,
  });
}

/** A file name safe on every system: payroll-<unit>-<first day>-to-<last day>.csv. */
export function payrollFileName(unitName: string, dates: string[]): string {
  const slug =
    unitName
      .normalize('NFKD')
      .replace(/[^\w\s-]/g, '')
      .trim()
      .toLowerCase()
      .replace(/[\s_-]+/g, '-')
      .slice(0, 40)
      .replace(/-$/, '') || 'unit';
  return `payroll-${slug}-${dates[0]}-to-${dates[dates.length - 1]}.csv`;
}
