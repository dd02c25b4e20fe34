import { checkRoster } from '../check/checker';
import { validateProblem } from '../check/validate';
import { construct } from '../heuristic/construct';
import { solveRoster } from '../solve/solve';
import { isNightShift } from '../time';
import { generateWard } from './ward';
import { parseWardArgs } from './ward-cli';

describe('generateWard', () => {
  it('gives the same problem for the same seed and a different one for another seed', () => {
    expect(generateWard({ seed: 3 })).toEqual(generateWard({ seed: 3 }));
    const a = generateWard({ seed: 1 });
    const b = generateWard({ seed: 2 });
    expect(b.requests).not.toEqual(a.requests);
    expect(b.absences).not.toEqual(a.absences);
    expect(b.coverNeeds).not.toEqual(a.coverNeeds);
    expect(b.people.map((p) => p.contract)).not.toEqual(a.people.map((p) => p.contract));
    // The ward itself stays: the same people, skills and shift types.
    expect(b.people.map((p) => [p.id, p.skills])).toEqual(a.people.map((p) => [p.id, p.skills]));
    expect(b.shiftTypes).toEqual(a.shiftTypes);
  });

  it('passes the product validation for seeds 1-5 and other sizes', () => {
    for (const seed of [1, 2, 3, 4, 5]) expect(validateProblem(generateWard({ seed }))).toEqual([]);
    expect(validateProblem(generateWard({ people: 20, days: 14, seed: 9 }))).toEqual([]);
    expect(validateProblem(generateWard({ people: 80, days: 42, seed: 2 }))).toEqual([]);
  });

  it('has the ward described: 40 people, two skills, four shift types, EU limits, requests and leave', () => {
    const problem = generateWard({ seed: 4 });
    expect(problem.days).toBe(28);
    expect(problem.shiftTypes.map((s) => s.id)).toEqual(['E', 'L', 'N', 'LD']);
    expect(problem.shiftTypes.filter(isNightShift).map((s) => s.id)).toEqual(['N']);
    const rn = problem.people.filter((p) => p.skills.includes('rn')).length;
    const ca = problem.people.filter((p) => p.skills.includes('ca')).length;
    expect([problem.people.length, rn, ca]).toEqual([40, 22, 18]);
    for (const p of problem.people) {
      expect(p.contract.minRestMinutes).toBe(660);
      expect(p.contract.maxPaidMinutes).toBeLessThanOrEqual(4 * 48 * 60);
      expect(p.contract.maxWeekends).toBe(2);
      expect(p.contract.maxConsecutiveWorkDays).toBeLessThanOrEqual(6);
      const asked = problem.requests.filter((r) => r.personId === p.id);
      expect(asked.length).toBeGreaterThanOrEqual(2);
      expect(asked.length).toBeLessThanOrEqual(4);
    }
    const partTime = problem.people.filter((p) => p.contract.maxConsecutiveWorkDays === 5).length;
    expect(partTime).toBeGreaterThan(0);
    expect(partTime).toBeLessThan(20);
    const leave = problem.absences.filter((a) => a.kind === 'leave');
    expect(new Set(leave.map((a) => a.personId)).size).toBeGreaterThanOrEqual(4);
    const leaveCells = new Set(leave.map((a) => `${a.personId}|${a.day}`));
    expect(problem.requests.filter((r) => leaveCells.has(`${r.personId}|${r.day}`))).toEqual([]);
    expect(new Set(problem.requests.map((r) => r.kind))).toEqual(new Set(['dayOff', 'shiftOff', 'shiftOn']));
    for (let d = 0; d < problem.days; d++) {
      const nightNurses = problem.coverNeeds.find(
        (n) => n.day === d && n.shiftTypeId === 'N' && n.skillId === 'rn',
      );
      expect(nightNurses?.min).toBeGreaterThanOrEqual(1);
    }
  });

  it('lets the construction heuristic find a roster without hard violations for seeds 1-5', () => {
    // A fixed number of moves (and time to spare) makes the heuristic repeatable.
    for (const seed of [1, 2, 3, 4, 5]) {
      const problem = generateWard({ seed });
      const roster = construct(problem, { seed: 1, timeLimitMs: 60_000, maxIterations: 20_000 });
      expect({ seed, violations: checkRoster(problem, roster).violations }).toEqual({ seed, violations: [] });
    }
  });

  it('gives a short solve a roster the independent checker accepts, with the same objective', async () => {
    const problem = generateWard({ seed: 1 });
    // From the repeatable construction above (no hard violations), so a loaded machine cannot leave
    // the solve without a roster: what it returns is never worse than its start.
    const start = construct(problem, { seed: 1, timeLimitMs: 60_000, maxIterations: 20_000 });
    const startObjective = checkRoster(problem, start).objective;
    const result = await solveRoster(problem, { timeLimitSeconds: 5, explain: false, warmStart: start });
    expect(result.roster).not.toBeNull();
    expect(result.objective!).toBeLessThanOrEqual(startObjective + 1e-6);
    const check = checkRoster(problem, result.roster!);
    expect(check.violations).toEqual([]);
    expect(result.objective).not.toBeNull();
    expect(Math.abs(check.objective - result.objective!)).toBeLessThanOrEqual(
      1e-6 * Math.max(1, check.objective),
    );
  });
});

describe('bench:ward arguments', () => {
  it('reads seeds as ranges and lists, with the defaults elsewhere', () => {
    expect(parseWardArgs(['--seeds', '1-3,7'])).toEqual({
      people: 40,
      days: 28,
      seeds: [1, 2, 3, 7],
      timeLimitSeconds: 30,
      cores: 1,
      outDir: null,
    });
    expect(
      parseWardArgs(['--people', '60', '--time-limit', '300', '--cores', '2', '--out', '/tmp/x']),
    ).toMatchObject({
      people: 60,
      timeLimitSeconds: 300,
      cores: 2,
      outDir: '/tmp/x',
      seeds: [1, 2, 3, 4, 5],
    });
    expect(() => parseWardArgs(['--cores', '3'])).toThrow(/1 or 2/);
    expect(() => parseWardArgs(['--seeds', 'a'])).toThrow(/--seeds/);
  });
});
