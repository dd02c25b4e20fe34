import { PAYROLL_CSV_COLUMNS } from '@rotaplex/contracts';
import { type RosterProblem } from '@rotaplex/roster-model';
import { parse } from 'csv-parse/sync';
import { payrollCsv, payrollFileName } from './payroll-csv';

// Invented week; 2030-01-07 is a Monday, so 2030-01-12 is a Saturday.
const DATES = [
  '2030-01-07',
  '2030-01-08',
  '2030-01-09',
  '2030-01-10',
  '2030-01-11',
  '2030-01-12',
  '2030-01-13',
];
const PROBLEM: RosterProblem = {
  startDate: DATES[0],
  days: 7,
  timeZone: 'Europe/London',
  shiftTypes: [
    { id: 'e-id', name: 'Early', start: '07:00', end: '15:00', paidMinutes: 450 },
    { id: 'n-id', name: 'Night', start: '22:00', end: '07:30', paidMinutes: 540, night: true },
  ],
  people: [
    { id: 'p1', name: 'Ada Byrne', skills: [], hourlyCost: 24.5, contract: {} },
    { id: 'p2', name: '=HYPERLINK("http://x","y")', skills: [], contract: {} },
  ],
  coverNeeds: [],
  requests: [],
  absences: [],
  forbiddenSuccessions: [],
  pins: [],
};

describe('payroll CSV', () => {
  const csv = payrollCsv({
    problem: PROBLEM,
    roster: {
      p1: ['e-id', null, null, null, null, 'n-id', null],
      p2: [null, 'e-id', null, null, null, null, null],
    },
    dates: DATES,
    shiftCodes: { 'e-id': 'E', 'n-id': 'N' },
  });
  const rows = parse(csv, { columns: true }) as Record<string, string>[];

  it('has the header and one row per person and shift worked', () => {
    expect(csv.split('\r\n')[0]).toBe(PAYROLL_CSV_COLUMNS.join(','));
    expect(rows.map((r) => [r.name, r.date, r.shift_code])).toEqual([
      ['Ada Byrne', '2030-01-07', 'E'],
      ['Ada Byrne', '2030-01-12', 'N'],
      [`'=HYPERLINK("http://x","y")`, '2030-01-08', 'E'],
    ]);
  });

  it('writes times, paid hours and cost per line (worked by hand)', () => {
    // Early: 450 paid minutes = 7.50 h; 7.5 × 24.50 = 183.75.
    expect(rows[0]).toMatchObject({
      staff_id: 'p1',
      start: '2030-01-07 07:00',
      end: '2030-01-07 15:00',
      paid_hours: '7.50',
      night: 'no',
      weekend: 'no',
      hourly_cost: '24.50',
      cost: '183.75',
    });
    // Night from Saturday 22:00 ends Sunday 07:30; 540 minutes = 9.00 h; 9 × 24.50 = 220.50.
    expect(rows[1]).toMatchObject({
      start: '2030-01-12 22:00',
      end: '2030-01-13 07:30',
      paid_hours: '9.00',
      night: 'yes',
      weekend: 'yes',
      cost: '220.50',
    });
    // Unknown hourly cost: empty cost cells, hours still there.
    expect(rows[2]).toMatchObject({ paid_hours: '7.50', hourly_cost: '', cost: '' });
  });

  it('names the file after the unit and the dates', () => {
    expect(payrollFileName('Ward 7 Acute Medicine', DATES)).toBe(
      'payroll-ward-7-acute-medicine-2030-01-07-to-2030-01-13.csv',
    );
    expect(payrollFileName('"; rm -rf', DATES)).toBe('payroll-rm-rf-2030-01-07-to-2030-01-13.csv');
    expect(payrollFileName('Équipe Nuit', DATES)).toMatch(/^payroll-equipe-nuit-/);
  });
});
