import { queryOptions } from '@tanstack/react-query';
import {
  type AvailabilityDto,
  type CreateDateRequestRequest,
  type CreateLeaveRequest,
  type DateRequestDto,
  type LeaveDto,
  type MyRequestsDto,
  type PeriodRequestsDto,
  type ReplaceAvailabilityRequest,
  type RequestListQuery,
  type RequestPage,
  type RequestPeriodDto,
  REQUESTS_ROUTES,
} from '@rotaplex/contracts';
import { api, apiRequest } from '@/api/client';

export const requestKeys = {
  all: ['requests'] as const,
  mine: () => [...requestKeys.all, 'mine'] as const,
  availability: (staffMemberId: string) => [...requestKeys.all, 'availability', staffMemberId] as const,
  table: (query: RequestListQuery) => [...requestKeys.all, 'table', query] as const,
};

/** The signed-in user's staff memberships, periods, date requests and leave. */
export const myRequestsQuery = () =>
  queryOptions({
    queryKey: requestKeys.mine(),
    queryFn: ({ signal }) => api.get<MyRequestsDto>(REQUESTS_ROUTES.mine, undefined, signal),
  });

export const availabilityQuery = (staffMemberId: string) =>
  queryOptions({
    queryKey: requestKeys.availability(staffMemberId),
    queryFn: ({ signal }) =>
      api.get<AvailabilityDto>(REQUESTS_ROUTES.availability(staffMemberId), undefined, signal),
    enabled: staffMemberId !== '',
  });

/** The managers' table of date requests and leave. */
export const requestTableQuery = (query: RequestListQuery) =>
  queryOptions({
    queryKey: requestKeys.table(query),
    queryFn: ({ signal }) =>
      api.get<RequestPage>(REQUESTS_ROUTES.requests, { ...query } as Record<string, string | number>, signal),
  });

export const saveAvailability = (staffMemberId: string, body: ReplaceAvailabilityRequest) =>
  apiRequest<AvailabilityDto>(REQUESTS_ROUTES.availability(staffMemberId), { method: 'PUT', body });
export const createDateRequest = (body: CreateDateRequestRequest) =>
  api.post<DateRequestDto>(REQUESTS_ROUTES.dateRequests, body);
export const deleteDateRequest = (id: string) => api.delete<void>(REQUESTS_ROUTES.dateRequest(id));
export const createLeave = (body: CreateLeaveRequest) => api.post<LeaveDto>(REQUESTS_ROUTES.leave, body);
export const cancelLeave = (id: string) => api.delete<LeaveDto>(REQUESTS_ROUTES.leaveItem(id));
export const approveLeave = (id: string) => api.post<LeaveDto>(REQUESTS_ROUTES.leaveApprove(id), {});
export const declineLeave = (id: string) => api.post<LeaveDto>(REQUESTS_ROUTES.leaveDecline(id), {});
export const setRequestLimit = (periodId: string, requestLimit: number) =>
  apiRequest<RequestPeriodDto>(REQUESTS_ROUTES.periodRequestLimit(periodId), {
    method: 'PUT',
    body: { requestLimit },
  });

/** A period's requests as planners read them (used here for the period's request limit). */
export const periodRequestsQuery = (periodId: string) =>
  queryOptions({
    queryKey: [...requestKeys.all, 'period', periodId] as const,
    queryFn: ({ signal }) =>
      api.get<PeriodRequestsDto>(REQUESTS_ROUTES.periodRequests(periodId), undefined, signal),
    enabled: periodId !== '',
  });
