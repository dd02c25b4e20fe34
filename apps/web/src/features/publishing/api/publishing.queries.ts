import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import {
  type AuditEntryDto,
  type Page,
  type PublishCheckDto,
  PUBLISHING_ROUTES,
  type PublishResultDto,
  type SolveRunStartedDto,
} from '@rotaplex/contracts';
import { api } from '@/api/client';
import { saveFile } from '@/api/files';

export interface AuditPageParams {
  page: number;
  pageSize: number;
}

export const DEFAULT_AUDIT_PAGE: AuditPageParams = { page: 1, pageSize: 25 };

export const publishingKeys = {
  audit: (periodId: string, params: AuditPageParams) => ['audit', periodId, params] as const,
  auditAll: (periodId: string) => ['audit', periodId] as const,
  check: (periodId: string, version: number) => ['publish-check', periodId, version] as const,
};

/** What publishing the period would publish (shortfalls, findings, leave, cautions), always fresh. */
export const publishCheckQuery = (periodId: string, version: number) =>
  queryOptions({
    queryKey: publishingKeys.check(periodId, version),
    queryFn: ({ signal }) =>
      api.get<PublishCheckDto>(PUBLISHING_ROUTES.publishCheck(periodId), undefined, signal),
    staleTime: 0,
    gcTime: 0,
  });

/** The audit trail of a period, newest first. */
export const auditQuery = (periodId: string, params: AuditPageParams) =>
  queryOptions({
    queryKey: publishingKeys.audit(periodId, params),
    queryFn: ({ signal }) =>
      api.get<Page<AuditEntryDto>>(
        PUBLISHING_ROUTES.audit(periodId),
        { page: params.page, pageSize: params.pageSize, order: 'desc' },
        signal,
      ),
    placeholderData: keepPreviousData,
  });

export const publishPeriod = (
  periodId: string,
  version: number,
  acknowledgement: { reason: string } | null,
) =>
  api.post<PublishResultDto>(PUBLISHING_ROUTES.publish(periodId), {
    version,
    ...(acknowledgement ? { acknowledgeBelowMinimum: true, reason: acknowledgement.reason } : {}),
  });

export const repairPeriod = (periodId: string, timeLimitSeconds: number) =>
  api.post<SolveRunStartedDto>(PUBLISHING_ROUTES.repair(periodId), { timeLimitSeconds });

/** Downloads the period's CSV export (roster and audit trail) through the signed-in client. */
export async function downloadExport(periodId: string): Promise<void> {
  const csv = await api.get<string>(PUBLISHING_ROUTES.export(periodId));
  saveFile(new Blob([csv], { type: 'text/csv;charset=utf-8' }), `roster-${periodId}.csv`);
}
