/**
 * Query of GET /api/users beyond the common paging: the columns it sorts by and its filters.
 * (Added by the API; the server rejects any other sort column with 400.)
 */
import type { PageQuery } from './dto';
import type { Role } from './roles';

export const USER_SORT_FIELDS = ['displayName', 'email', 'role', 'active', 'createdAt'] as const;
export type UserSortField = (typeof USER_SORT_FIELDS)[number];

export interface UserListQuery extends PageQuery {
  /** Default displayName. */
  sort?: UserSortField;
  role?: Role;
  unitId?: string;
  /** Sent as the text "true" or "false". */
  active?: boolean;
}

/** Largest pageSize any list accepts; the default is 20. */
export const MAX_PAGE_SIZE = 100;
