import {
  API_PREFIX,
  MAX_PAGE_SIZE,
  PLANNING_ROUTES,
  type Page as PageOf,
  type RosterPeriodDto,
  type ShiftTypeDto,
  type StaffMemberDto,
  type TokenResponse,
  type UnitDto,
} from '@rotaplex/contracts';
import { baseUrl, DEMO_PASSWORD } from './browser';

/** The demo ward the journeys set their own periods up in (demo data). */
export const DEMO_WARD = 'Ward 7 Acute Medicine';

/**
 * Calls the running server's API (setting up or reading back the data a journey works on). A null
 * token calls without signing in. Fails with the status and body on any answer that is not 2xx.
 */
export async function apiCall<T>(
  token: string | null,
  method: string,
  path: string,
  body?: unknown,
): Promise<T> {
  const response = await fetch(`${baseUrl()}${API_PREFIX}${path}`, {
    method,
    headers: {
      ...(token ? { Authorization: `Bearer ${token}` } : {}),
      ...(body === undefined ? {} : { 'Content-Type': 'application/json' }),
    },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  if (!response.ok) throw new Error(`${method} ${path}: ${response.status} ${await response.text()}`);
  return (response.status === 204 ? undefined : await response.json()) as T;
}

/** Signs in through the API (not the form) and returns the access token. */
export async function apiSignIn(email: string, password = DEMO_PASSWORD): Promise<string> {
  return (await apiCall<TokenResponse>(null, 'POST', '/auth/login', { email, password })).accessToken;
}

/** The demo ward, as the signed-in manager sees it. */
export async function findWard(token: string, name = DEMO_WARD): Promise<UnitDto> {
  const ward = (await apiCall<UnitDto[]>(token, 'GET', '/units')).find((u) => u.name === name);
  if (!ward) throw new Error(`No unit named ${name}`);
  return ward;
}

/** Creates a draft roster period of the unit. */
export function createPeriod(
  token: string,
  unitId: string,
  startDate: string,
  days = 7,
): Promise<RosterPeriodDto> {
  return apiCall<RosterPeriodDto>(token, 'POST', PLANNING_ROUTES.rosterPeriods, { unitId, startDate, days });
}

/** The unit's shift type ids by code (E, L, N, ...). */
export async function shiftIdsByCode(token: string, unitId: string): Promise<Record<string, string>> {
  const types = await apiCall<ShiftTypeDto[]>(token, 'GET', PLANNING_ROUTES.shiftTypes(unitId));
  return Object.fromEntries(types.map((s) => [s.code, s.id]));
}

/** Looks up the unit's staff member ids by name (throws on a name that is not on the unit). */
export async function staffIdLookup(token: string, unitId: string): Promise<(name: string) => string> {
  const people = await apiCall<PageOf<StaffMemberDto>>(
    token,
    'GET',
    `${PLANNING_ROUTES.staff}?unitId=${unitId}&pageSize=100`,
  );
  return (name) => {
    const person = people.items.find((p) => p.name === name);
    if (!person) throw new Error(`No staff member named ${name}`);
    return person.id;
  };
}

/** Signs the demo manager in through the API and creates a draft period of the demo ward. */
export async function managerPeriod(
  startDate: string,
  days = 7,
): Promise<{ token: string; ward: UnitDto; period: RosterPeriodDto }> {
  const token = await apiSignIn('manager@example.com');
  const ward = await findWard(token);
  return { token, ward, period: await createPeriod(token, ward.id, startDate, days) };
}

/**
 * The demo's own roster period of the unit: the first period made for it, by the demo seed before
 * any journey ran. Journeys add periods of their own before, after or between others in any order
 * (Jest picks it), so the demo period is found by when it was made, never by its dates.
 */
export async function demoPeriod(token: string, unitId: string): Promise<RosterPeriodDto> {
  const all: RosterPeriodDto[] = [];
  for (let page = 1; ; page++) {
    const { items, total } = await apiCall<PageOf<RosterPeriodDto>>(
      token,
      'GET',
      `${PLANNING_ROUTES.rosterPeriods}?unitId=${unitId}&page=${page}&pageSize=${MAX_PAGE_SIZE}`,
    );
    all.push(...items);
    if (items.length === 0 || all.length >= total) break;
  }
  const [first] = all.sort((a, b) => a.createdAt.localeCompare(b.createdAt));
  // The seed's period is four weeks long (apps/api/src/demo/demo-planning.ts).
  if (!first || first.days !== 28) throw new Error('The unit has no four-week demo period');
  return first;
}
