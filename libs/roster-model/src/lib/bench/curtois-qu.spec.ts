import * as fs from 'node:fs';
import * as path from 'node:path';
import {
  BENCHMARKS_DIR_ENV,
  BenchmarkParseError,
  benchmarksDir,
  loadInstance,
  parseCurtoisQu,
  resolveInstance,
  toRosterProblem,
} from './curtois-qu';

// A tiny file in the benchmark's plain-text format (format: SOURCES.md §3 of
// ../shared/benchmarks/curtois-qu, the benchmark's own format guide instances1_24.html).
// The data is made up for the parser test only.
const TINY = [
  '# comment line',
  'SECTION_HORIZON',
  '# another comment',
  '7',
  '',
  'SECTION_SHIFTS',
  'D,480,',
  'N,720,D|d',
  'd,600,',
  '',
  'SECTION_STAFF',
  'D,D=5|N=0|d=2,2400,960,4,2,2,1',
  'x,D=7|N=3|d=0,4800,0,5,1,1,2',
  '',
  'SECTION_DAYS_OFF',
  'D,0,6',
  '',
  'SECTION_SHIFT_ON_REQUESTS',
  'x,1,N,3',
  '',
  'SECTION_SHIFT_OFF_REQUESTS',
  'D,2,d,1',
  '',
  'SECTION_COVER',
  '0,D,2,100,1',
  '6,N,-0,100,1',
].join('\r\n');

describe('parseCurtoisQu', () => {
  it('reads every section, with the quirks of the published files', () => {
    const inst = parseCurtoisQu(TINY, 'tiny.txt');
    expect(inst.horizon).toBe(7);
    // empty Forbidden field (line ends with a comma) and a |-separated list
    expect(inst.shifts).toEqual([
      { id: 'D', lengthMinutes: 480, forbiddenNext: [] },
      { id: 'N', lengthMinutes: 720, forbiddenNext: ['D', 'd'] },
      { id: 'd', lengthMinutes: 600, forbiddenNext: [] },
    ]);
    // staff id "D" clashes with shift id "D"; ids are case-sensitive ("D" and "d" differ)
    expect(inst.staff[0]).toEqual({
      id: 'D',
      maxShifts: { D: 5, N: 0, d: 2 },
      maxTotalMinutes: 2400,
      minTotalMinutes: 960,
      maxConsecutiveShifts: 4,
      minConsecutiveShifts: 2,
      minConsecutiveDaysOff: 2,
      maxWeekends: 1,
    });
    expect(inst.daysOff).toEqual({ D: [0, 6] });
    expect(inst.onRequests).toEqual([{ staffId: 'x', day: 1, shiftId: 'N', weight: 3 }]);
    expect(inst.offRequests).toEqual([{ staffId: 'D', day: 2, shiftId: 'd', weight: 1 }]);
    // "-0" is a requirement of 0 (Instance15.txt has two such rows, SOURCES.md §3)
    expect(inst.cover[1]).toEqual({ day: 6, shiftId: 'N', requirement: 0, weightUnder: 100, weightOver: 1 });
    expect(Object.is(inst.cover[1].requirement, -0)).toBe(false);
  });

  it.each([
    [
      'a bad number',
      TINY.replace('D,480,', 'D,48o,'),
      /tiny\.txt line 7: length of shift D must be a whole number/,
    ],
    [
      'an unknown shift in a Forbidden list',
      TINY.replace('N,720,D|d', 'N,720,D|E'),
      /line 8: .*unknown shift "E"/,
    ],
    [
      'a wrong case in a shift id',
      TINY.replace('0,D,2,100,1', '0,n,2,100,1'),
      /line 25: .*unknown shift "n" .*case-sensitive/,
    ],
    ['an unknown staff member', TINY.replace('x,1,N,3', 'X,1,N,3'), /line 19: unknown staff member "X"/],
    [
      'a day outside the horizon',
      TINY.replace('D,0,6', 'D,0,7'),
      /line 16: day 7 is outside the horizon 0…6/,
    ],
    [
      'a short staff line',
      TINY.replace(',4800,0,5,1,1,2', ',4800,0,5,1,1'),
      /line 13: a staff line .* needs 8 .* found 7/,
    ],
    [
      'a duplicate cover row',
      TINY + '\r\n0,D,3,100,1',
      /line 27: second cover row for day 0 shift D \(first on line 25\)/,
    ],
    ['a missing section header', TINY.replace('SECTION_STAFF', '#'), /line 12: data outside any section/],
    [
      'a missing section',
      TINY.replace(/SECTION_STAFF[^]*?\r\n\r\n/, ''),
      /line 2[0-9]: section SECTION_STAFF is missing/,
    ],
    [
      'a negative requirement',
      TINY.replace('0,D,2,100,1', '0,D,-2,100,1'),
      /line 25: Requirement must be at least 0/,
    ],
    [
      'min above max minutes',
      TINY.replace('2400,960', '900,960'),
      /line 12: MinTotalMinutes 960 exceeds MaxTotalMinutes 900/,
    ],
  ])('rejects %s with the line number', (_what, text, message) => {
    expect(() => parseCurtoisQu(text, 'tiny.txt')).toThrow(BenchmarkParseError);
    expect(() => parseCurtoisQu(text, 'tiny.txt')).toThrow(message);
  });

  it('maps onto a RosterProblem whose only goals are the benchmark penalties', () => {
    const problem = toRosterProblem(parseCurtoisQu(TINY, 'tiny.txt'));
    // day 0 is a Monday (SOURCES.md §3): 2024-01-01 was a Monday
    expect(new Date(`${problem.startDate}T00:00:00Z`).getUTCDay()).toBe(1);
    expect(problem.weekendDays).toEqual([6, 0]);
    expect(problem.shiftTypes.map((s) => [s.id, s.start, s.end, s.paidMinutes, s.night])).toEqual([
      ['D', '06:00', '14:00', 480, false],
      ['N', '06:00', '18:00', 720, false],
      ['d', '06:00', '16:00', 600, false],
    ]);
    expect(problem.people[0].contract).toEqual({
      maxShiftsPerType: { D: 5, N: 0, d: 2 },
      minPaidMinutes: 960,
      maxPaidMinutes: 2400,
      maxConsecutiveWorkDays: 4,
      minConsecutiveWorkDays: 2,
      minConsecutiveDaysOff: 2,
      maxWeekends: 1,
    });
    expect(problem.people.every((p) => p.contract.minRestMinutes === undefined)).toBe(true);
    expect(problem.forbiddenSuccessions).toEqual([
      { from: 'N', to: 'D' },
      { from: 'N', to: 'd' },
    ]);
    expect(problem.absences).toEqual([
      { personId: 'D', day: 0, kind: 'fixedDayOff' },
      { personId: 'D', day: 6, kind: 'fixedDayOff' },
    ]);
    expect(problem.requests).toEqual([
      { personId: 'x', day: 1, kind: 'shiftOn', shiftTypeId: 'N', weight: 3 },
      { personId: 'D', day: 2, kind: 'shiftOff', shiftTypeId: 'd', weight: 1 },
    ]);
    expect(problem.coverNeeds[0]).toEqual({
      day: 0,
      shiftTypeId: 'D',
      skillId: null,
      min: 0,
      target: 2,
      weightUnderTarget: 100,
      weightOver: 1,
    });
    expect(problem.weights).toMatchObject({ requests: 1, fairNights: 0, fairWeekends: 0, hoursDeviation: 0 });
    expect(problem.weights).toMatchObject({ labourCost: 0, changes: 0 });
  });

  it('resolves numbers to the benchmark folder and names the env var when a file is missing', () => {
    const saved = process.env[BENCHMARKS_DIR_ENV];
    try {
      process.env[BENCHMARKS_DIR_ENV] = '/nonexistent/bench';
      expect(benchmarksDir()).toBe('/nonexistent/bench');
      expect(() => resolveInstance(3)).toThrow(
        /\/nonexistent\/bench\/Instance3\.txt.*ROTAPLEX_BENCHMARKS_DIR/,
      );
      expect(() => resolveInstance(25)).toThrow(/outside 1-24/);
    } finally {
      if (saved === undefined) delete process.env[BENCHMARKS_DIR_ENV];
      else process.env[BENCHMARKS_DIR_ENV] = saved;
    }
  });
});

// Sizes of the 24 published instances: the published instance table (days, staff, shift types,
// day-off entries, on-requests, off-requests, cover rows) as given in SOURCES.md §2.
const PUBLISHED_SIZES: [number, number, number, number, number, number, number, number][] = [
  [1, 14, 8, 1, 8, 21, 5, 14],
  [2, 14, 14, 2, 14, 50, 12, 28],
  [3, 14, 20, 3, 20, 39, 25, 42],
  [4, 28, 10, 2, 20, 52, 19, 56],
  [5, 28, 16, 2, 32, 79, 27, 56],
  [6, 28, 18, 3, 36, 87, 48, 84],
  [7, 28, 20, 3, 40, 104, 64, 84],
  [8, 28, 30, 4, 60, 139, 86, 112],
  [9, 28, 36, 4, 72, 144, 88, 112],
  [10, 28, 40, 5, 80, 210, 74, 140],
  [11, 28, 50, 6, 100, 197, 139, 168],
  [12, 28, 60, 10, 120, 294, 128, 280],
  [13, 28, 120, 18, 240, 589, 252, 504],
  [14, 42, 32, 4, 128, 266, 93, 168],
  [15, 42, 45, 6, 180, 350, 140, 252],
  [16, 56, 20, 3, 120, 177, 103, 168],
  [17, 56, 32, 4, 160, 351, 129, 224],
  [18, 84, 22, 3, 176, 322, 92, 252],
  [19, 84, 40, 5, 320, 587, 247, 420],
  [20, 182, 50, 6, 900, 1665, 653, 1092],
  [21, 182, 100, 8, 1800, 3210, 1492, 1456],
  [22, 364, 50, 10, 1800, 3253, 1385, 3640],
  [23, 364, 100, 16, 3600, 6549, 2861, 5824],
  [24, 364, 150, 32, 5400, 9540, 4269, 11648],
];

describe('the 24 published instances', () => {
  const dir = benchmarksDir();
  it(`are present in ${dir} (set ${BENCHMARKS_DIR_ENV} if they live elsewhere)`, () => {
    const missing = PUBLISHED_SIZES.map(([n]) => path.join(dir, `Instance${n}.txt`)).filter(
      (f) => !fs.existsSync(f),
    );
    if (missing.length > 0) {
      throw new Error(
        `Benchmark files missing: ${missing.join(', ')}. Set ${BENCHMARKS_DIR_ENV} to the curtois-qu folder ` +
          '(default ../shared/benchmarks/curtois-qu beside the repository; CI has it).',
      );
    }
  });

  it.each(PUBLISHED_SIZES)(
    'Instance%i parses to the published size (SOURCES.md §2 instance table)',
    (n, days, staff, types, daysOff, on, off, cover) => {
      const { instance, problem } = loadInstance(n);
      const daysOffEntries = Object.values(instance.daysOff).reduce((sum, d) => sum + d.length, 0);
      expect([instance.horizon, instance.staff.length, instance.shifts.length]).toEqual([days, staff, types]);
      expect([daysOffEntries, instance.onRequests.length, instance.offRequests.length]).toEqual([
        daysOff,
        on,
        off,
      ]);
      expect(instance.cover.length).toBe(cover);
      // day 0 is a Monday and H is a multiple of 7 (SOURCES.md §3)
      expect(instance.horizon % 7).toBe(0);
      expect(problem.days).toBe(days);
      // WeightUnder = 100 and WeightOver = 1 in all 24 files (SOURCES.md §3)
      expect(instance.cover.every((c) => c.weightUnder === 100 && c.weightOver === 1)).toBe(true);
    },
  );
});
