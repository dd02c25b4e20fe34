import {
  API_PREFIX,
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
