/**
 * Shared parts of the product benchmarks: they start the built product exactly as the browser
 * journeys do (production mode, demo data, a fresh data directory) and talk to it over HTTP.
 * Build first: npx nx run-many -t build --projects=web,api
 */
import {
  API_PREFIX,
  API_ROUTES,
  MAX_PAGE_SIZE,
  type Page,
  PLANNING_ROUTES,
  type RosterPeriodDto,
  type TokenResponse,
} from '@rotaplex/contracts';
import { DEMO_PASSWORD } from '../src/support/browser';
import { startServer, stopServer, type RunningServer } from '../src/support/server';

export { startServer, stopServer, type RunningServer };

export interface ApiSession {
  baseUrl: string;
  token: string;
}

export async function signInApi(baseUrl: string, email: string): Promise<ApiSession> {
  const response = await fetch(`${baseUrl}${API_PREFIX}${API_ROUTES.auth.login}`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  if (!response.ok)
    throw new Error(`Sign-in of ${email} failed: ${response.status} ${await response.text()}`);
  return { baseUrl, token: ((await response.json()) as TokenResponse).accessToken };
}

export async function api<T>(session: ApiSession, path: string, init: RequestInit = {}): Promise<T> {
  const response = await fetch(`${session.baseUrl}${API_PREFIX}${path}`, {
    ...init,
    headers: {
      'content-type': 'application/json',
      authorization: `Bearer ${session.token}`,
      ...init.headers,
    },
  });
  if (!response.ok)
    throw new Error(`${init.method ?? 'GET'} ${path}: ${response.status} ${await response.text()}`);
  return (await response.json()) as T;
}

/** The demo's draft periods that a manager sees. */
export async function draftPeriods(session: ApiSession): Promise<RosterPeriodDto[]> {
  const { items } = await api<Page<RosterPeriodDto>>(
    session,
    `${PLANNING_ROUTES.rosterPeriods}?status=draft&pageSize=${MAX_PAGE_SIZE}`,
  );
  return items;
}

/** A small fixed-width table for the console, one header row and a rule. */
export function table(header: string[], rows: (string | number)[][]): string {
  const cells = [header, ...rows.map((r) => r.map(String))];
  const widths = header.map((_, c) => Math.max(...cells.map((r) => r[c].length)));
  const line = (r: string[]) => r.map((v, c) => v.padEnd(widths[c])).join('  ');
  return [line(cells[0]), widths.map((w) => '-'.repeat(w)).join('  '), ...cells.slice(1).map(line)].join(
    '\n',
  );
}
