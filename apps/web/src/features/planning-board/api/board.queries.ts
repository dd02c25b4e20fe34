import { queryOptions } from '@tanstack/react-query';
import {
  MAX_PAGE_SIZE,
  PLANNING_ROUTES,
  REQUESTS_ROUTES,
  SOLVING_ROUTES,
  type AssignmentCellRequest,
  type AssignmentGridDto,
  type CoverNeedsDto,
  type Page,
  type PeriodRequestsDto,
  type PinCellRequest,
  type RosterPeriodDto,
  type SolveProgressDto,
  type SolveRunDto,
  type SolveRunStartedDto,
  type SolveRunSummaryDto,
  type StaffMemberDto,
} from '@rotaplex/contracts';
import { api, apiRequest, buildUrl, refreshSession } from '@/api/client';
import { ApiRequestError, toApiError } from '@/api/errors';
import { session } from '@/api/session';

export const boardKeys = {
  period: (id: string) => ['roster-periods', 'one', id] as const,
  grid: (id: string) => ['assignments', id] as const,
  runs: (id: string) => ['solve-runs', id] as const,
  unitStaff: (unitId: string) => ['staff', 'unit-all', unitId] as const,
  requests: (id: string) => ['requests', 'period', id] as const,
};

export const rosterPeriodQuery = (id: string) =>
  queryOptions({
    queryKey: boardKeys.period(id),
    queryFn: ({ signal }) => api.get<RosterPeriodDto>(PLANNING_ROUTES.rosterPeriod(id), undefined, signal),
  });

export const assignmentsQuery = (periodId: string) =>
  queryOptions({
    queryKey: boardKeys.grid(periodId),
    queryFn: ({ signal }) =>
      api.get<AssignmentGridDto>(SOLVING_ROUTES.assignments(periodId), undefined, signal),
  });

/**
 * The period's latest solve run with its result (the board shows only that one), as a list of at
 * most one: the run list is paged and leaves results out, so the latest run is read by its id.
 */
export const solveRunsQuery = (periodId: string) =>
  queryOptions({
    queryKey: boardKeys.runs(periodId),
    queryFn: async ({ signal }): Promise<SolveRunDto[]> => {
      const newest = await api.get<Page<SolveRunSummaryDto>>(
        SOLVING_ROUTES.periodSolveRuns(periodId),
        { page: 1, pageSize: 1 },
        signal,
      );
      const latest = newest.items[0];
      return latest
        ? [await api.get<SolveRunDto>(SOLVING_ROUTES.solveRun(latest.id), undefined, signal)]
        : [];
    },
  });

/**
 * Every item of a paged list: reads page 1, 2, … until it holds `total` items (or a page comes
 * back empty, so a list that shrinks while it is read still ends).
 */
export async function readAllPages<T>(fetchPage: (page: number) => Promise<Page<T>>): Promise<T[]> {
  const all: T[] = [];
  for (let page = 1; ; page += 1) {
    const batch = await fetchPage(page);
    all.push(...batch.items);
    if (batch.items.length === 0 || all.length >= batch.total) return all;
  }
}

/** Every staff member of the unit (skills and contracts for cover and hours), MAX_PAGE_SIZE a page. */
export const fetchAllUnitStaff = (unitId: string, signal?: AbortSignal) =>
  readAllPages((page) =>
    api.get<Page<StaffMemberDto>>(
      PLANNING_ROUTES.staff,
      { unitId, page, pageSize: MAX_PAGE_SIZE, sort: 'name' },
      signal,
    ),
  );

export const unitStaffQuery = (unitId: string) =>
  queryOptions({
    queryKey: boardKeys.unitStaff(unitId),
    queryFn: ({ signal }) => fetchAllUnitStaff(unitId, signal),
    enabled: unitId !== '',
  });

/** The period's date requests, overlapping leave and availability (managers). */
export const periodRequestsQuery = (periodId: string) =>
  queryOptions({
    queryKey: boardKeys.requests(periodId),
    queryFn: ({ signal }) =>
      api.get<PeriodRequestsDto>(REQUESTS_ROUTES.periodRequests(periodId), undefined, signal),
  });

export const coverNeedsQuery = (unitId: string) =>
  queryOptions({
    queryKey: ['cover-needs', unitId] as const,
    queryFn: ({ signal }) => api.get<CoverNeedsDto>(PLANNING_ROUTES.coverNeeds(unitId), undefined, signal),
    enabled: unitId !== '',
  });

export const startSolveRun = (periodId: string, timeLimitSeconds: number) =>
  api.post<SolveRunStartedDto>(SOLVING_ROUTES.periodSolveRuns(periodId), { timeLimitSeconds });
export const cancelSolveRun = (runId: string) => api.post<SolveRunDto>(SOLVING_ROUTES.solveRunCancel(runId));
export const editCell = (periodId: string, body: AssignmentCellRequest) =>
  apiRequest<AssignmentGridDto>(SOLVING_ROUTES.assignmentCell(periodId), { method: 'PUT', body });
export const setPinned = (periodId: string, body: PinCellRequest, pinned: boolean) =>
  api.post<AssignmentGridDto>(
    pinned ? SOLVING_ROUTES.assignmentPin(periodId) : SOLVING_ROUTES.assignmentUnpin(periodId),
    body,
  );

export interface SolveRunEventHandlers {
  onStatus?: (run: SolveRunDto) => void;
  onProgress?: (progress: SolveProgressDto) => void;
  onEnd?: (run: SolveRunDto) => void;
}

/** Splits a server-sent events text stream into (event, data) pairs; returns the unread rest. */
export function parseEventBlocks(buffer: string, emit: (event: string, data: string) => void): string {
  const blocks = buffer.replace(/\r\n/g, '\n').split('\n\n');
  const rest = blocks.pop() ?? '';
  for (const block of blocks) {
    let event = 'message';
    const data: string[] = [];
    for (const line of block.split('\n')) {
      if (line.startsWith(':')) continue;
      const colon = line.indexOf(':');
      const field = colon < 0 ? line : line.slice(0, colon);
      const value = colon < 0 ? '' : line.slice(colon + 1).replace(/^ /, '');
      if (field === 'event') event = value;
      else if (field === 'data') data.push(value);
    }
    if (data.length > 0) emit(event, data.join('\n'));
  }
  return rest;
}

/**
 * Follows GET /solve-runs/:id/events with fetch (EventSource cannot send the Authorization header).
 * Resolves when the stream ends (after `end`) or the signal aborts.
 */
export async function followSolveRun(
  runId: string,
  handlers: SolveRunEventHandlers,
  signal: AbortSignal,
): Promise<void> {
  const open = () => {
    const token = session.getAccessToken();
    return fetch(buildUrl(SOLVING_ROUTES.solveRunEvents(runId)), {
      headers: { Accept: 'text/event-stream', ...(token ? { Authorization: `Bearer ${token}` } : {}) },
      credentials: 'include',
      signal,
    });
  };
  let response = await open();
  if (response.status === 401 && (await refreshSession())) response = await open();
  if (!response.ok || !response.body) {
    const text = await response.text().catch(() => '');
    let body: unknown = text;
    try {
      body = JSON.parse(text) as unknown;
    } catch {
      /* plain text */
    }
    throw new ApiRequestError(toApiError(response.status, response.statusText, body));
  }
  const reader = response.body.pipeThrough(new TextDecoderStream()).getReader();
  let buffer = '';
  for (;;) {
    const { value, done } = await reader.read();
    if (done) break;
    buffer = parseEventBlocks(buffer + value, (event, data) => {
      const parsed = JSON.parse(data) as unknown;
      if (event === 'status') handlers.onStatus?.(parsed as SolveRunDto);
      else if (event === 'progress') handlers.onProgress?.(parsed as SolveProgressDto);
      else if (event === 'end') handlers.onEnd?.(parsed as SolveRunDto);
    });
  }
}
