/**
 * Importer for the public shift scheduling benchmark of T. Curtois and R. Qu (Instance1 … Instance24,
 * schedulingbenchmarks.org/nrp), plain-text format as documented in
 * ../shared/benchmarks/curtois-qu/SOURCES.md §3, with the rules of §4.
 *
 * An instance becomes an ordinary RosterProblem (the type the product uses), so the benchmark runs
 * through the product's own model builder, solver and checker. The mapping:
 * - day 0 is a Monday (startDate 2024-01-01, a Monday), time zone UTC, weekends Saturday + Sunday;
 * - each shift type starts 06:00 and lasts its length (paidMinutes = length). No contract sets
 *   minRestMinutes and every shift ends by 06:00 the next day, so no rest rule is derived that the
 *   benchmark lacks; shifts are marked `night: false` so no night rule or goal applies;
 * - Forbidden lists → forbiddenSuccessions; MaxShifts → contract.maxShiftsPerType;
 *   Min/MaxTotalMinutes → min/maxPaidMinutes; Max/MinConsecutiveShifts → max/minConsecutiveWorkDays;
 *   MinConsecutiveDaysOff → minConsecutiveDaysOff; MaxWeekends → maxWeekends;
 * - days off → absences of kind 'fixedDayOff';
 * - on/off requests → shiftOn/shiftOff requests with their own weights (requests multiplier 1);
 * - cover rows → CoverNeed {skillId: null, min: 0, target: Requirement, weightUnderTarget: WeightUnder,
 *   weightOver: WeightOver};
 * - every other goal weight is 0, so the objective is exactly the benchmark's total penalty.
 */
import * as fs from 'node:fs';
import * as path from 'node:path';
import type { CoverNeed, ObjectiveWeights, Person, RosterProblem, ShiftRequest, ShiftType } from '../problem';

export const BENCHMARKS_DIR_ENV = 'ROTAPLEX_BENCHMARKS_DIR';

/** A Monday: day 0 of every benchmark instance is a Monday (SOURCES.md §3). */
export const BENCHMARK_START_DATE = '2024-01-01';

/** Minutes after midnight at which every imported shift starts (see the header comment). */
const SHIFT_START_MINUTES = 6 * 60;

export interface BenchShift {
  id: string;
  lengthMinutes: number;
  /** Shift ids that may not be worked on the day after this shift. */
  forbiddenNext: string[];
}

export interface BenchStaff {
  id: string;
  /** Max number of shifts per shift type (every type is present after parsing; absent types get 0). */
  maxShifts: Record<string, number>;
  maxTotalMinutes: number;
  minTotalMinutes: number;
  maxConsecutiveShifts: number;
  minConsecutiveShifts: number;
  minConsecutiveDaysOff: number;
  maxWeekends: number;
}

export interface BenchRequest {
  staffId: string;
  day: number;
  shiftId: string;
  weight: number;
}

export interface BenchCover {
  day: number;
  shiftId: string;
  requirement: number;
  weightUnder: number;
  weightOver: number;
}

/** An instance exactly as the file states it (before mapping onto a RosterProblem). */
export interface BenchInstance {
  name: string;
  horizon: number;
  shifts: BenchShift[];
  staff: BenchStaff[];
  daysOff: Record<string, number[]>;
  onRequests: BenchRequest[];
  offRequests: BenchRequest[];
  cover: BenchCover[];
}

export class BenchmarkParseError extends Error {
  constructor(
    readonly source: string,
    readonly line: number,
    detail: string,
  ) {
    super(`${source} line ${line}: ${detail}`);
    this.name = 'BenchmarkParseError';
  }
}

const SECTIONS = [
  'SECTION_HORIZON',
  'SECTION_SHIFTS',
  'SECTION_STAFF',
  'SECTION_DAYS_OFF',
  'SECTION_SHIFT_ON_REQUESTS',
  'SECTION_SHIFT_OFF_REQUESTS',
  'SECTION_COVER',
] as const;
type Section = (typeof SECTIONS)[number];

/**
 * Parses the plain-text benchmark format. Every error names the source and the line.
 * Quirks handled (SOURCES.md §3): comment lines, an empty Forbidden field (line ends with a comma),
 * a requirement written "-0", case-sensitive ids, shift ids equal to staff ids, CRLF line ends.
 */
export function parseCurtoisQu(text: string, source = 'instance'): BenchInstance {
  const fail = (line: number, detail: string): never => {
    throw new BenchmarkParseError(source, line, detail);
  };
  const int = (raw: string, line: number, what: string, min = 0): number => {
    const s = raw.trim();
    if (!/^-?\d+$/.test(s)) fail(line, `${what} must be a whole number, got "${raw}"`);
    const n = Number(s) + 0; // "-0" becomes 0
    if (!Number.isSafeInteger(n) || n < min) fail(line, `${what} must be at least ${min}, got ${s}`);
    return n === 0 ? 0 : n;
  };
  const id = (raw: string, line: number, what: string): string => {
    const s = raw.trim();
    if (s === '') fail(line, `${what} is empty`);
    return s;
  };
  const fields = (content: string, line: number, count: number, what: string): string[] => {
    const parts = content.split(',');
    if (parts.length !== count) {
      fail(line, `${what} needs ${count} comma-separated fields, found ${parts.length}: "${content}"`);
    }
    return parts;
  };

  let section: Section | null = null;
  const seen = new Set<Section>();
  let horizon: number | null = null;
  const shifts: BenchShift[] = [];
  const shiftLines = new Map<string, number>();
  const staff: BenchStaff[] = [];
  const staffLines = new Map<string, number>();
  const daysOff: Record<string, number[]> = {};
  const onRequests: (BenchRequest & { line: number })[] = [];
  const offRequests: (BenchRequest & { line: number })[] = [];
  const cover: (BenchCover & { line: number })[] = [];
  const maxShiftRefs: { staffId: string; shiftId: string; line: number }[] = [];
  const forbiddenRefs: { shiftId: string; line: number }[] = [];
  const daysOffLines: { staffId: string; days: number[]; line: number }[] = [];

  const lines = text.split('\n');
  for (let i = 0; i < lines.length; i++) {
    const lineNo = i + 1;
    const content = lines[i].replace(/\r$/, '').trim();
    if (content === '') {
      section = null; // a blank line ends a section
      continue;
    }
    if (content.startsWith('#')) continue;
    if (/^SECTION_[A-Z_]+$/.test(content)) {
      if (!(SECTIONS as readonly string[]).includes(content)) fail(lineNo, `unknown section ${content}`);
      const next = content as Section;
      if (seen.has(next)) fail(lineNo, `section ${next} appears twice`);
      seen.add(next);
      section = next;
      continue;
    }
    switch (section) {
      case null:
        fail(lineNo, `data outside any section (a blank line ends a section): "${content}"`);
        break;
      case 'SECTION_HORIZON':
        if (horizon !== null) fail(lineNo, `SECTION_HORIZON holds one number; extra line "${content}"`);
        horizon = int(content, lineNo, 'horizon (number of days)', 1);
        break;
      case 'SECTION_SHIFTS': {
        const [rawId, rawLen, rawForbidden] = fields(
          content,
          lineNo,
          3,
          'a shift line (ShiftID, Length, Forbidden)',
        );
        const shiftId = id(rawId, lineNo, 'ShiftID');
        if (shiftLines.has(shiftId)) fail(lineNo, `shift ${shiftId} defined twice`);
        const lengthMinutes = int(rawLen, lineNo, `length of shift ${shiftId}`, 1);
        if (lengthMinutes >= 24 * 60)
          fail(lineNo, `shift ${shiftId} lasts ${lengthMinutes} minutes (under 1440 expected)`);
        const forbiddenNext = rawForbidden
          .split('|')
          .map((s) => s.trim())
          .filter((s) => s !== '');
        forbiddenNext.forEach((f) => forbiddenRefs.push({ shiftId: f, line: lineNo }));
        shiftLines.set(shiftId, lineNo);
        shifts.push({ id: shiftId, lengthMinutes, forbiddenNext });
        break;
      }
      case 'SECTION_STAFF': {
        const f = fields(
          content,
          lineNo,
          8,
          'a staff line (ID, MaxShifts, MaxTotalMinutes, MinTotalMinutes, …)',
        );
        const staffId = id(f[0], lineNo, 'staff ID');
        if (staffLines.has(staffId)) fail(lineNo, `staff member ${staffId} defined twice`);
        const maxShifts: Record<string, number> = {};
        for (const part of f[1].split('|')) {
          if (part.trim() === '') continue;
          const m = /^([^=]+)=(.*)$/.exec(part.trim());
          if (!m) fail(lineNo, `MaxShifts entry "${part}" is not ShiftID=limit`);
          const [, sid, lim] = m as RegExpExecArray;
          const shiftId = sid.trim();
          if (shiftId in maxShifts) fail(lineNo, `MaxShifts lists shift ${shiftId} twice`);
          maxShifts[shiftId] = int(lim, lineNo, `MaxShifts limit for ${shiftId}`);
          maxShiftRefs.push({ staffId, shiftId, line: lineNo });
        }
        const member: BenchStaff = {
          id: staffId,
          maxShifts,
          maxTotalMinutes: int(f[2], lineNo, 'MaxTotalMinutes'),
          minTotalMinutes: int(f[3], lineNo, 'MinTotalMinutes'),
          maxConsecutiveShifts: int(f[4], lineNo, 'MaxConsecutiveShifts'),
          minConsecutiveShifts: int(f[5], lineNo, 'MinConsecutiveShifts'),
          minConsecutiveDaysOff: int(f[6], lineNo, 'MinConsecutiveDaysOff'),
          maxWeekends: int(f[7], lineNo, 'MaxWeekends'),
        };
        if (member.minTotalMinutes > member.maxTotalMinutes) {
          fail(
            lineNo,
            `MinTotalMinutes ${member.minTotalMinutes} exceeds MaxTotalMinutes ${member.maxTotalMinutes}`,
          );
        }
        staffLines.set(staffId, lineNo);
        staff.push(member);
        break;
      }
      case 'SECTION_DAYS_OFF': {
        const parts = content.split(',');
        const staffId = id(parts[0], lineNo, 'EmployeeID');
        const days = parts
          .slice(1)
          .filter((p) => p.trim() !== '')
          .map((p) => int(p, lineNo, 'day'));
        daysOffLines.push({ staffId, days, line: lineNo });
        break;
      }
      case 'SECTION_SHIFT_ON_REQUESTS':
      case 'SECTION_SHIFT_OFF_REQUESTS': {
        const f = fields(content, lineNo, 4, 'a request line (EmployeeID, Day, ShiftID, Weight)');
        const request = {
          staffId: id(f[0], lineNo, 'EmployeeID'),
          day: int(f[1], lineNo, 'Day'),
          shiftId: id(f[2], lineNo, 'ShiftID'),
          weight: int(f[3], lineNo, 'Weight'),
          line: lineNo,
        };
        (section === 'SECTION_SHIFT_ON_REQUESTS' ? onRequests : offRequests).push(request);
        break;
      }
      case 'SECTION_COVER': {
        const f = fields(
          content,
          lineNo,
          5,
          'a cover line (Day, ShiftID, Requirement, WeightUnder, WeightOver)',
        );
        cover.push({
          day: int(f[0], lineNo, 'Day'),
          shiftId: id(f[1], lineNo, 'ShiftID'),
          requirement: int(f[2], lineNo, 'Requirement'),
          weightUnder: int(f[3], lineNo, 'WeightUnder'),
          weightOver: int(f[4], lineNo, 'WeightOver'),
          line: lineNo,
        });
        break;
      }
    }
  }

  const lastLine = lines.length;
  for (const required of ['SECTION_HORIZON', 'SECTION_SHIFTS', 'SECTION_STAFF'] as const) {
    if (!seen.has(required)) fail(lastLine, `section ${required} is missing`);
  }
  if (horizon === null) return fail(lastLine, 'SECTION_HORIZON holds no number of days');
  if (shifts.length === 0) fail(lastLine, 'SECTION_SHIFTS lists no shift');
  if (staff.length === 0) fail(lastLine, 'SECTION_STAFF lists no staff member');
  const H = horizon;

  const checkShift = (shiftId: string, line: number, what: string): void => {
    if (!shiftLines.has(shiftId))
      fail(line, `${what} names unknown shift "${shiftId}" (ids are case-sensitive)`);
  };
  const checkStaff = (staffId: string, line: number): void => {
    if (!staffLines.has(staffId)) fail(line, `unknown staff member "${staffId}" (ids are case-sensitive)`);
  };
  const checkDay = (day: number, line: number): void => {
    if (day >= H) fail(line, `day ${day} is outside the horizon 0…${H - 1}`);
  };
  forbiddenRefs.forEach((r) => checkShift(r.shiftId, r.line, 'Forbidden list'));
  maxShiftRefs.forEach((r) => checkShift(r.shiftId, r.line, 'MaxShifts'));
  for (const member of staff) {
    for (const s of shifts) if (!(s.id in member.maxShifts)) member.maxShifts[s.id] = 0;
  }
  for (const d of daysOffLines) {
    checkStaff(d.staffId, d.line);
    d.days.forEach((day) => checkDay(day, d.line));
    daysOff[d.staffId] = [...new Set([...(daysOff[d.staffId] ?? []), ...d.days])].sort((a, b) => a - b);
  }
  for (const list of [onRequests, offRequests]) {
    for (const r of list) {
      checkStaff(r.staffId, r.line);
      checkDay(r.day, r.line);
      checkShift(r.shiftId, r.line, 'request');
    }
  }
  const coverKeys = new Map<string, number>();
  for (const c of cover) {
    checkDay(c.day, c.line);
    checkShift(c.shiftId, c.line, 'cover row');
    const key = `${c.day}\u0000${c.shiftId}`;
    const previous = coverKeys.get(key);
    if (previous !== undefined)
      fail(c.line, `second cover row for day ${c.day} shift ${c.shiftId} (first on line ${previous})`);
    coverKeys.set(key, c.line);
  }

  const strip = <T extends { line: number }>(rows: T[]): Omit<T, 'line'>[] =>
    rows.map(({ line: _line, ...rest }) => rest);
  return {
    name: source,
    horizon: H,
    shifts,
    staff,
    daysOff,
    onRequests: strip(onRequests),
    offRequests: strip(offRequests),
    cover: strip(cover),
  };
}

function hhmm(minutesAfterMidnight: number): string {
  const m = ((minutesAfterMidnight % 1440) + 1440) % 1440;
  return `${String(Math.floor(m / 60)).padStart(2, '0')}:${String(m % 60).padStart(2, '0')}`;
}

/** Objective weights that make the product's objective equal the benchmark's total penalty. */
export const BENCHMARK_WEIGHTS: ObjectiveWeights = {
  coverUnderMin: 0,
  coverUnderTarget: 100,
  coverOver: 1,
  requests: 1,
  fairNights: 0,
  fairWeekends: 0,
  hoursDeviation: 0,
  labourCost: 0,
  changes: 0,
};

/** Maps a parsed instance onto the product's RosterProblem (see the header comment for each field). */
export function toRosterProblem(instance: BenchInstance): RosterProblem {
  const shiftTypes: ShiftType[] = instance.shifts.map((s) => ({
    id: s.id,
    name: s.id,
    start: hhmm(SHIFT_START_MINUTES),
    end: hhmm(SHIFT_START_MINUTES + s.lengthMinutes),
    paidMinutes: s.lengthMinutes,
    night: false,
  }));
  const people: Person[] = instance.staff.map((e) => ({
    id: e.id,
    name: e.id,
    skills: [],
    contract: {
      maxShiftsPerType: { ...e.maxShifts },
      minPaidMinutes: e.minTotalMinutes,
      maxPaidMinutes: e.maxTotalMinutes,
      maxConsecutiveWorkDays: e.maxConsecutiveShifts,
      minConsecutiveWorkDays: e.minConsecutiveShifts,
      minConsecutiveDaysOff: e.minConsecutiveDaysOff,
      maxWeekends: e.maxWeekends,
    },
  }));
  const requests: ShiftRequest[] = [
    ...instance.onRequests.map((r) => ({
      personId: r.staffId,
      day: r.day,
      kind: 'shiftOn' as const,
      shiftTypeId: r.shiftId,
      weight: r.weight,
    })),
    ...instance.offRequests.map((r) => ({
      personId: r.staffId,
      day: r.day,
      kind: 'shiftOff' as const,
      shiftTypeId: r.shiftId,
      weight: r.weight,
    })),
  ];
  const coverNeeds: CoverNeed[] = instance.cover.map((c) => ({
    day: c.day,
    shiftTypeId: c.shiftId,
    skillId: null,
    min: 0,
    target: c.requirement,
    weightUnderTarget: c.weightUnder,
    weightOver: c.weightOver,
  }));
  return {
    startDate: BENCHMARK_START_DATE,
    days: instance.horizon,
    timeZone: 'UTC',
    shiftTypes,
    people,
    coverNeeds,
    requests,
    absences: Object.entries(instance.daysOff).flatMap(([personId, days]) =>
      days.map((day) => ({ personId, day, kind: 'fixedDayOff' as const })),
    ),
    forbiddenSuccessions: instance.shifts.flatMap((s) => s.forbiddenNext.map((to) => ({ from: s.id, to }))),
    pins: [],
    weights: { ...BENCHMARK_WEIGHTS },
    weekendDays: [6, 0],
  };
}

/** The repository root: the nearest folder above this file that holds nx.json (else the working folder). */
export function repoRoot(): string {
  let dir = __dirname;
  for (;;) {
    if (fs.existsSync(path.join(dir, 'nx.json'))) return dir;
    const parent = path.dirname(dir);
    if (parent === dir) return process.cwd();
    dir = parent;
  }
}

/** The benchmark folder: $ROTAPLEX_BENCHMARKS_DIR, else ../shared/benchmarks/curtois-qu beside the repository. */
export function benchmarksDir(): string {
  const fromEnv = process.env[BENCHMARKS_DIR_ENV];
  return fromEnv && fromEnv.trim() !== ''
    ? path.resolve(fromEnv)
    : path.resolve(repoRoot(), '../shared/benchmarks/curtois-qu');
}

/**
 * Resolves an instance reference: a number 1-24 (InstanceN.txt in the benchmark folder) or a path.
 * Throws a clear error naming the folder and the environment variable when the file is missing.
 */
export function resolveInstance(ref: string | number): string {
  const text = String(ref).trim();
  let file: string;
  if (/^\d+$/.test(text)) {
    const n = Number(text);
    if (n < 1 || n > 24) throw new Error(`Instance number ${n} is outside 1-24.`);
    file = path.join(benchmarksDir(), `Instance${n}.txt`);
  } else {
    file = path.resolve(text);
  }
  if (!fs.existsSync(file)) {
    throw new Error(
      `Benchmark file not found: ${file}. Set ${BENCHMARKS_DIR_ENV} to the folder holding Instance1.txt … ` +
        `Instance24.txt (default: ../shared/benchmarks/curtois-qu beside the repository), or pass a path.`,
    );
  }
  return file;
}

export interface LoadedInstance {
  /** File name without .txt, e.g. "Instance3". */
  name: string;
  file: string;
  instance: BenchInstance;
  problem: RosterProblem;
}

export function loadInstance(ref: string | number): LoadedInstance {
  const file = resolveInstance(ref);
  const name = path.basename(file).replace(/\.txt$/i, '');
  const instance = parseCurtoisQu(fs.readFileSync(file, 'utf8'), path.basename(file));
  return { name, file, instance, problem: toRosterProblem(instance) };
}
