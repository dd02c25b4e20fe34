/**
 * Explanations of unmet needs, unhonoured requests and infeasible rules, on hand-made cases whose
 * answer is worked out beside each test. The 11 h rest is EU Working Time Directive 2003/88/EC,
 * Art. 3 (see fixtures.test-helpers.ts).
 */
import type { RosterProblem } from '../problem';
import { buildModel } from '../model/build-model';
import { threadSession } from '../solve/run-mip';
import { solveRoster } from '../solve/solve';
import { WARD_CONTRACT, person, smallWard } from '../solve/fixtures.test-helpers';
import { deletionFilter, explainConflicts } from './conflicts';

const RNS = ['ada', 'ben', 'cy', 'fay'];

describe('explanations', () => {
  it('explains needs left short because everyone with the skill is on leave', async () => {
    // All four people with skill rn are on leave on day 2 (Wed 4 Mar). The three rn needs of that
    // day (E, L, N, one rn each) cannot be met; the "2 on the early shift" need can, by dee and eli.
    const problem = smallWard({
      absences: RNS.map((personId) => ({ personId, day: 2, kind: 'leave' as const })),
    });
    const result = await solveRoster(problem, { timeLimitSeconds: 60 });
    expect(result.status).toBe('optimal');
    // Three needs short by one rn, 1000 each (DEFAULT_WEIGHTS.coverUnderMin).
    expect(result.objective).toBe(3000);
    expect(result.unmetNeeds.map((u) => [u.day, u.shiftTypeId, u.skillId, u.short])).toEqual([
      [2, 'E', 'rn', 1],
      [2, 'L', 'rn', 1],
      [2, 'N', 'rn', 1],
    ]);
    for (const u of result.unmetNeeds) {
      expect(u.reasons).toContain(
        '4 of the 4 people with skill rn are on leave (Ada Byrne, Ben Okafor, Cy Lindqvist and 1 more).',
      );
      expect(u.reasons[0]).toMatch(/on Wed 4 Mar has 0, below its minimum of 1\.$/);
    }
  });

  it('names skills by their display name when the problem gives one', async () => {
    // Same case as above, with the skill's display name given: the words use "RN", not the id.
    const problem = smallWard({
      absences: RNS.map((personId) => ({ personId, day: 2, kind: 'leave' as const })),
    });
    const result = await solveRoster({ ...problem, skillNames: { rn: 'RN' } }, { timeLimitSeconds: 60 });
    expect(result.unmetNeeds).toHaveLength(3);
    for (const u of result.unmetNeeds) {
      expect(u.skillId).toBe('rn');
      expect(u.reasons).toContain(
        '4 of the 4 people with skill RN are on leave (Ada Byrne, Ben Okafor, Cy Lindqvist and 1 more).',
      );
    }
  });

  describe('a one-nurse unit', () => {
    // Ada is the only rn. Needs: rn on Night of day 1 (Tue), rn on Early of day 2 (Wed) and of day 3
    // (Thu). Night ends 07:30 and Early starts 07:00, so Night Tue then Early Wed gives no rest at
    // all (11 h needed): one of those two needs must stay short (1000). Early Wed then Early Thu is
    // fine. Ada asked for Thursday off (weight 5) and for the Early shift on Sat, when she is on
    // leave (weight 1). Optimum: 1000 (one short need) + 5 (Thursday off refused, cover wins)
    // + 1 (Saturday early impossible) = 1006.
    const problem: RosterProblem = {
      ...smallWard(),
      people: [person('ada', 'Ada Byrne', ['rn'], WARD_CONTRACT), person('dee', 'Dee Marsh', ['ca'])],
      coverNeeds: [
        { day: 1, shiftTypeId: 'N', skillId: 'rn', min: 1, target: 1 },
        { day: 2, shiftTypeId: 'E', skillId: 'rn', min: 1, target: 1 },
        { day: 3, shiftTypeId: 'E', skillId: 'rn', min: 1, target: 1 },
      ],
      requests: [
        { personId: 'ada', day: 3, kind: 'dayOff', weight: 5 },
        { personId: 'ada', day: 5, kind: 'shiftOn', shiftTypeId: 'E', weight: 1 },
      ],
      absences: [{ personId: 'ada', day: 5, kind: 'leave' }],
    };
    let result: Awaited<ReturnType<typeof solveRoster>>;
    beforeAll(async () => {
      result = await solveRoster(problem, { timeLimitSeconds: 60 });
    });

    it('solves to the hand-worked optimum', () => {
      expect(result.status).toBe('optimal');
      expect(result.objective).toBe(1006);
    });

    it('blames the minimum rest for the need left short', () => {
      expect(result.unmetNeeds).toHaveLength(1);
      const [short] = result.unmetNeeds;
      expect([1, 2]).toContain(short.day);
      expect(short.reasons).toContain(
        '1 of the 1 people with skill rn would get too little rest next to a shift the day before or after (Ada Byrne).',
      );
    });

    it('says cover won over the day-off request, and leave over the shift request', () => {
      const byDay = new Map(result.requestsNotHonoured.map((r) => [r.day, r]));
      expect(byDay.get(3)?.reasons).toEqual([
        'Ada Byrne asked for a day off on Thu 5 Mar.',
        'They were needed for cover on the Early shift that day.',
      ]);
      expect(byDay.get(5)?.reasons).toEqual([
        'Ada Byrne asked for the Early shift on Sat 7 Mar.',
        'They are on leave that day.',
      ]);
    });
  });

  it('names the conflicting rules when a pin falls on a leave day (HiGHS IIS)', async () => {
    const problem = smallWard({
      absences: [{ personId: 'ben', day: 4, kind: 'leave' }],
      pins: [{ personId: 'ben', day: 4, shiftTypeId: 'L' }],
    });
    const result = await solveRoster(problem, { timeLimitSeconds: 60 });
    expect(result.status).toBe('infeasible');
    expect(result.roster).toBeNull();
    expect(result.conflicts?.rules).toEqual(
      expect.arrayContaining([
        'Ben Okafor is on leave on Fri 6 Mar',
        'Ben Okafor is pinned to the Late shift on Fri 6 Mar',
      ]),
    );
    expect(result.conflicts?.rules).toHaveLength(2);
    expect(result.quality).toMatch(/No roster can meet all the hard rules/);
  });

  it('names the minimum-hours rule when leave makes it impossible', async () => {
    // Cy must work 37.5 h (5 × 7.5 h) but is on leave 3 of the 7 days: 4 shifts of at most 9 h
    // give 36 h < 37.5 h.
    const problem = smallWard({
      absences: [0, 1, 2].map((day) => ({ personId: 'cy', day, kind: 'leave' as const })),
    });
    problem.people = problem.people.map((p) =>
      p.id === 'cy' ? { ...p, contract: { ...p.contract, minPaidMinutes: 5 * 450 } } : p,
    );
    const result = await solveRoster(problem, { timeLimitSeconds: 60 });
    expect(result.status).toBe('infeasible');
    expect(result.conflicts?.rules).toContain('Cy Lindqvist must work at least 37.5 h in the period');
    expect(result.conflicts?.summary).toMatch(/Cy Lindqvist is away on 3 of the 7 days/);
  });

  it('finds a conflict that only whole shifts create, by relaxing one rule at a time', async () => {
    // Ada must work exactly 1000 paid minutes. Shifts pay 450 or 540 minutes and no sum of them
    // equals 1000, although fractions of shifts could: only the integer model is infeasible.
    const problem = smallWard();
    problem.people = problem.people.map((p) =>
      p.id === 'ada' ? { ...p, contract: { ...p.contract, minPaidMinutes: 1000, maxPaidMinutes: 1000 } } : p,
    );
    const built = buildModel(problem);
    const session = await threadSession();
    const rows = deletionFilter(session, built, {});
    const described = new Set(rows.map((r) => `${built.rows[r].rule}:${built.rows[r].personId}`));
    expect([...described].sort()).toEqual(['maxPaidMinutes:ada', 'minPaidMinutes:ada']);
    const explanation = explainConflicts(session, built);
    expect(explanation.rules).toEqual(
      expect.arrayContaining([
        'Ada Byrne must work at least 16.7 h in the period',
        'Ada Byrne may work at most 16.7 h in the period',
      ]),
    );
  });
});
