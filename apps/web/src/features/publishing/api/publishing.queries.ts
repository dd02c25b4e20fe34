import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import {
  type AuditEntryDto,
  type Page,
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
};

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

export const publishPeriod = (periodId: string, version: number) =>
  api.post<PublishResultDto>(PUBLISHING_ROUTES.publish(periodId), { version });

export const repairPeriod = (periodId: string, timeLimitSeconds: number) =>
  api.post<SolveRunStartedDto>(PUBLISHING_ROUTES.repair(periodId), { timeLimitSeconds });

/** Downloads the period's CSV export (roster and audit trail) through the signed-in client. */
export async function downloadExport(periodId: string): Promise<void> {
  const csv = await api.get<string>(PUBLISHING_ROUTES.export(periodId));
  saveFile(new Blob([csv], { type: 'text/csv;charset=utf-8' }), `roster-${periodId}.csv`);
}
