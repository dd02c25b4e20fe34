import { queryOptions } from '@tanstack/react-query';
import {
  API_ROUTES,
  NOTICE_WINDOW_ROUTES,
  type NoticeWindowSettingsDto,
  type OrganisationDto,
  type UpdateNoticeWindowSettingsRequest,
  type UpdateOrganisationRequest,
} from '@rotaplex/contracts';
import { api, apiRequest } from '@/api/client';

export const organisationKeys = {
  all: ['organisation'] as const,
};

export const organisationQuery = () =>
  queryOptions({
    queryKey: organisationKeys.all,
    queryFn: ({ signal }) => api.get<OrganisationDto>(API_ROUTES.organisation, undefined, signal),
  });

export const updateOrganisation = (body: UpdateOrganisationRequest) =>
  api.patch<OrganisationDto>(API_ROUTES.organisation, body);

export const noticeWindowKeys = {
  all: ['organisation', 'notice-window'] as const,
};

/** The organisation's notice window for late changes and its predictability-pay setting. */
export const noticeWindowQuery = () =>
  queryOptions({
    queryKey: noticeWindowKeys.all,
    queryFn: ({ signal }) =>
      api.get<NoticeWindowSettingsDto>(NOTICE_WINDOW_ROUTES.settings, undefined, signal),
  });

export const updateNoticeWindow = (body: UpdateNoticeWindowSettingsRequest) =>
  apiRequest<NoticeWindowSettingsDto>(NOTICE_WINDOW_ROUTES.settings, { method: 'PUT', body });
