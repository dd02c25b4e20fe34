import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import {
  type ClaimOpenShiftDto,
  MAX_PAGE_SIZE,
  type NotifyOpenShiftDto,
  type NotifyOpenShiftResultDto,
  type OpenShiftDto,
  type Page,
  PLANNING_ROUTES,
  type ProposeSwapDto,
  type RosterPeriodDto,
  type SwapDecisionDto,
  type SwapLinkViewDto,
  type SwapOptionsDto,
  type SwapPreviewDto,
  type SwapRequestDto,
  SWAP_ROUTES,
  type SwapStatus,
} from '@rotaplex/contracts';
import { api, apiRequest } from '@/api/client';
import { readAllPages } from '@/features/planning-board/api/board.queries';

/** Filters of the swap list (GET /swaps): a status, or only what waits for the caller's answer. */
export interface SwapListFilter {
  status?: SwapStatus;
  waitingForMe?: boolean;
}

/** Swap requests on this many to a page (the server allows 1 to MAX_PAGE_SIZE). */
export const SWAPS_PAGE_SIZE = 20;

export const swapKeys = {
  all: ['swaps'] as const,
  list: (filter: SwapListFilter, page: number) => [...swapKeys.all, 'list', filter, page] as const,
  options: (periodId: string) => [...swapKeys.all, 'options', periodId] as const,
  openShifts: () => [...swapKeys.all, 'open-shifts'] as const,
  publishedPeriods: () => [...swapKeys.all, 'published-periods'] as const,
  link: (token: string) => ['swap-link', token] as const,
};

/** A page of the swap requests the caller takes part in (staff) or manages (managers), newest first. */
export const swapsQuery = (filter: SwapListFilter = {}, page = 1) =>
  queryOptions({
    queryKey: swapKeys.list(filter, page),
    queryFn: ({ signal }) =>
      api.get<Page<SwapRequestDto>>(
        SWAP_ROUTES.swaps,
        {
          status: filter.status,
          waitingForMe: filter.waitingForMe ? 'true' : undefined,
          page,
          pageSize: SWAPS_PAGE_SIZE,
        },
        signal,
      ),
    placeholderData: keepPreviousData,
  });

/** Published periods of the caller's units (swaps and open shifts happen only on those). */
export const publishedPeriodsQuery = () =>
  queryOptions({
    queryKey: swapKeys.publishedPeriods(),
    queryFn: ({ signal }) =>
      readAllPages((page) =>
        api.get<Page<RosterPeriodDto>>(
          PLANNING_ROUTES.rosterPeriods,
          { status: 'published', page, pageSize: MAX_PAGE_SIZE },
          signal,
        ),
      ),
  });

export const swapOptionsQuery = (periodId: string) =>
  queryOptions({
    queryKey: swapKeys.options(periodId),
    queryFn: ({ signal }) =>
      api.get<SwapOptionsDto>(SWAP_ROUTES.swapOptions, { rosterPeriodId: periodId }, signal),
    enabled: periodId !== '',
  });

/** Open shifts on this many to a page (the server allows 1 to MAX_PAGE_SIZE). */
export const OPEN_SHIFTS_PAGE_SIZE = 20;

/**
 * One page of the open shifts the caller sees, by date. Staff with `withBlocked` get every open shift,
 * those they may take first, the others with the reasons they may not.
 */
export const openShiftsQuery = (page = 1, withBlocked = false, pageSize = OPEN_SHIFTS_PAGE_SIZE) =>
  queryOptions({
    queryKey: [...swapKeys.openShifts(), page, withBlocked, pageSize] as const,
    queryFn: ({ signal }) =>
      api.get<Page<OpenShiftDto>>(
        SWAP_ROUTES.openShifts,
        { page, pageSize, withBlocked: withBlocked ? 'true' : undefined },
        signal,
      ),
    placeholderData: keepPreviousData,
  });

/** E-mails the staff who may take one open shift; answers how many. */
export const notifyOpenShift = (body: NotifyOpenShiftDto) =>
  api.post<NotifyOpenShiftResultDto>(SWAP_ROUTES.openShiftsNotify, body);

/** What an e-mailed link decides (no sign-in; reading it changes nothing). */
export const swapLinkQuery = (token: string) =>
  queryOptions({
    queryKey: swapKeys.link(token),
    queryFn: ({ signal }) =>
      apiRequest<SwapLinkViewDto>(SWAP_ROUTES.swapLink, { query: { token }, signal, auth: false }),
    enabled: token !== '',
    retry: false,
  });

export const previewSwap = (body: ProposeSwapDto) => api.post<SwapPreviewDto>(SWAP_ROUTES.swapPreview, body);
export const proposeSwap = (body: ProposeSwapDto) => api.post<SwapRequestDto>(SWAP_ROUTES.swaps, body);
export const decideSwap = (id: string, body: SwapDecisionDto) =>
  api.post<SwapRequestDto>(SWAP_ROUTES.swapDecide(id), body);
export const cancelSwap = (id: string) => api.post<SwapRequestDto>(SWAP_ROUTES.swapCancel(id));
export const claimOpenShift = (body: ClaimOpenShiftDto) =>
  api.post<SwapRequestDto>(SWAP_ROUTES.openShiftClaims, body);
export const decideByLink = (token: string, body: SwapDecisionDto) =>
  api.post<SwapRequestDto>(SWAP_ROUTES.swapLink, { token, ...body }, { auth: false });
