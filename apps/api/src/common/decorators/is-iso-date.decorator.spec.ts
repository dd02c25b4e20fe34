import { isIsoDate } from './is-iso-date.decorator';

describe('isIsoDate', () => {
  it('accepts real dates, leap days included', () => {
    expect(['2026-01-31', '2028-02-29', '2000-02-29', '2026-12-31'].filter((d) => !isIsoDate(d))).toEqual([]);
  });

  it('refuses dates that do not exist and other shapes', () => {
    const bad = [
      '2026-02-30',
      '2027-02-29',
      '1900-02-29',
      '2026-04-31',
      '2026-13-01',
      '2026-00-10',
      '2026-1-5',
    ];
    expect(bad.filter((d) => isIsoDate(d))).toEqual([]);
    expect([' 2026-01-01', '2026-01-01T00:00:00Z', 20260101, null].filter((d) => isIsoDate(d))).toEqual([]);
  });
});
