import { useState } from 'react';
import {
  Badge,
  Button,
  Field,
  Input,
  makeStyles,
  Select,
  TableCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import {
  MAX_REQUEST_LIMIT,
  REQUEST_ROW_STATUSES,
  type RequestRowStatus,
  type RequestRowType,
  type UnitDto,
} from '@rotaplex/contracts';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { rosterPeriodsQuery } from '@/features/planning/api/planning.queries';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import { PagedTable } from '@/ui/DataTable';
import {
  approveLeave,
  declineLeave,
  periodRequestsQuery,
  requestKeys,
  requestTableQuery,
  setRequestLimit,
} from '../api/requests.queries';
import { dateLabel, kindLabel, rangeLabel, STATUS_COLOURS, STATUS_LABELS } from '../utils/requestText';

const useStyles = makeStyles({
  toolbar: { display: 'flex', flexWrap: 'wrap', alignItems: 'flex-end', gap: tokens.spacingHorizontalM },
  limit: { width: '6rem' },
  actions: { display: 'flex', gap: tokens.spacingHorizontalS },
});

/** The managers' table of one unit's date requests and leave, with filters and leave decisions. */
export function RequestsTable({ unit }: { unit: UnitDto }) {
  const styles = useStyles();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const periods = useQuery(rosterPeriodsQuery(unit.id));
  const [periodId, setPeriodId] = useState('');
  const [status, setStatus] = useState<RequestRowStatus | ''>('');
  const [type, setType] = useState<RequestRowType | ''>('');
  const [page, setPage] = useState(1);
  const pageSize = 50;
  const query = {
    unitId: unit.id,
    ...(periodId ? { rosterPeriodId: periodId } : {}),
    ...(status ? { status } : {}),
    ...(type ? { type } : {}),
    page,
    pageSize,
  };
  const rows = useQuery(requestTableQuery(query));
  const decide = useMutation({
    mutationFn: ({ id, approve }: { id: string; approve: boolean }) =>
      approve ? approveLeave(id) : declineLeave(id),
    onSuccess: async (leave) => {
      notify(`Leave of ${leave.staffName} ${leave.status}`, 'success');
      await queryClient.invalidateQueries({ queryKey: requestKeys.all });
    },
  });
  const selectedPeriod = periods.data?.find((p) => p.id === periodId);

  return (
    <>
      <div className={styles.toolbar}>
        <Field label="Roster period">
          <Select
            value={periodId}
            onChange={(_, d) => {
              setPeriodId(d.value);
              setPage(1);
            }}
          >
            <option value="">All periods</option>
            {periods.data?.map((p) => (
              <option key={p.id} value={p.id}>
                From {dateLabel(p.startDate)} ({p.status})
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Status">
          <Select
            value={status}
            onChange={(_, d) => {
              setStatus(d.value as RequestRowStatus | '');
              setPage(1);
            }}
          >
            <option value="">Any status</option>
            {REQUEST_ROW_STATUSES.map((s) => (
              <option key={s} value={s}>
                {STATUS_LABELS[s]}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Kind">
          <Select
            value={type}
            onChange={(_, d) => {
              setType(d.value as RequestRowType | '');
              setPage(1);
            }}
          >
            <option value="">Date requests and leave</option>
            <option value="date">Date requests</option>
            <option value="leave">Leave</option>
          </Select>
        </Field>
        {selectedPeriod?.status === 'draft' ? <RequestLimit periodId={selectedPeriod.id} /> : null}
      </div>
      {rows.error ? <ErrorBanner error={rows.error} onRetry={() => void rows.refetch()} /> : null}
      {decide.error ? <ErrorBanner error={decide.error} title="The decision was not saved" /> : null}
      <PagedTable
        result={rows}
        loadingLabel="Loading requests"
        empty={<EmptyState title="No requests match these filters" headingLevel="h3" />}
        label={`Requests of ${unit.name}`}
        columns={['Person', 'Dates', 'Request', 'Status', 'Note']}
        actionsColumn
        size="small"
        page={page}
        pageSize={pageSize}
        onPageChange={setPage}
        pagerLabel="Requests"
        row={(r) => (
          <TableRow key={r.id}>
            <TableCell>{r.staffName}</TableCell>
            <TableCell>{rangeLabel(r.startDate, r.endDate)}</TableCell>
            <TableCell>
              {kindLabel(r.kind)}
              {r.shiftTypeCode ? ` ${r.shiftTypeCode}` : ''}
            </TableCell>
            <TableCell>
              <Badge appearance="tint" shape="rounded" color={STATUS_COLOURS[r.status]}>
                {STATUS_LABELS[r.status]}
              </Badge>
            </TableCell>
            <TableCell>{r.note ?? ''}</TableCell>
            <TableCell>
              {r.type === 'leave' && r.status === 'pending' ? (
                <div className={styles.actions}>
                  <Button
                    size="small"
                    appearance="primary"
                    disabled={decide.isPending}
                    aria-label={`Approve leave of ${r.staffName}, ${rangeLabel(r.startDate, r.endDate)}`}
                    onClick={() => decide.mutate({ id: r.id, approve: true })}
                  >
                    Approve
                  </Button>
                  <Button
                    size="small"
                    disabled={decide.isPending}
                    aria-label={`Decline leave of ${r.staffName}, ${rangeLabel(r.startDate, r.endDate)}`}
                    onClick={() => decide.mutate({ id: r.id, approve: false })}
                  >
                    Decline
                  </Button>
                </div>
              ) : null}
            </TableCell>
          </TableRow>
        )}
      />
    </>
  );
}

/** The draft period's limit of date requests per person. */
function RequestLimit({ periodId }: { periodId: string }) {
  const styles = useStyles();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const current = useQuery(periodRequestsQuery(periodId));
  const [value, setValue] = useState('');
  const save = useMutation({
    mutationFn: () => setRequestLimit(periodId, Number(value)),
    onSuccess: async (p) => {
      notify(`Each person may now make ${p.requestLimit} date requests in this period`, 'success');
      setValue('');
      await queryClient.invalidateQueries({ queryKey: requestKeys.all });
    },
  });
  const shown = value !== '' ? value : String(current.data?.period.requestLimit ?? '');
  return (
    <>
      <Field
        label="Date requests per person"
        validationMessage={save.error ? String((save.error as Error).message) : undefined}
      >
        <Input
          className={styles.limit}
          type="number"
          min={0}
          max={MAX_REQUEST_LIMIT}
          value={shown}
          onChange={(_, d) => setValue(d.value)}
        />
      </Field>
      <Button disabled={value === '' || save.isPending} onClick={() => save.mutate()}>
        Set limit
      </Button>
    </>
  );
}
