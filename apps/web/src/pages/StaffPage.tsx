import { useEffect, useRef, useState } from 'react';
import { Button, Field, makeStyles, SearchBox, Select } from '@fluentui/react-components';
import {
  ArrowDownloadRegular,
  ArrowUploadRegular,
  PeopleTeamRegular,
  PersonAddRegular,
} from '@fluentui/react-icons';
import {
  STAFF_CSV_COLUMNS,
  type StaffMemberDto,
  type StaffSortField,
  type UnitDto,
} from '@rotaplex/contracts';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useNavigation, useSearchParams } from 'react-router-dom';
import {
  contractsQuery,
  deleteStaffMember,
  downloadStaffCsv,
  importStaffCsv,
  planningKeys,
  skillsQuery,
  staffListQuery,
} from '@/features/planning/api/planning.queries';
import { CsvImportDialog } from '@/features/planning/components/CsvImportDialog';
import { usePlanningStyles } from '@/features/planning/components/planningStyles';
import { StaffFormDialog } from '@/features/planning/components/StaffFormDialog';
import { StaffTable } from '@/features/planning/components/StaffTable';
import { UnitPicker } from '@/features/planning/components/UnitPicker';
import { UnitScope } from '@/features/planning/components/UnitScope';
import { useSelectedUnit } from '@/features/planning/hooks/useSelectedUnit';
import {
  readStaffListParams,
  STAFF_PAGE_SIZES,
  writeStaffListParams,
  type StaffActiveFilter,
  type StaffListParams,
} from '@/features/planning/utils/staffListParams';
import { useDebouncedValue } from '@/hooks/useDebouncedValue';
import { ConfirmDialog } from '@/ui/ConfirmDialog';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { TableSkeleton } from '@/ui/LoadingState';
import { useNotify } from '@/ui/notify';
import { PageHeader } from '@/ui/PageHeader';
import { Pagination } from '@/ui/Pagination';

const useStyles = makeStyles({
  search: { flexGrow: 1, maxWidth: '24rem', alignSelf: 'flex-end' },
  filter: { minWidth: '10rem' },
});

export function StaffPage() {
  const selected = useSelectedUnit();
  if (selected.unit) return <StaffOfUnit key={selected.unit.id} unit={selected.unit} selected={selected} />;
  return (
    <>
      <PageHeader title="Staff" description="The people on each unit's roster." />
      <UnitScope selected={selected}>{() => null}</UnitScope>
    </>
  );
}

function StaffOfUnit({ unit, selected }: { unit: UnitDto; selected: ReturnType<typeof useSelectedUnit> }) {
  const styles = { ...usePlanningStyles(), ...useStyles() };
  const notify = useNotify();
  const queryClient = useQueryClient();
  const [searchParams, setSearchParams] = useSearchParams();
  const params = readStaffListParams(searchParams, unit.id);
  const [search, setSearch] = useState(params.q);
  const debounced = useDebouncedValue(search.trim());
  const staff = useQuery(staffListQuery(params));
  const skills = useQuery(skillsQuery());
  const contracts = useQuery(contractsQuery());
  const usableContracts = (contracts.data ?? []).filter((c) => c.unitId === null || c.unitId === unit.id);
  const [editing, setEditing] = useState<StaffMemberDto | 'new' | null>(null);
  const [removing, setRemoving] = useState<StaffMemberDto | null>(null);
  const [importing, setImporting] = useState(false);
  const [exportError, setExportError] = useState<unknown>(null);

  const update = (changes: Partial<StaffListParams>) =>
    setSearchParams(writeStaffListParams({ ...params, ...changes }, searchParams), { replace: true });

  const navigation = useNavigation();
  const leaving = useRef(false);
  useEffect(() => {
    leaving.current = navigation.state !== 'idle';
  }, [navigation.state]);
  useEffect(() => {
    if (!leaving.current && debounced !== params.q) update({ q: debounced, page: 1 });
    // Only a settled search term should rewrite the address.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [debounced]);

  const handleSort = (field: StaffSortField) =>
    update({ sort: field, order: params.sort === field && params.order === 'asc' ? 'desc' : 'asc', page: 1 });

  const removal = useMutation({
    mutationFn: (m: StaffMemberDto) => deleteStaffMember(m.id),
    onSuccess: async (_, m) => {
      await queryClient.invalidateQueries({ queryKey: planningKeys.staff });
      notify(`Removed ${m.name} from ${unit.name}`);
      setRemoving(null);
    },
  });

  const exporting = useMutation({
    mutationFn: () => downloadStaffCsv(unit.id),
    onMutate: () => setExportError(null),
    onError: (e) => setExportError(e),
  });

  const filtered = params.q !== '' || params.skill !== '' || params.active !== 'all';
  const list = staff.data;
  return (
    <>
      <PageHeader
        title="Staff"
        description="The people on the unit's roster, their skills, contract and cost. Add them one by one or from a CSV file."
        actions={
          <>
            <Button
              icon={<ArrowDownloadRegular />}
              disabled={exporting.isPending}
              onClick={() => exporting.mutate()}
            >
              Export CSV
            </Button>
            <Button icon={<ArrowUploadRegular />} onClick={() => setImporting(true)}>
              Upload CSV
            </Button>
            <Button appearance="primary" icon={<PersonAddRegular />} onClick={() => setEditing('new')}>
              Add person
            </Button>
          </>
        }
      />
      <section className={styles.panel} aria-label="Staff list">
        <div className={styles.toolbar} role="search">
          <UnitPicker units={selected.units} value={unit.id} onChange={selected.setUnitId} />
          <SearchBox
            className={styles.search}
            aria-label="Search staff by name or e-mail"
            placeholder="Search by name or e-mail"
            value={search}
            onChange={(_, d) => setSearch(d.value)}
          />
          <Field label="Skill" className={styles.filter}>
            <Select value={params.skill} onChange={(_, d) => update({ skill: d.value, page: 1 })}>
              <option value="">Any skill</option>
              {(skills.data ?? []).map((s) => (
                <option key={s.id} value={s.code}>
                  {s.code} · {s.name}
                </option>
              ))}
            </Select>
          </Field>
          <Field label="Status" className={styles.filter}>
            <Select
              value={params.active}
              onChange={(_, d) => update({ active: d.value as StaffActiveFilter, page: 1 })}
            >
              <option value="all">Everyone</option>
              <option value="active">Active</option>
              <option value="inactive">Inactive</option>
            </Select>
          </Field>
        </div>
        <ErrorBanner error={exportError} title="The export failed" />
        {staff.isError && <ErrorBanner error={staff.error} onRetry={() => void staff.refetch()} />}
        {staff.isPending && <TableSkeleton label="Loading staff" />}
        {list && list.items.length === 0 && (
          <EmptyState
            icon={<PeopleTeamRegular />}
            title={filtered ? 'No one matches' : `No staff in ${unit.name} yet`}
          >
            {filtered
              ? 'Nobody matches the search and filters. Clear them to see everyone.'
              : 'Add the people who work in this unit, or upload them from a CSV file.'}
          </EmptyState>
        )}
        {list && list.items.length > 0 && (
          <>
            <StaffTable
              members={list.items}
              contracts={contracts.data ?? []}
              params={params}
              onSort={handleSort}
              onEdit={setEditing}
              onRemove={(m) => {
                removal.reset();
                setRemoving(m);
              }}
            />
            <Pagination
              label="Staff"
              page={params.page}
              pageSize={params.pageSize}
              total={list.total}
              pageSizes={STAFF_PAGE_SIZES}
              onPageChange={(page) => update({ page })}
              onPageSizeChange={(pageSize) => update({ pageSize, page: 1 })}
            />
          </>
        )}
      </section>
      {editing && (
        <StaffFormDialog
          key={editing === 'new' ? 'new' : editing.id}
          unitId={unit.id}
          unitName={unit.name}
          member={editing === 'new' ? undefined : editing}
          skills={skills.data ?? []}
          contracts={usableContracts}
          onClose={() => setEditing(null)}
        />
      )}
      {importing && (
        <CsvImportDialog
          title={`Upload staff to ${unit.name}`}
          columns={STAFF_CSV_COLUMNS}
          help="Only name is required; skills are codes separated by spaces or semicolons; contract is a contract's name; active is true or false."
          send={(csv, dryRun) => importStaffCsv(unit.id, csv, dryRun)}
          onImported={(saved) => {
            void queryClient.invalidateQueries({ queryKey: planningKeys.staff });
            notify(`Imported ${saved} ${saved === 1 ? 'person' : 'people'} into ${unit.name}`);
            setImporting(false);
          }}
          onClose={() => setImporting(false)}
        />
      )}
      {removing && (
        <ConfirmDialog
          open
          title={`Remove ${removing.name}?`}
          confirmLabel="Remove"
          pending={removal.isPending}
          error={removal.error}
          onConfirm={() => removal.mutate(removing)}
          onCancel={() => setRemoving(null)}
        >
          {`${removing.name} leaves the roster of ${unit.name}. To keep their history, mark them inactive instead.`}
        </ConfirmDialog>
      )}
    </>
  );
}
