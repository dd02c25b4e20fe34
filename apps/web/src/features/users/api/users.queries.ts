import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import {
  API_ROUTES,
  type InviteUserRequest,
  type Page,
  type UpdateUserRequest,
  type UserDto,
} from '@rotaplex/contracts';
import { api } from '@/api/client';
import type { UsersListParams } from '@/features/users/usersListParams';

export const userKeys = {
  all: ['users'] as const,
  lists: () => [...userKeys.all, 'list'] as const,
  list: (params: UsersListParams) => [...userKeys.lists(), params] as const,
  counts: () => [...userKeys.all, 'count'] as const,
};

export const usersListQuery = (params: UsersListParams) =>
  queryOptions({
    queryKey: userKeys.list(params),
    queryFn: ({ signal }) =>
      api.get<Page<UserDto>>(
        API_ROUTES.users,
        { page: params.page, pageSize: params.pageSize, sort: params.sort, order: params.order, q: params.q },
        signal,
      ),
    placeholderData: keepPreviousData,
  });

/** How many people the caller can see (one-row page; only the total is used). */
export const usersCountQuery = () =>
  queryOptions({
    queryKey: userKeys.counts(),
    queryFn: ({ signal }) => api.get<Page<UserDto>>(API_ROUTES.users, { page: 1, pageSize: 1 }, signal),
    select: (page) => page.total,
  });

export const inviteUser = (body: InviteUserRequest) => api.post<UserDto>(API_ROUTES.users, body);
export const updateUser = (id: string, body: UpdateUserRequest) =>
  api.patch<UserDto>(API_ROUTES.user(id), body);
export const deactivateUser = (id: string) => api.post<UserDto>(API_ROUTES.userDeactivate(id));
export const reactivateUser = (id: string) => api.post<UserDto>(API_ROUTES.userReactivate(id));
export const resendInvitation = (id: string) => api.post<void>(API_ROUTES.userResendInvitation(id));
