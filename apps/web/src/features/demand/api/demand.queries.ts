import { queryOptions } from '@tanstack/react-query';
import {
  DEMAND_ROUTES,
  type AcceptDemandPlanRequest,
  type AcceptDemandPlanResultDto,
  type CsvImportResult,
  type DemandAcceptanceDto,
  type DemandPlanDto,
  type PutUnitDemandRequest,
  type UnitDemandDto,
} from '@rotaplex/contracts';
import { api, apiRequest } from '@/api/client';
import { sendCsv } from '@/features/planning/api/csvTransfer';

/** Query keys, general to specific: a write to a unit's demand invalidates every plan by prefix. */
export const demandKeys = {
  all: ['demand'] as const,
  unit: (unitId: string) => ['demand', 'unit', unitId] as const,
  plans: ['demand', 'plan'] as const,
  plan: (periodId: string) => ['demand', 'plan', periodId] as const,
  acceptances: (periodId: string) => ['demand', 'acceptances', periodId] as const,
};

export const unitDemandQuery = (unitId: string) =>
  queryOptions({
    queryKey: demandKeys.unit(unitId),
    queryFn: ({ signal }) => api.get<UnitDemandDto>(DEMAND_ROUTES.demand(unitId), undefined, signal),
    enabled: unitId !== '',
  });

export const putUnitDemand = (unitId: string, body: PutUnitDemandRequest) =>
  apiRequest<UnitDemandDto>(DEMAND_ROUTES.demand(unitId), { method: 'PUT', body });

/** Checks (dryRun) or saves a contact forecast CSV. A real import with a bad row answers 400 and saves nothing. */
export const importContactsCsv = (unitId: string, csv: string, dryRun: boolean): Promise<CsvImportResult> =>
  sendCsv(DEMAND_ROUTES.contactsImport(unitId), csv, { dryRun });

/** The period's requirement and covering plan (computed by the server on each request, nothing saved). */
export const demandPlanQuery = (periodId: string) =>
  queryOptions({
    queryKey: demandKeys.plan(periodId),
    queryFn: ({ signal }) => api.get<DemandPlanDto>(DEMAND_ROUTES.plan(periodId), undefined, signal),
    enabled: periodId !== '',
    // A solve per request: keep the answer a while rather than solving again on every focus.
    staleTime: 60_000,
  });

export const acceptDemandPlan = (periodId: string, body: AcceptDemandPlanRequest) =>
  api.post<AcceptDemandPlanResultDto>(DEMAND_ROUTES.accept(periodId), body);

export const demandAcceptancesQuery = (periodId: string) =>
  queryOptions({
    queryKey: demandKeys.acceptances(periodId),
    queryFn: ({ signal }) =>
      api.get<DemandAcceptanceDto[]>(DEMAND_ROUTES.acceptances(periodId), undefined, signal),
    enabled: periodId !== '',
  });
