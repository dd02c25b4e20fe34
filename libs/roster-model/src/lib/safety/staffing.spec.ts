/**
 * Staffing safety against cases whose fewest shortfall is known by construction (the counting
 * argument is worked out beside each case), through the product's own solve path.
 */
import { ProblemIndex } from '../model/context';
import { needs, person, problem, roster } from '../model/fixtures.test-helpers';
import { solveRoster } from '../solve/solve';
import { SolverPool } from '../pool';
import { mergedStaffingSafety, staffingShortfall, staffingStatement } from './staffing';

/**
 * One week of nights that need 2 registered nurses each (min 2, target 2): 14 nurse-nights.
 * Two nurses may work at most 3 nights each (maxShiftsPerType), so at most 6 nurse-nights can be
 * covered whatever the roster: at least 14 − 6 = 8 people short, and 8 is reached by any roster
 * giving both nurses 3 nights (no other rule binds). A third person without the skill counts for
 * nothing. The fewest possible is therefore exactly 8, by construction.
 */
function shortNights() {
  return problem({
    days: 7,
    people: [
      person('a', { maxShiftsPerType: { N: 3 } }, { skills: ['rn'] }),
      person('b', { maxShiftsPerType: { N: 3 } }, { skills: ['rn'] }),
      person('c', {}, { skills: [] }),
    ],
    coverNeeds: needs('N', [0, 1, 2, 3, 4, 5, 6], 2, { skillId: 'rn', min: 2 }),
  });
}

describe('staffing safety', () => {
  it('finds and proves the fewest people short of minimum (8 by construction)', async () => {
    const result = await solveRoster(shortNights(), { timeLimitSeconds: 20 });
    expect(result.staffing).toMatchObject({ peopleShort: 8, fewestPossible: 8, proven: true });
    // 6 nurse-nights over 7 nights: every night is short of its minimum.
    expect(result.staffing?.shiftsShort).toBe(7);
    expect(result.staffingStatement).toMatch(
      /^7 shifts are below minimum staffing \(8 people short(, \d need(s have| has) nobody with the required skill)?\)\. With the people, leave and rules you have, no roster can do better than 8 people short\. Ask for bank or agency staff, or escalate as your local policy says, before publishing\.$/,
    );
  });

  it('proves the fewest from the first roster and states it against the roster shown (start 10 short, shown 8)', async () => {
    // Each nurse on 2 nights: 14 − 4 = 10 people short, a roster that keeps every rule. The proof
    // runs from it before the solve; the roster shown is the solve's (8 short, the fewest possible).
    const start = roster({ a: 'NN.....', b: '..NN...', c: '.......' });
    expect(staffingShortfall(new ProblemIndex(shortNights()), start).peopleShort).toBe(10);
    const result = await solveRoster(shortNights(), { timeLimitSeconds: 20, warmStart: start });
    expect(result.staffing).toMatchObject({ peopleShort: 8, fewestPossible: 8, proven: true });
    expect(result.staffingStatement).toContain('no roster can do better than 8 people short');
  });

  it('counts nights with nobody of the required skill, and says nothing when every minimum is met', () => {
    const p = shortNights();
    const index = new ProblemIndex(p);
    // Nurses on nights 0-2 together, nobody on 3-6: 4 nights with no nurse, 8 people short.
    const counted = staffingShortfall(index, roster({ a: 'NNN....', b: 'NNN....', c: 'NNNNNNN' }));
    expect(counted).toEqual({ peopleShort: 8, shiftsShort: 4, noneOfSkill: 4 });
    const met = problem({
      days: 2,
      people: [person('a', {}, { skills: ['rn'] }), person('b', {}, { skills: ['rn'] })],
      coverNeeds: needs('N', [0, 1], 1, { skillId: 'rn', min: 1 }),
    });
    expect(staffingShortfall(new ProblemIndex(met), roster({ a: 'NN', b: '..' }))).toEqual({
      peopleShort: 0,
      shiftsShort: 0,
      noneOfSkill: 0,
    });
    expect(
      staffingStatement({ peopleShort: 0, shiftsShort: 0, noneOfSkill: 0, fewestPossible: 0, proven: true }),
    ).toBe('');
  });

  it('says when fewer would be possible, and when the fewest is not yet proved', () => {
    const base = { peopleShort: 3, shiftsShort: 2, noneOfSkill: 1 };
    expect(staffingStatement({ ...base, fewestPossible: 1, proven: true })).toContain(
      'A roster with only 1 person short is possible: generate again with more time.',
    );
    expect(staffingStatement({ ...base, fewestPossible: 2, proven: false })).toContain(
      'at least 2 people short cannot be avoided',
    );
    expect(staffingStatement({ ...base, fewestPossible: null, proven: false })).toBe(
      '2 shifts are below minimum staffing (3 people short, 1 need has nobody with the required skill).' +
        ' Ask for bank or agency staff, or escalate as your local policy says, before publishing.',
    );
  });

  it('on two cores shows the staffing of the roster shown, proved by the first member (8 by construction)', async () => {
    const pool = new SolverPool({ size: 2 });
    const result = await pool
      .solveRoster(shortNights(), { timeLimitSeconds: 20, spareCores: true })
      .finally(() => pool.close());
    expect(result.staffing).toMatchObject({ peopleShort: 8, fewestPossible: 8, proven: true });
    expect(result.staffingStatement).toContain('no roster can do better than 8 people short');
  });

  it('merges the proofs of several solves: a proved count wins, else the highest floor', () => {
    const p = shortNights();
    const index = new ProblemIndex(p);
    // Both nurses on 3 nights: 8 short, the fewest possible (by construction above).
    const best = roster({ a: 'NNN....', b: '...NNN.', c: '.......' });
    const counted = { peopleShort: 8, shiftsShort: 7, noneOfSkill: 1 };
    expect(staffingShortfall(index, best)).toEqual(counted);
    const floor = (n: number) => ({ ...counted, fewestPossible: n, proven: false });
    expect(mergedStaffingSafety(index, best, [floor(5), null, floor(7)])).toEqual(floor(7));
    expect(mergedStaffingSafety(index, best, [floor(5), floor(8)])).toEqual({ ...floor(8), proven: true });
    expect(
      mergedStaffingSafety(index, best, [
        floor(5),
        { ...counted, peopleShort: 9, fewestPossible: 8, proven: true },
      ]),
    ).toEqual({ ...counted, fewestPossible: 8, proven: true });
    expect(mergedStaffingSafety(index, best, [undefined, null])).toEqual({
      ...counted,
      fewestPossible: null,
      proven: false,
    });
  });
});
