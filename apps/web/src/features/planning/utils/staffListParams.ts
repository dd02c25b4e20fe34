import { STAFF_SORT_FIELDS, type StaffSortField } from '@rotaplex/contracts';

export const STAFF_PAGE_SIZES = [10, 20, 50] as const;
export type StaffActiveFilter = 'all' | 'active' | 'inactive';

export interface StaffListParams {
  unitId: string;
  page: number;
  pageSize: number;
  sort: StaffSortField;
  order: 'asc' | 'desc';
  q: string;
  /** Skill code, '' for any. */
  skill: string;
  active: StaffActiveFilter;
}

export const DEFAULT_STAFF_LIST: Omit<StaffListParams, 'unitId'> = {
  page: 1,
  pageSize: 20,
  sort: 'name',
  order: 'asc',
  q: '',
  skill: '',
  active: 'all',
};

function positiveInt(value: string | null, fallback: number): number {
  const n = value === null ? NaN : Number(value);
  return Number.isInteger(n) && n >= 1 ? n : fallback;
}

/** Reads the staff list settings from the address bar; anything missing or odd falls back to a default. */
export function readStaffListParams(search: URLSearchParams, unitId: string): StaffListParams {
  const sort = search.get('sort') ?? '';
  const active = search.get('active') ?? '';
  const pageSize = positiveInt(search.get('pageSize'), DEFAULT_STAFF_LIST.pageSize);
  return {
    unitId,
    page: positiveInt(search.get('page'), DEFAULT_STAFF_LIST.page),
    pageSize: (STAFF_PAGE_SIZES as readonly number[]).includes(pageSize)
      ? pageSize
      : DEFAULT_STAFF_LIST.pageSize,
    sort: (STAFF_SORT_FIELDS as readonly string[]).includes(sort)
      ? (sort as StaffSortField)
      : DEFAULT_STAFF_LIST.sort,
    order: search.get('order') === 'desc' ? 'desc' : 'asc',
    q: (search.get('q') ?? '').trim(),
    skill: (search.get('skill') ?? '').trim().toUpperCase(),
    active: active === 'active' || active === 'inactive' ? active : 'all',
  };
}

/** Writes the settings back, keeping the unit choice and leaving defaults out so links stay short. */
export function writeStaffListParams(params: StaffListParams, current: URLSearchParams): URLSearchParams {
  const search = new URLSearchParams();
  const unit = current.get('unit');
  if (unit) search.set('unit', unit);
  for (const key of ['q', 'skill', 'active', 'sort', 'order', 'page', 'pageSize'] as const) {
    if (params[key] !== DEFAULT_STAFF_LIST[key]) search.set(key, String(params[key]));
  }
  return search;
}
