import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import { type OutboxMessageDto, type OutboxStatus, type Page, PUBLISHING_ROUTES } from '@rotaplex/contracts';
import { api } from '@/api/client';

export interface OutboxPageParams {
  page: number;
  pageSize: number;
  status: OutboxStatus | null;
}

export const DEFAULT_OUTBOX_PAGE: OutboxPageParams = { page: 1, pageSize: 25, status: null };

export const outboxKeys = {
  all: ['outbox'] as const,
  list: (params: OutboxPageParams) => [...outboxKeys.all, params] as const,
};

export const outboxListQuery = (params: OutboxPageParams) =>
  queryOptions({
    queryKey: outboxKeys.list(params),
    queryFn: ({ signal }) =>
      api.get<Page<OutboxMessageDto>>(
        PUBLISHING_ROUTES.outbox,
        { page: params.page, pageSize: params.pageSize, status: params.status, order: 'desc' },
        signal,
      ),
    placeholderData: keepPreviousData,
    // Delivery goes on in the background: keep the list fresh while it is open.
    refetchInterval: 10_000,
  });

export const retryOutboxMessage = (id: string) =>
  api.post<OutboxMessageDto>(PUBLISHING_ROUTES.outboxRetry(id));
