import { queryOptions } from '@tanstack/react-query';
import {
  API_ROUTES,
  type CreateUnitRequest,
  type UnitDto,
  type UpdateUnitRequest,
} from '@rotaplex/contracts';
import { api } from '@/api/client';

export const unitKeys = {
  all: ['units'] as const,
  list: () => [...unitKeys.all, 'list'] as const,
};

/** The units the caller may see: every unit for admins, their own for everyone else. */
export const unitsQuery = () =>
  queryOptions({
    queryKey: unitKeys.list(),
    queryFn: ({ signal }) => api.get<UnitDto[]>(API_ROUTES.units, undefined, signal),
  });

export const createUnit = (body: CreateUnitRequest) => api.post<UnitDto>(API_ROUTES.units, body);
export const updateUnit = (id: string, body: UpdateUnitRequest) =>
  api.patch<UnitDto>(API_ROUTES.unit(id), body);
export const deleteUnit = (id: string) => api.delete<void>(API_ROUTES.unit(id));
