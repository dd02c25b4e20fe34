import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import { API_ROUTES, type MailMessageDto, type MailMessageSummaryDto, type Page } from '@rotaplex/contracts';
import { api } from '@/api/client';

export interface MailboxPageParams {
  page: number;
  pageSize: number;
}

export const DEFAULT_MAILBOX_PAGE: MailboxPageParams = { page: 1, pageSize: 25 };

export const mailboxKeys = {
  all: ['mailbox'] as const,
  lists: () => [...mailboxKeys.all, 'list'] as const,
  list: (params: MailboxPageParams) => [...mailboxKeys.lists(), params] as const,
  message: (id: string) => [...mailboxKeys.all, 'message', id] as const,
};

export const mailboxListQuery = (params: MailboxPageParams) =>
  queryOptions({
    queryKey: mailboxKeys.list(params),
    queryFn: ({ signal }) =>
      api.get<Page<MailMessageSummaryDto>>(
        API_ROUTES.mailbox,
        { page: params.page, pageSize: params.pageSize, order: 'desc' },
        signal,
      ),
    placeholderData: keepPreviousData,
    // New mail arrives without any action in this tab (an invitation sent from another one).
    staleTime: 5_000,
  });

export const mailboxMessageQuery = (id: string) =>
  queryOptions({
    queryKey: mailboxKeys.message(id),
    queryFn: ({ signal }) => api.get<MailMessageDto>(API_ROUTES.mailboxMessage(id), undefined, signal),
    staleTime: Infinity,
  });
