import { changes } from './changes';
import { hoursDeviation } from './hours-deviation';
import { labourCost } from './labour-cost';
import { grid, needs, person, problem, roster, solveAndCheck } from '../model/fixtures.test-helpers';

describe('goal hoursDeviation', () => {
  const p = problem({ days: 3, people: [person('a', { targetPaidMinutes: 960 })] });

  it('charges each hour away from the contracted minutes', () => {
    const { index } = grid(p, {});
    // One early (480) against 960: 8 h short × weight 1 = 8. Three: 1440 − 960 = 8 h over = 8.
    expect(hoursDeviation.check(index, grid(p, { a: 'E..' }).grid)).toBe(8);
    expect(hoursDeviation.check(index, grid(p, { a: 'EEE' }).grid)).toBe(8);
    expect(hoursDeviation.check(index, grid(p, { a: 'E.L' }).grid)).toBe(0);
  });

  it('the model works the contracted hours', async () => {
    // Two 480-minute shifts meet 960 exactly → 0.
    expect((await solveAndCheck(p)).objective).toBe(0);
  });
});

describe('goal labourCost', () => {
  const p = problem({
    days: 1,
    people: [person('a', {}, { hourlyCost: 20 }), person('b', {}, { hourlyCost: 10 })],
    coverNeeds: needs('E', [0]),
    weights: { labourCost: 1 },
  });

  it('charges hourly cost × paid hours', () => {
    const { index } = grid(p, {});
    // a on an 8-hour early at 20/h = 160.
    expect(labourCost.check(index, grid(p, { a: 'E', b: '.' }).grid)).toBe(160);
  });

  it('the model picks the cheaper person', async () => {
    // b at 10/h × 8 h = 80 < a's 160 and < 100 for leaving the need short → 80.
    expect((await solveAndCheck(p)).objective).toBe(80);
    // At 20/h each (160 > 100) the need stays short → 100.
    const dear = { ...p, people: [person('a', {}, { hourlyCost: 20 })] };
    expect((await solveAndCheck(dear)).objective).toBe(100);
  });
});

describe('goal changes (repair)', () => {
  const p = problem({
    days: 2,
    people: [person('a'), person('b')],
    published: roster({ a: 'E.', b: '.E' }),
    coverNeeds: [...needs('E', [0]), ...needs('E', [1])],
    absences: [{ personId: 'b', day: 1, kind: 'leave' }],
  });

  it('counts cells that differ from the published roster', () => {
    const { index } = grid(p, {});
    // a day 1: off → E (1 change), b day 1: E → off (1 change): 2 × 50 = 100.
    expect(changes.check(index, grid(p, { a: 'EE', b: '..' }).grid)).toBe(100);
    expect(changes.check(index, grid(p, { a: 'E.', b: '.E' }).grid)).toBe(0);
  });

  it('the model repairs with as few changes as it needs', async () => {
    // b falls sick on day 1. Repair: a takes day 1 (a changes, b changes) = 100, versus leaving
    // the early short: b's cell still changes (50) + 100 = 150 → optimum 100.
    expect((await solveAndCheck(p)).objective).toBe(100);
  });
});
