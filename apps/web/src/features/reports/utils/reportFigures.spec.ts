import type { PersonReportDto } from '@rotaplex/contracts';
import {
  coverDayRows,
  fileNameFromDisposition,
  formatHours,
  formatCost,
  formatMoney,
  hoursRows,
  hoursStatus,
  shiftsBelowMinimum,
} from './reportFigures';

const person = (over: Partial<PersonReportDto>): PersonReportDto => ({
  staffMemberId: 'p',
  name: 'Ada',
  shifts: 0,
  paidMinutes: 0,
  minPaidMinutes: null,
  maxPaidMinutes: null,
  targetPaidMinutes: null,
  deviationMinutes: null,
  nights: 0,
  weekendsWorked: 0,
  weekendDaysWorked: 0,
  hourlyCost: null,
  labourCost: null,
  requests: 0,
  requestsHonoured: 0,
  ...over,
});

describe('report figures', () => {
  it('places hours against the contract, hard limits before the target', () => {
    const c = { minPaidMinutes: 1800, maxPaidMinutes: 2880, targetPaidMinutes: 2250 };
    expect(hoursStatus(person({ ...c, paidMinutes: 1440, deviationMinutes: -810 }))).toBe('belowMin');
    expect(hoursStatus(person({ ...c, paidMinutes: 2900, deviationMinutes: 650 }))).toBe('aboveMax');
    expect(hoursStatus(person({ ...c, paidMinutes: 1900, deviationMinutes: -350 }))).toBe('underTarget');
    expect(hoursStatus(person({ ...c, paidMinutes: 2300, deviationMinutes: 50 }))).toBe('overTarget');
    expect(hoursStatus(person({ ...c, paidMinutes: 2250, deviationMinutes: 0 }))).toBe('onTarget');
    expect(hoursStatus(person({ paidMinutes: 450 }))).toBe('noContract');
  });

  it('turns minutes into hours for the chart and the table', () => {
    // 990 minutes = 16.5 hours; 2250 = 37.5; 1350 = 22.5.
    expect(hoursRows([person({ paidMinutes: 990, targetPaidMinutes: 2250, minPaidMinutes: 1350 })])).toEqual([
      { name: 'Ada', worked: 16.5, target: 37.5, min: 22.5, max: null },
    ]);
    expect(formatHours(1440)).toBe('24');
    expect(formatHours(1000)).toBe('16.67');
    expect(formatMoney(1032.45)).toBe('1,032.45');
    expect(formatCost(1032.45)).toBe('1,032.45 cost units');
  });

  it('splits each day’s needs into met target, met minimum only and below minimum', () => {
    const [row] = coverDayRows([
      {
        date: '2030-01-07',
        needs: 6,
        needsMetMin: 4,
        needsMetTarget: 3,
        shortOfMin: 3,
        shortOfTarget: 1,
        over: 0,
      },
    ]);
    expect(row).toMatchObject({ label: 'Mon 7 Jan', metTarget: 3, metMinOnly: 1, belowMin: 2 });
    expect(row.metTarget + row.metMinOnly + row.belowMin).toBe(row.needs);
  });

  it('counts shifts below minimum, not the people missing on them', () => {
    const need = (date: string, shiftTypeId: string, skillId: string | null, shortOfMin: number) => ({
      date,
      shiftTypeId,
      shiftCode: shiftTypeId,
      skillId,
      skillCode: skillId,
      min: 2,
      target: 2,
      assigned: 2 - shortOfMin,
      shortOfMin,
      shortOfTarget: 0,
      over: 0,
    });
    // Monday's night short of 2 nurses and 1 assistant is one shift; Tuesday's night is another;
    // Tuesday's early is staffed.
    expect(
      shiftsBelowMinimum([
        need('2030-01-07', 'N', 'rn', 2),
        need('2030-01-07', 'N', 'hca', 1),
        need('2030-01-08', 'N', 'rn', 1),
        need('2030-01-08', 'E', 'rn', 0),
      ]),
    ).toEqual({ shifts: 2, missing: 4 });
    expect(shiftsBelowMinimum([])).toEqual({ shifts: 0, missing: 0 });
  });

  it('reads the file name of a Content-Disposition header (RFC 6266)', () => {
    expect(fileNameFromDisposition('attachment; filename="payroll-ward-2030-01-07.csv"')).toBe(
      'payroll-ward-2030-01-07.csv',
    );
    expect(fileNameFromDisposition('attachment; filename=plain.csv')).toBe('plain.csv');
    // RFC 6266 section 5 example: filename* (RFC 5987 encoding) is preferred over filename.
    expect(
      fileNameFromDisposition(`attachment; filename="EURO rates"; filename*=utf-8''%e2%82%ac%20rates`),
    ).toBe('€ rates');
    expect(fileNameFromDisposition('attachment; filename="../../etc/passwd"')).toBe('passwd');
    expect(fileNameFromDisposition('attachment')).toBeNull();
    expect(fileNameFromDisposition(null)).toBeNull();
  });
});
