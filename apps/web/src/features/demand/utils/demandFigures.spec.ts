import type { CoverNeedsDto, DemandPlanDto } from '@rotaplex/contracts';
import {
  acceptRows,
  addDays,
  coverChanges,
  dayStarts,
  rebucket,
  unchanged,
  weekdayOf,
} from './demandFigures';

describe('rebucket: a forecast moved to another interval length keeps its contacts and workload', () => {
  // Common practice, no source: contacts add up over time, and workload (contacts x AHT, the
  // numerator of the traffic A = contacts x AHT / interval) adds up with them; so a coarser
  // interval's AHT is the contact-weighted mean of its parts.
  const quarter = [
    { start: '09:00', contacts: 10, ahtSeconds: 300 },
    { start: '09:15', contacts: 30, ahtSeconds: 200 },
    { start: '09:45', contacts: 5, ahtSeconds: 240 },
  ];
  const total = (xs: { contacts: number; ahtSeconds: number }[]) => ({
    contacts: xs.reduce((s, i) => s + i.contacts, 0),
    work: xs.reduce((s, i) => s + i.contacts * i.ahtSeconds, 0),
  });

  it('adds up to 30 minutes with the contact-weighted AHT', () => {
    const half = rebucket(quarter, 30, 15);
    // (10 x 300 + 30 x 200) / 40 = 225 s; 09:30 holds only the 09:45 quarter.
    expect(half).toEqual([
      { start: '09:00', contacts: 40, ahtSeconds: 225 },
      { start: '09:30', contacts: 5, ahtSeconds: 240 },
    ]);
    expect(total(half)).toEqual(total(quarter));
  });

  it('shares an hour evenly among four quarters and back again', () => {
    const hour = [{ start: '10:00', contacts: 12, ahtSeconds: 180 }];
    const parts = rebucket(hour, 15, 60);
    expect(parts.map((p) => [p.start, p.contacts, p.ahtSeconds])).toEqual([
      ['10:00', 3, 180],
      ['10:15', 3, 180],
      ['10:30', 3, 180],
      ['10:45', 3, 180],
    ]);
    expect(rebucket(parts, 60, 15)).toEqual(hour);
  });
});

describe('dates', () => {
  it('reads weekdays of dates as the calendar has them', () => {
    // From the calendar: 3 February 2025 was a Monday, 29 February 2024 a Thursday.
    expect(weekdayOf('2025-02-03')).toBe(1);
    expect(weekdayOf('2024-02-29')).toBe(4);
    expect(addDays('2024-02-28', 2)).toBe('2024-03-01');
    expect(dayStarts(30)).toHaveLength(48);
    expect(dayStarts(15)[95]).toBe('23:45');
  });
});

describe('accept rows and what they change (docs/demand.md, "How the web app builds the rows")', () => {
  const plan = {
    rosterPeriodId: 'p',
    unitId: 'u',
    dates: ['2025-02-03', '2025-02-04'],
    contactCentre: {
      skillId: 'agent',
      starts: [
        { date: '2025-02-03', shiftTypeId: 'D', people: 6, minimum: 4 },
        { date: '2025-02-04', shiftTypeId: 'D', people: 5, minimum: 3 },
      ],
    },
    ward: { requirement: [{ date: '2025-02-03', shiftTypeId: 'E', skillId: 'RN', required: 3 }] },
    cautions: [],
  } as unknown as DemandPlanDto;
  const needs: CoverNeedsDto = {
    unitId: 'u',
    // Monday's pattern row, and a Tuesday override that wins over Tuesday's pattern row.
    pattern: [
      { weekday: 1, shiftTypeId: 'D', skillId: 'agent', min: 4, target: 6 },
      { weekday: 2, shiftTypeId: 'D', skillId: 'agent', min: 1, target: 1 },
    ],
    overrides: [{ id: 'o', date: '2025-02-04', shiftTypeId: 'D', skillId: 'agent', min: 2, target: 4 }],
  };

  it('takes the plan minimum and target for the contact centre and min = target = required for the ward', () => {
    expect(acceptRows(plan)).toEqual([
      { date: '2025-02-03', shiftTypeId: 'D', skillId: 'agent', min: 4, target: 6 },
      { date: '2025-02-04', shiftTypeId: 'D', skillId: 'agent', min: 3, target: 5 },
      { date: '2025-02-03', shiftTypeId: 'E', skillId: 'RN', min: 3, target: 3 },
    ]);
  });

  it('compares each row with the override of its date, else the pattern of its weekday, else nothing', () => {
    const changes = coverChanges(acceptRows(plan), needs);
    expect(changes.map((c) => c.before)).toEqual([{ min: 4, target: 6 }, { min: 2, target: 4 }, null]);
    expect(changes.map(unchanged)).toEqual([true, false, false]);
  });
});
