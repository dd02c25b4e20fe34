import { NOTICE_WINDOW_DAYS_DEFAULT } from '@rotaplex/contracts';
import { LateChangeEntity } from './late-change.entity';
import { initiatorOf, insideNoticeWindow, lateNotes, lateSummary, owedPerPerson } from './notice-window';

/**
 * The notice window of US predictive scheduling ("fair workweek") laws: schedules posted 14 days
 * ahead, later changes carry predictability pay (Seattle SMC 14.22, Oregon SB 828, Chicago Fair
 * Workweek Ordinance, Philadelphia ch. 9-4600; PRODUCT.md "Trade facts"). Exceptions include changes
 * the employee asks for and shift trades they agree (Seattle SMC 14.22, from memory).
 */
describe('notice window', () => {
  const TODAY = '2026-12-05';

  it('puts a change with 13 days of notice or fewer inside a 14-day window, 14 or more outside', () => {
    expect(NOTICE_WINDOW_DAYS_DEFAULT).toBe(14);
    expect(insideNoticeWindow(TODAY, '2026-12-05', 14)).toBe(true); // the same day
    expect(insideNoticeWindow(TODAY, '2026-12-10', 14)).toBe(true); // 5 days
    expect(insideNoticeWindow(TODAY, '2026-12-18', 14)).toBe(true); // 13 days
    expect(insideNoticeWindow(TODAY, '2026-12-19', 14)).toBe(false); // 14 days: in time
    expect(insideNoticeWindow(TODAY, '2026-12-25', 14)).toBe(false); // 20 days
    // Across a month and a year end, by calendar days.
    expect(insideNoticeWindow('2026-12-30', '2027-01-12', 14)).toBe(true); // 13 days
    expect(insideNoticeWindow('2026-12-30', '2027-01-13', 14)).toBe(false); // 14 days
  });

  it('leaves days already past and a window of 0 days outside', () => {
    expect(insideNoticeWindow(TODAY, '2026-12-04', 14)).toBe(false);
    expect(insideNoticeWindow(TODAY, TODAY, 0)).toBe(false);
  });

  it("counts the person's own swaps, claims and leave as theirs, everything else as the employer's", () => {
    expect(initiatorOf('swap', false)).toBe('employee');
    expect(initiatorOf('open-shift-claim', false)).toBe('employee');
    expect(initiatorOf('repair', true)).toBe('employee');
    expect(initiatorOf('repair', false)).toBe('employer');
    expect(initiatorOf('edit', false)).toBe('employer');
  });

  const row = (over: Partial<LateChangeEntity>): LateChangeEntity =>
    Object.assign(new LateChangeEntity(), {
      id: 'x',
      rosterPeriodId: 'p',
      version: 3,
      kind: 'repair',
      initiatedBy: 'employer',
      staffMemberId: 'a',
      staffName: 'Ada Quill',
      date: '2026-12-10',
      shiftBefore: null,
      shiftAfter: 'Early',
      daysNotice: 5,
      noticeWindowDays: 14,
      payHours: 1.5,
      payRule: null,
      reason: '',
      actorName: 'M',
      at: new Date(),
      ...over,
    });

  it('adds up the pay recorded per person, most hours first, and leaves exempt changes out', () => {
    const owed = owedPerPerson([
      row({ staffMemberId: 'a', staffName: 'Ada Quill' }),
      row({ staffMemberId: 'b', staffName: 'Bo Lark' }),
      row({ staffMemberId: 'b', staffName: 'Bo Lark', date: '2026-12-11' }),
      row({ staffMemberId: 'c', staffName: 'Cy Fern', initiatedBy: 'employee', payHours: null }),
    ]);
    expect(owed).toEqual([
      { staffMemberId: 'b', staffName: 'Bo Lark', changes: 2, hours: 3 },
      { staffMemberId: 'a', staffName: 'Ada Quill', changes: 1, hours: 1.5 },
    ]);
  });

  it('says in the audit entry and the e-mail that a change is late', () => {
    expect(lateSummary([])).toBe('');
    expect(lateSummary([row({}), row({ staffMemberId: 'c', initiatedBy: 'employee', payHours: null })])).toBe(
      '; 2 changes are inside the 14-day notice window (1 asked for by the person, commonly exempt); ' +
        'predictability pay recorded: 1.5 h for 1 change',
    );
    const notes = lateNotes([row({}), row({ date: '2026-12-11' })]);
    expect(notes.get('a')).toMatch(
      /^This is a late change: Thu 10 Dec 2026, Fri 11 Dec 2026 are less than 14 days away/,
    );
  });
});
