import { DEFAULT_USERS_LIST, readUsersListParams, writeUsersListParams } from './usersListParams';
import { pageRange } from '@/ui/paging';

describe('people list settings in the address bar', () => {
  it('reads a shared link back to the same settings', () => {
    const params = { page: 3, pageSize: 50, sort: 'email' as const, order: 'desc' as const, q: 'ann lee' };
    const search = writeUsersListParams(params);
    // WHATWG URL Standard, application/x-www-form-urlencoded serializer: space becomes "+".
    expect(search.toString()).toBe('q=ann+lee&sort=email&order=desc&page=3&pageSize=50');
    expect(readUsersListParams(new URLSearchParams(search.toString()))).toEqual(params);
  });

  it('leaves defaults out of the address', () => {
    expect(writeUsersListParams(DEFAULT_USERS_LIST).toString()).toBe('');
  });

  it('falls back to defaults for hand-edited nonsense', () => {
    const read = readUsersListParams(new URLSearchParams('page=-2&pageSize=7&sort=passwordHash&order=up'));
    expect(read).toEqual(DEFAULT_USERS_LIST);
  });
});

describe('page ranges', () => {
  it('numbers the rows of a middle and a last page', () => {
    expect(pageRange(2, 20, 57)).toEqual({ first: 21, last: 40, pages: 3 });
    expect(pageRange(3, 20, 57)).toEqual({ first: 41, last: 57, pages: 3 });
  });

  it('has one empty page when there is nothing', () => {
    expect(pageRange(1, 20, 0)).toEqual({ first: 0, last: 0, pages: 1 });
  });
});
