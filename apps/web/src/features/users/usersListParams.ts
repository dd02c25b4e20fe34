import type { PageQuery } from '@rotaplex/contracts';

/** The columns the API sorts people by (its UsersQueryDto accepts the same list). */
export const USER_SORT_FIELDS = ['displayName', 'email', 'role', 'active', 'createdAt'] as const;
export type UserSortField = (typeof USER_SORT_FIELDS)[number];
export const USER_PAGE_SIZES = [10, 20, 50] as const;

export interface UsersListParams extends Required<Omit<PageQuery, 'sort'>> {
  sort: UserSortField;
}

export const DEFAULT_USERS_LIST: UsersListParams = {
  page: 1,
  pageSize: 20,
  sort: 'displayName',
  order: 'asc',
  q: '',
};

function positiveInt(value: string | null, fallback: number): number {
  const n = value === null ? NaN : Number(value);
  return Number.isInteger(n) && n >= 1 ? n : fallback;
}

/** Reads list settings from the address bar, falling back to defaults for anything missing or odd. */
export function readUsersListParams(search: URLSearchParams): UsersListParams {
  const sort = search.get('sort');
  const order = search.get('order');
  const pageSize = positiveInt(search.get('pageSize'), DEFAULT_USERS_LIST.pageSize);
  return {
    page: positiveInt(search.get('page'), DEFAULT_USERS_LIST.page),
    pageSize: (USER_PAGE_SIZES as readonly number[]).includes(pageSize)
      ? pageSize
      : DEFAULT_USERS_LIST.pageSize,
    sort: (USER_SORT_FIELDS as readonly string[]).includes(sort ?? '')
      ? (sort as UserSortField)
      : DEFAULT_USERS_LIST.sort,
    order: order === 'desc' ? 'desc' : 'asc',
    q: (search.get('q') ?? '').trim(),
  };
}

/** Writes list settings to the address bar, leaving defaults out so links stay short. */
export function writeUsersListParams(params: UsersListParams): URLSearchParams {
  const search = new URLSearchParams();
  for (const key of ['q', 'sort', 'order', 'page', 'pageSize'] as const) {
    if (params[key] !== DEFAULT_USERS_LIST[key]) search.set(key, String(params[key]));
  }
  return search;
}
