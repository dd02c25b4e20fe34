import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import {
  API_ROUTES,
  MAX_PAGE_SIZE,
  PLANNING_ROUTES,
  type ContractDto,
  type ContractPresetDto,
  type CoverNeedsDto,
  type CoverOverrideDto,
  type CreateContractRequest,
  type CreateCoverOverrideRequest,
  type CreateRosterPeriodRequest,
  type CreateShiftTypeRequest,
  type CreateSkillRequest,
  type CreateStaffMemberRequest,
  type CsvImportResult,
  type Page,
  type ReplaceCoverPatternRequest,
  type RosterPeriodDto,
  type ShiftTypeDto,
  type SkillDto,
  type StaffMemberDto,
  type UpdateContractRequest,
  type UpdateRosterPeriodRequest,
  type UpdateShiftTypeRequest,
  type UpdateSkillRequest,
  type UpdateStaffMemberRequest,
  type UserDto,
} from '@rotaplex/contracts';
import { api, apiRequest } from '@/api/client';
import { readAllPages } from '@/features/planning-board/api/board.queries';
import type { StaffListParams } from '@/features/planning/utils/staffListParams';
import { downloadText, sendCsv } from './csvTransfer';

/** Query keys, general to specific, so a mutation can invalidate a whole resource by prefix. */
export const planningKeys = {
  skills: ['skills'] as const,
  shiftTypes: (unitId: string) => ['shift-types', unitId] as const,
  contracts: ['contracts'] as const,
  contractPresets: ['contracts', 'presets'] as const,
  staff: ['staff'] as const,
  staffList: (params: StaffListParams) => ['staff', 'list', params] as const,
  coverNeeds: (unitId: string) => ['cover-needs', unitId] as const,
  rosterPeriods: ['roster-periods'] as const,
  rosterPeriodList: (unitId: string) => ['roster-periods', 'list', unitId] as const,
};

// ------------------------------------------------------------------ skills

export const skillsQuery = () =>
  queryOptions({
    queryKey: planningKeys.skills,
    queryFn: ({ signal }) => api.get<SkillDto[]>(PLANNING_ROUTES.skills, undefined, signal),
  });
export const createSkill = (body: CreateSkillRequest) => api.post<SkillDto>(PLANNING_ROUTES.skills, body);
export const updateSkill = (id: string, body: UpdateSkillRequest) =>
  api.patch<SkillDto>(PLANNING_ROUTES.skill(id), body);
export const deleteSkill = (id: string) => api.delete<void>(PLANNING_ROUTES.skill(id));

// ------------------------------------------------------------------ shift types

export const shiftTypesQuery = (unitId: string) =>
  queryOptions({
    queryKey: planningKeys.shiftTypes(unitId),
    queryFn: ({ signal }) => api.get<ShiftTypeDto[]>(PLANNING_ROUTES.shiftTypes(unitId), undefined, signal),
    enabled: unitId !== '',
  });
export const createShiftType = (unitId: string, body: CreateShiftTypeRequest) =>
  api.post<ShiftTypeDto>(PLANNING_ROUTES.shiftTypes(unitId), body);
export const updateShiftType = (unitId: string, id: string, body: UpdateShiftTypeRequest) =>
  api.patch<ShiftTypeDto>(PLANNING_ROUTES.shiftType(unitId, id), body);
export const deleteShiftType = (unitId: string, id: string) =>
  api.delete<void>(PLANNING_ROUTES.shiftType(unitId, id));

// ------------------------------------------------------------------ contracts

export const contractsQuery = () =>
  queryOptions({
    queryKey: [...planningKeys.contracts, 'list'] as const,
    queryFn: ({ signal }) => api.get<ContractDto[]>(PLANNING_ROUTES.contracts, undefined, signal),
  });
export const contractPresetsQuery = () =>
  queryOptions({
    queryKey: planningKeys.contractPresets,
    queryFn: ({ signal }) => api.get<ContractPresetDto[]>(PLANNING_ROUTES.contractPresets, undefined, signal),
    staleTime: Infinity,
  });
export const createContract = (body: CreateContractRequest) =>
  api.post<ContractDto>(PLANNING_ROUTES.contracts, body);
export const updateContract = (id: string, body: UpdateContractRequest) =>
  api.patch<ContractDto>(PLANNING_ROUTES.contract(id), body);
export const deleteContract = (id: string) => api.delete<void>(PLANNING_ROUTES.contract(id));

// ------------------------------------------------------------------ staff

export const staffListQuery = (params: StaffListParams) =>
  queryOptions({
    queryKey: planningKeys.staffList(params),
    queryFn: ({ signal }) =>
      api.get<Page<StaffMemberDto>>(
        PLANNING_ROUTES.staff,
        {
          unitId: params.unitId,
          page: params.page,
          pageSize: params.pageSize,
          sort: params.sort,
          order: params.order,
          q: params.q,
          skill: params.skill,
          active: params.active === 'all' ? undefined : params.active === 'active',
        },
        signal,
      ),
    placeholderData: keepPreviousData,
    enabled: params.unitId !== '',
  });
/** Sign-in users of a unit (first 100 by name), to link a staff member to the person's account. */
export const unitUsersQuery = (unitId: string) =>
  queryOptions({
    queryKey: ['users', 'unit', unitId] as const,
    queryFn: ({ signal }) =>
      api.get<Page<UserDto>>(
        API_ROUTES.users,
        { unitId, pageSize: MAX_PAGE_SIZE, sort: 'displayName' },
        signal,
      ),
    select: (page) => page.items,
    enabled: unitId !== '',
  });
export const createStaffMember = (body: CreateStaffMemberRequest) =>
  api.post<StaffMemberDto>(PLANNING_ROUTES.staff, body);
export const updateStaffMember = (id: string, body: UpdateStaffMemberRequest) =>
  api.patch<StaffMemberDto>(PLANNING_ROUTES.staffMember(id), body);
export const deleteStaffMember = (id: string) => api.delete<void>(PLANNING_ROUTES.staffMember(id));

/** Checks (dryRun) or saves a staff CSV for one unit. A real import with a bad row answers 400 and saves nothing. */
export const importStaffCsv = (unitId: string, csv: string, dryRun: boolean) =>
  sendCsv(PLANNING_ROUTES.staffImport, csv, { unitId, dryRun });
export const downloadStaffCsv = (unitId: string) =>
  downloadText(PLANNING_ROUTES.staffExport, { unitId }, 'staff.csv');

// ------------------------------------------------------------------ cover needs

export const coverNeedsQuery = (unitId: string) =>
  queryOptions({
    queryKey: planningKeys.coverNeeds(unitId),
    queryFn: ({ signal }) => api.get<CoverNeedsDto>(PLANNING_ROUTES.coverNeeds(unitId), undefined, signal),
    enabled: unitId !== '',
  });
export const replaceCoverPattern = (unitId: string, body: ReplaceCoverPatternRequest) =>
  apiPut<CoverNeedsDto>(PLANNING_ROUTES.coverPattern(unitId), body);
export const putCoverOverride = (unitId: string, body: CreateCoverOverrideRequest) =>
  api.post<CoverOverrideDto>(PLANNING_ROUTES.coverOverrides(unitId), body);
export const deleteCoverOverride = (unitId: string, id: string) =>
  api.delete<void>(PLANNING_ROUTES.coverOverride(unitId, id));
export const importCoverCsv = (unitId: string, csv: string, dryRun: boolean): Promise<CsvImportResult> =>
  sendCsv(PLANNING_ROUTES.coverImport(unitId), csv, { dryRun });

// ------------------------------------------------------------------ roster periods

/** Every period of the unit, newest first (the list is paged: read MAX_PAGE_SIZE a page). */
export const rosterPeriodsQuery = (unitId: string) =>
  queryOptions({
    queryKey: planningKeys.rosterPeriodList(unitId),
    queryFn: ({ signal }) =>
      readAllPages((page) =>
        api.get<Page<RosterPeriodDto>>(
          PLANNING_ROUTES.rosterPeriods,
          { unitId, page, pageSize: MAX_PAGE_SIZE },
          signal,
        ),
      ),
    enabled: unitId !== '',
  });
export const createRosterPeriod = (body: CreateRosterPeriodRequest) =>
  api.post<RosterPeriodDto>(PLANNING_ROUTES.rosterPeriods, body);
export const updateRosterPeriod = (id: string, body: UpdateRosterPeriodRequest) =>
  api.patch<RosterPeriodDto>(PLANNING_ROUTES.rosterPeriod(id), body);
export const archiveRosterPeriod = (id: string) =>
  api.post<RosterPeriodDto>(PLANNING_ROUTES.rosterPeriodArchive(id));
export const deleteRosterPeriod = (id: string) => api.delete<void>(PLANNING_ROUTES.rosterPeriod(id));

// The shared client has no put helper; apiRequest takes the method.
function apiPut<T>(path: string, body: unknown): Promise<T> {
  return apiRequest<T>(path, { method: 'PUT', body });
}
