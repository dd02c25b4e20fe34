import { queryOptions } from '@tanstack/react-query';
import { API_ROUTES, type OrganisationDto, type UpdateOrganisationRequest } from '@rotaplex/contracts';
import { api } from '@/api/client';

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
