import { DEFAULT_STAFF_LIST, readStaffListParams, writeStaffListParams } from './staffListParams';

describe('staff list settings in the address bar', () => {
  it('falls back to defaults for missing or unknown values', () => {
    const params = readStaffListParams(
      new URLSearchParams('sort=salary&order=up&page=-2&pageSize=7&active=maybe'),
      'u1',
    );
    expect(params).toEqual({ ...DEFAULT_STAFF_LIST, unitId: 'u1' });
  });

  it('round-trips every setting and keeps the unit choice', () => {
    const search = new URLSearchParams(
      'unit=u1&q=ann&skill=rn&active=inactive&sort=hourlyCost&order=desc&page=3&pageSize=50',
    );
    const params = readStaffListParams(search, 'u1');
    expect(params).toEqual({
      unitId: 'u1',
      q: 'ann',
      skill: 'RN',
      active: 'inactive',
      sort: 'hourlyCost',
      order: 'desc',
      page: 3,
      pageSize: 50,
    });
    const written = writeStaffListParams(params, search);
    expect(written.get('unit')).toBe('u1');
    expect(readStaffListParams(written, 'u1')).toEqual(params);
  });

  it('leaves defaults out so links stay short', () => {
    expect(
      writeStaffListParams({ ...DEFAULT_STAFF_LIST, unitId: 'u1' }, new URLSearchParams()).toString(),
    ).toBe('');
  });
});
