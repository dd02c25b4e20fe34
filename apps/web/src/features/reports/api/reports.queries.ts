import { queryOptions } from '@tanstack/react-query';
import { REPORTS_ROUTES, type PeriodReportDto } from '@rotaplex/contracts';
import { api, buildUrl, refreshSession } from '@/api/client';
import { ApiRequestError, toApiError } from '@/api/errors';
import { session } from '@/api/session';
import { fileNameFromDisposition } from '../utils/reportFigures';

export const reportKeys = {
  all: ['reports'] as const,
  period: (periodId: string) => ['reports', 'period', periodId] as const,
};

export const periodReportQuery = (periodId: string) =>
  queryOptions({
    queryKey: reportKeys.period(periodId),
    queryFn: ({ signal }) => api.get<PeriodReportDto>(REPORTS_ROUTES.report, { periodId }, signal),
    enabled: periodId !== '',
    // The roster changes on the board (edits, Generate) without touching this key, so an earlier visit's
    // figures must not be shown again; a few seconds only spare the route loader's prefetch a second fetch.
    staleTime: 5_000,
  });

/** GET with the access token, refreshed once on a 401 (the JSON client does not read files). */
async function authorisedGet(url: string): Promise<Response> {
  const attempt = () => {
    const token = session.getAccessToken();
    return fetch(url, {
      headers: { Accept: 'text/csv', ...(token ? { Authorization: `Bearer ${token}` } : {}) },
      credentials: 'include',
    });
  };
  const response = await attempt();
  if (response.status !== 401) return response;
  const hadSession = session.getState().status === 'signedIn';
  if (await refreshSession()) return attempt();
  if (hadSession) session.signedOut('expired');
  return response;
}

/**
 * Fetches the period's payroll CSV and saves it under the name the server gives
 * (Content-Disposition), through a temporary object URL.
 */
export async function downloadPayrollCsv(periodId: string): Promise<string> {
  const response = await authorisedGet(buildUrl(REPORTS_ROUTES.payrollCsv, { periodId }));
  if (!response.ok) {
    const text = await response.text();
    let body: unknown = text;
    try {
      body = JSON.parse(text) as unknown;
    } catch {
      // Plain text body.
    }
    throw new ApiRequestError(toApiError(response.status, response.statusText, body));
  }
  const fileName =
    fileNameFromDisposition(response.headers.get('Content-Disposition')) ?? `payroll-${periodId}.csv`;
  const url = URL.createObjectURL(await response.blob());
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
  return fileName;
}
