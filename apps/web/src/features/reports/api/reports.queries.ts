import { queryOptions } from '@tanstack/react-query';
import {
  type LateChangesDto,
  NOTICE_WINDOW_ROUTES,
  REPORTS_ROUTES,
  type PeriodReportDto,
} from '@rotaplex/contracts';
import { api, buildUrl } from '@/api/client';
import { authorisedFetch, responseError, saveFile } from '@/api/files';
import { fileNameFromDisposition } from '../utils/reportFigures';

export const reportKeys = {
  all: ['reports'] as const,
  period: (periodId: string) => ['reports', 'period', periodId] as const,
  lateChanges: (periodId: string) => ['reports', 'period', periodId, 'late-changes'] as const,
};

/** The period's changes inside the notice window and the predictability pay recorded per person. */
export const lateChangesQuery = (periodId: string) =>
  queryOptions({
    queryKey: reportKeys.lateChanges(periodId),
    queryFn: ({ signal }) =>
      api.get<LateChangesDto>(NOTICE_WINDOW_ROUTES.lateChanges(periodId), undefined, signal),
    enabled: periodId !== '',
    staleTime: 5_000,
  });

export const periodReportQuery = (periodId: string) =>
  queryOptions({
    queryKey: reportKeys.period(periodId),
    queryFn: ({ signal }) => api.get<PeriodReportDto>(REPORTS_ROUTES.report, { periodId }, signal),
    enabled: periodId !== '',
    // The roster changes on the board (edits, Generate) without touching this key, so an earlier visit's
    // figures must not be shown again; a few seconds only spare the route loader's prefetch a second fetch.
    staleTime: 5_000,
  });

/**
 * Fetches the period's payroll CSV and saves it under the name the server gives
 * (Content-Disposition), through a temporary object URL.
 */
export async function downloadPayrollCsv(periodId: string): Promise<string> {
  const response = await authorisedFetch(buildUrl(REPORTS_ROUTES.payrollCsv, { periodId }), {
    headers: { Accept: 'text/csv' },
  });
  if (!response.ok) throw await responseError(response);
  const fileName =
    fileNameFromDisposition(response.headers.get('Content-Disposition')) ?? `payroll-${periodId}.csv`;
  saveFile(await response.blob(), fileName);
  return fileName;
}
