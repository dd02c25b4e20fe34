import type { ShiftTypeDto, SkillDto, UnmetNeedExplanationDto } from '@rotaplex/contracts';
import {
  boardRedFlags,
  coverCellKey,
  findingMessage,
  gapPercent,
  gradeUnmetNeeds,
  qualityLine,
  redFlagsByCell,
} from './boardQuality';
import type { CoverLine, HoursLine } from './boardSummary';

const night: ShiftTypeDto = {
  id: 'N',
  unitId: 'u',
  code: 'N',
  name: 'Night',
  start: '20:00',
  end: '08:00',
  paidMinutes: 690,
  colour: 'plum',
  night: null,
};
const rn: SkillDto = { id: 'rn', code: 'RN', name: 'Registered nurse' } as SkillDto;
const dates = ['2027-01-04', '2027-01-05', '2027-01-06'];
const cover: CoverLine[] = [
  {
    shiftType: night,
    skill: null,
    days: [
      { count: 3, need: { min: 3, target: 4 } },
      { count: 2, need: { min: 3, target: 4 } },
      { count: 2, need: { min: 3, target: 4 } },
    ],
  },
  {
    shiftType: night,
    skill: rn,
    days: [
      { count: 2, need: { min: 2, target: 2 } },
      { count: 0, need: { min: 2, target: 2 } },
      { count: 1, need: { min: 2, target: 2 } },
    ],
  },
];
const need = (date: string, skillId: string | null, short = 1): UnmetNeedExplanationDto => ({
  date,
  shiftTypeId: 'N',
  skillId,
  short,
  reasons: [],
});

describe('unmet needs graded by severity', () => {
  // Severity order (common practice, no source; NICE SG1 2014 names fewer than 2 registered nurses on a
  // shift a red flag): nobody of a required skill, then below minimum, then below target.
  it('puts none of a skill first, then below minimum, then below target, each by date', () => {
    const graded = gradeUnmetNeeds(
      [
        need('2027-01-04', null),
        need('2027-01-06', 'rn'),
        need('2027-01-05', null),
        need('2027-01-05', 'rn', 2),
      ],
      cover,
      dates,
    );
    expect(graded.map((g) => [g.severity, g.need.date, g.need.skillId])).toEqual([
      ['noneOfSkill', '2027-01-05', 'rn'],
      ['belowMinimum', '2027-01-05', null],
      ['belowMinimum', '2027-01-06', 'rn'],
      ['belowTarget', '2027-01-04', null],
    ]);
    expect(graded[0]).toMatchObject({ count: 0, min: 2, target: 2 });
  });
  it('never plays down a need the board cannot find: it counts as below minimum', () => {
    expect(gradeUnmetNeeds([need('2027-02-01', null)], cover, dates)[0].severity).toBe('belowMinimum');
  });
});

describe('the quality line in words', () => {
  const within: HoursLine = { paidMinutes: 0, min: 0, target: 0, max: 0, state: 'within' };
  const under: HoursLine = { ...within, state: 'under' };
  const result = {
    gap: 0.12324,
    solverStatus: 'timeLimit',
    objective: 100,
    staffing: { peopleShort: 4, shiftsShort: 3, noneOfSkill: 1, fewestPossible: 3, proven: true },
    explanations: { unmetNeeds: [], requestsNotHonoured: [], conflicts: null },
  };
  it('says shortfalls, requests honoured, hours and the gap with one rounding, without solver words', () => {
    const marks = new Map([
      ['a|1', { leave: null, requests: [{ honoured: true }, { honoured: false }] }],
      ['b|1', { leave: null, requests: [{ honoured: true }] }],
    ]) as never;
    const line = qualityLine({
      result,
      hours: new Map([
        ['a', within],
        ['b', under],
      ]),
      marks,
    });
    expect(line).toBe(
      '3 shifts are below minimum staffing; 2 of 3 requests honoured; 1 person is outside contract hours; at most 12.3% better is possible.',
    );
    expect(line).not.toMatch(/objective|bound|gap/i);
  });
  it('says when nothing better is possible and every minimum is met', () => {
    const line = qualityLine({
      result: {
        ...result,
        gap: 0,
        solverStatus: 'optimal',
        staffing: { ...result.staffing, shiftsShort: 0 },
      },
      hours: new Map([['a', within]]),
    });
    expect(line).toBe(
      'Every shift has its minimum staff; everyone is within contract hours; no better roster is possible.',
    );
  });
  it('does not claim "at most 101% better" when the bound is still too weak to say anything', () => {
    const line = qualityLine({ result: { ...result, gap: 1.009 }, hours: new Map() });
    expect(line).toBe(
      '3 shifts are below minimum staffing; how much better a roster could be is not known yet.',
    );
  });
  it('rounds the gap once, to a tenth of a percentage point (0.12324 is 12.3%, 0.1235 is 12.4%)', () => {
    expect(gapPercent(0.12324)).toBe('12.3%');
    expect(gapPercent(0.1235)).toBe('12.4%');
    expect(gapPercent(0.5)).toBe('50%');
  });
});

describe('red flags on the board (NICE SG1 2014 via PRODUCT.md: "fewer than 2 registered nurses on a shift")', () => {
  it('flags the nights with fewer than 2 of a registered skill the board counts, by date', () => {
    const registered = cover.map((l) => (l.skill ? { ...l, skill: { ...rn, registered: true } } : l));
    const flags = boardRedFlags(registered, dates);
    // 2 of 2 on the 4th is safe; 0 and 1 of 2 on the 5th and 6th: fewer than 2, 11.5 h and 23 h short
    // (more than 8 h), 100% and 50% of the need (more than 25%).
    expect(flags.map((f) => [f.date, f.onShift, f.shortHours, f.rules.length])).toEqual([
      ['2027-01-05', 0, 23, 3],
      ['2027-01-06', 1, 11.5, 3],
    ]);
    expect(flags[1].text).toMatch(/^Wed 6 Jan, Night, Registered nurse \(RN\): 1 on the shift of 2 needed/);
  });

  it('marks the cover cells the red flags stand on, and no other (the RN row, not the "anyone" row)', () => {
    const registered = cover.map((l) => (l.skill ? { ...l, skill: { ...rn, registered: true } } : l));
    const cells = redFlagsByCell(boardRedFlags(registered, dates));
    // The cells of the 5th and 6th in the RN row: 0 and 1 of the 2 needed (fewer than 2 on the shift).
    expect([...cells.keys()]).toEqual([
      coverCellKey('N', 'rn', '2027-01-05'),
      coverCellKey('N', 'rn', '2027-01-06'),
    ]);
    expect(cells.get(coverCellKey('N', 'rn', '2027-01-06'))?.onShift).toBe(1);
    // 2 of 2 on the 4th is safe; the row for anyone on the shift holds no registered skill.
    expect(cells.has(coverCellKey('N', 'rn', '2027-01-04'))).toBe(false);
    expect(dates.some((d) => cells.has(coverCellKey('N', null, d)))).toBe(false);
  });

  it('finds none when the skill is not marked registered', () => {
    const unregistered = cover.map((l) => (l.skill ? { ...l, skill: { ...rn, registered: false } } : l));
    expect(boardRedFlags(unregistered, dates)).toEqual([]);
  });
});

describe('rule findings under the person’s name (common practice, no source: say a name once)', () => {
  it('drops the name the checker put first, and nothing else', () => {
    expect(findingMessage('Agnieszka Nowak: 0 paid minutes (at least 1800)', 'Agnieszka Nowak')).toBe(
      '0 paid minutes (at least 1800)',
    );
    // Another person's name, a name inside the message, or no name known: the message as it is.
    expect(findingMessage('Agnieszka Nowak: 0 paid minutes', 'Beth Lindqvist')).toBe(
      'Agnieszka Nowak: 0 paid minutes',
    );
    expect(findingMessage('Rest after Agnieszka Nowak: 8 h', 'Agnieszka Nowak')).toBe(
      'Rest after Agnieszka Nowak: 8 h',
    );
    expect(findingMessage('Agnieszka Nowak: 0 paid minutes', undefined)).toBe(
      'Agnieszka Nowak: 0 paid minutes',
    );
  });
});
