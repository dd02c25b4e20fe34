/**
 * The period plan: forecast rows to requirement per interval to shift starts, end to end on HiGHS.
 */
import type { ContactCentreDemandDto } from '@rotaplex/contracts';
import { agentsForTarget, trafficErlangs, withShrinkage } from './erlang';
import { contactRequirement, planContactCover, rosteredCover, rosteredServiceLevel, wardPlan } from './plan';

const service = { targetPercent: 80, targetSeconds: 20, maxOccupancyPercent: 100, shrinkagePercent: 30 };

function demand(partial: Partial<ContactCentreDemandDto> = {}): ContactCentreDemandDto {
  return {
    intervalMinutes: 30,
    skillId: null,
    service,
    // Mondays: the PRODUCT.md worked example at 09:00 (360 contacts per half hour, 240 s)
    pattern: [{ weekday: 1, intervals: [{ start: '09:00', contacts: 360, ahtSeconds: 240 }] }],
    dates: [],
    shiftTypeIds: [],
    maxPeoplePerDay: null,
    ...partial,
  };
}

describe('contact requirement over the period', () => {
  it('reads the weekday pattern: Monday 09:00 needs 54 agents, 78 scheduled at 30% shrinkage', () => {
    // 54 from the PRODUCT.md worked example (computed from the formula); 54 / 0.7 = 77.1 -> 78
    const req = contactRequirement(demand(), ['2027-01-04', '2027-01-05']); // Mon, Tue
    expect(req).toHaveLength(96);
    const nine = req[18];
    expect(nine.start).toBe('2027-01-04T09:00');
    expect(nine.trafficErlangs).toBeCloseTo(48, 9);
    expect(nine.agents).toBe(54);
    expect(nine.scheduled).toBe(78);
    expect(req.filter((r) => r.agents > 0)).toHaveLength(1);
  });

  it('a date row replaces its weekday whole', () => {
    const d = demand({
      dates: [{ date: '2027-01-04', intervals: [{ start: '10:30', contacts: 100, ahtSeconds: 180 }] }],
    });
    const req = contactRequirement(d, ['2027-01-04']);
    expect(req[18].agents).toBe(0);
    // Call Centre Helper worked example inputs (A = 10), occupancy uncapped here: 14 agents (see erlang.spec)
    expect(req[21].agents).toBe(agentsForTarget(trafficErlangs(100, 180, 30), 180, service).agents);
    expect(req[21].agents).toBe(14);
  });
});

describe('covering plan over the period', () => {
  const shifts = [
    { id: 'D', start: '08:00', end: '16:30', paidMinutes: 480 },
    { id: 'EV', start: '13:30', end: '22:00', paidMinutes: 480 },
  ];

  it('puts 78 on the day shift for the 09:00 peak, minimum 54, and nobody on the evening', async () => {
    const dates = ['2027-01-04'];
    const req = contactRequirement(demand(), dates);
    const plan = await planContactCover(req, dates, 30, shifts);
    expect(plan.starts).toEqual([
      { date: '2027-01-04', shiftTypeId: 'D', people: 78, minimum: 54 },
      { date: '2027-01-04', shiftTypeId: 'EV', people: 0, minimum: 0 },
    ]);
    expect(plan.paidHours).toBe(78 * 8);
    expect(plan.underCoverPersonIntervals).toBe(0);
    expect(plan.planned[18]).toBe(78);
  });

  it('a cap of 60 people per day leaves 18 short at 09:00', async () => {
    const dates = ['2027-01-04'];
    const req = contactRequirement(demand(), dates);
    const plan = await planContactCover(req, dates, 30, shifts, { maxPeoplePerDay: 60 });
    expect(plan.short[18]).toBe(18);
    expect(plan.underCoverPersonIntervals).toBe(18);
  });

  it('rostered cover counts people on shift per interval; their service level is after shrinkage', () => {
    const dates = ['2027-01-04'];
    const cover = rosteredCover(
      dates,
      30,
      [
        { date: '2027-01-04', shiftTypeId: 'D' },
        { date: '2027-01-04', shiftTypeId: 'EV' },
        { date: '2027-01-05', shiftTypeId: 'D' }, // outside the period: ignored
      ],
      shifts,
    );
    expect(cover[16]).toBe(1); // 08:00
    expect(cover[28]).toBe(2); // 14:00, both
    expect(cover[44]).toBe(0); // 22:00
    // 78 rostered at 30% shrinkage: 54 answering, 81.7% in 20 s (A = 48, computed from the formula)
    const sl = rosteredServiceLevel({ trafficErlangs: 48, ahtSeconds: 240 }, 78, 20, 30);
    expect(sl).toBeCloseTo(81.72, 1);
    expect(withShrinkage(54, 30)).toBe(78);
  });
});

describe('ward plan', () => {
  it('a date row replaces its weekday row; every ratio gives a row per shift and date', () => {
    const ward = {
      patients: [
        { weekday: 1, date: null, shiftTypeId: 'E', patients: { low: 20, medium: 6, high: 2 } },
        { weekday: null, date: '2027-01-04', shiftTypeId: 'E', patients: { low: 10, medium: 0, high: 0 } },
      ],
      ratios: [
        {
          skillId: 'RN',
          patientsPerStaff: { low: 5, medium: 4, high: 2 },
          minimumPerShift: 2,
          source: 'test',
        },
      ],
    };
    const rows = wardPlan(ward, ['2027-01-04', '2027-01-11'], ['E', 'N']);
    expect(rows).toHaveLength(4);
    // 4 January: the date row, 10 / 5 = 2
    expect(rows[0]).toMatchObject({ date: '2027-01-04', shiftTypeId: 'E', byRatio: 2, required: 2 });
    // 11 January (a Monday): 20/5 + 6/4 + 2/2 = 6.5 -> 7
    expect(rows[2]).toMatchObject({ date: '2027-01-11', shiftTypeId: 'E', byRatio: 7, required: 7 });
    // nights have no patient row: the floor of 2
    expect(rows[3]).toMatchObject({ shiftTypeId: 'N', byRatio: 0, floor: 2, required: 2 });
  });
});

describe('minimum and target under a cap', () => {
  it('the target keeps at least the minimum on every shift and never breaks the cap', async () => {
    // two peaks a day apart in shape: the minimum and the target plans would pick different
    // shifts if solved apart; with the minimum as a floor the target stays consistent
    const d: ContactCentreDemandDto = {
      intervalMinutes: 60,
      skillId: null,
      service: { targetPercent: 80, targetSeconds: 20, maxOccupancyPercent: 85, shrinkagePercent: 35 },
      pattern: [
        {
          weekday: 1,
          intervals: [
            { start: '09:00', contacts: 120, ahtSeconds: 240 },
            { start: '13:00', contacts: 60, ahtSeconds: 240 },
            { start: '18:00', contacts: 90, ahtSeconds: 240 },
          ],
        },
      ],
      dates: [],
      shiftTypeIds: [],
      maxPeoplePerDay: null,
    };
    const dates = ['2027-01-04'];
    const shifts = [
      { id: 'A', start: '08:00', end: '16:00', paidMinutes: 450 },
      { id: 'B', start: '12:00', end: '20:00', paidMinutes: 450 },
      { id: 'C', start: '09:00', end: '13:00', paidMinutes: 240 },
      { id: 'D', start: '17:00', end: '21:00', paidMinutes: 240 },
    ];
    const req = contactRequirement(d, dates);
    for (const cap of [null, 12, 8]) {
      const plan = await planContactCover(req, dates, 60, shifts, { maxPeoplePerDay: cap });
      for (const s of plan.starts) expect(s.people).toBeGreaterThanOrEqual(s.minimum);
      if (cap !== null) {
        expect(plan.starts.reduce((n, s) => n + s.people, 0)).toBeLessThanOrEqual(cap);
        expect(plan.starts.reduce((n, s) => n + s.minimum, 0)).toBeLessThanOrEqual(cap);
      } else {
        expect(plan.underCoverPersonIntervals).toBe(0);
      }
    }
  });
});

describe('contacts outside every shift', () => {
  it('are counted apart from short cover that a cap causes', async () => {
    // contacts at 07:00 while the only shift starts at 08:00: no plan can cover them
    const d: ContactCentreDemandDto = {
      intervalMinutes: 60,
      skillId: null,
      service: { targetPercent: 80, targetSeconds: 20, maxOccupancyPercent: 100, shrinkagePercent: 0 },
      pattern: [
        {
          weekday: 1,
          intervals: [
            { start: '07:00', contacts: 10, ahtSeconds: 180 },
            { start: '09:00', contacts: 10, ahtSeconds: 180 },
          ],
        },
      ],
      dates: [],
      shiftTypeIds: [],
      maxPeoplePerDay: null,
    };
    const dates = ['2027-01-04'];
    const req = contactRequirement(d, dates);
    const plan = await planContactCover(req, dates, 60, [
      { id: 'D', start: '08:00', end: '16:00', paidMinutes: 450 },
    ]);
    expect(plan.outsideShiftsPersonIntervals).toBe(req[7].scheduled);
    expect(plan.underCoverPersonIntervals).toBe(req[7].scheduled);
    expect(plan.short[9]).toBe(0);
  });
});
