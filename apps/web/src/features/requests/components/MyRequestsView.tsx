import { useState } from 'react';
import {
  Badge,
  Button,
  Field,
  makeStyles,
  Select,
  Subtitle1,
  TableCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import type { MyRequestsDto } from '@rotaplex/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import { DataTable } from '@/ui/DataTable';
import { cancelLeave, deleteDateRequest, requestKeys } from '../api/requests.queries';
import { dateLabel, kindLabel, rangeLabel, STATUS_COLOURS, STATUS_LABELS } from '../utils/requestText';
import { DateRequestForm } from './DateRequestForm';
import { LeaveForm } from './LeaveForm';

const useStyles = makeStyles({
  section: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalM,
    marginBottom: tokens.spacingVerticalXXL,
  },
});

/** The staff member's own date requests and leave, with forms for new ones. */
export function MyRequestsView({ data }: { data: MyRequestsDto }) {
  const styles = useStyles();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const drafts = data.periods.filter((p) => p.status === 'draft');
  const [periodId, setPeriodId] = useState('');
  const period = drafts.find((p) => p.id === periodId) ?? drafts[0];
  const periodStatus = new Map(data.periods.map((p) => [p.id, p.status]));
  const refresh = () => queryClient.invalidateQueries({ queryKey: requestKeys.all });
  const remove = useMutation({
    mutationFn: deleteDateRequest,
    onSuccess: async () => {
      notify('Request deleted');
      await refresh();
    },
  });
  const cancel = useMutation({
    mutationFn: cancelLeave,
    onSuccess: async () => {
      notify('Leave cancelled');
      await refresh();
    },
  });

  return (
    <>
      <section className={styles.section} aria-labelledby="date-requests-title">
        <Subtitle1 as="h2" id="date-requests-title">
          Date requests
        </Subtitle1>
        {period ? (
          <>
            {drafts.length > 1 ? (
              <Field label="Roster period">
                <Select value={period.id} onChange={(_, d) => setPeriodId(d.value)}>
                  {drafts.map((p) => (
                    <option key={p.id} value={p.id}>
                      From {dateLabel(p.startDate)} ({p.days} days)
                    </option>
                  ))}
                </Select>
              </Field>
            ) : (
              <p>
                Requests for the roster from {dateLabel(period.startDate)} ({period.days} days).
              </p>
            )}
            <DateRequestForm
              key={period.id}
              period={period}
              used={data.dateRequests.filter((r) => r.rosterPeriodId === period.id).length}
            />
          </>
        ) : (
          <EmptyState title="No roster is open for requests" headingLevel="h3">
            Requests open when your manager starts planning the next roster.
          </EmptyState>
        )}
        {remove.error ? <ErrorBanner error={remove.error} title="The request was not deleted" /> : null}
        {data.dateRequests.length ? (
          <DataTable
            label="My date requests"
            columns={['Date', 'Request', 'Shift', 'Note']}
            actionsColumn
            size="small"
          >
            {data.dateRequests.map((r) => (
              <TableRow key={r.id}>
                <TableCell>{dateLabel(r.date)}</TableCell>
                <TableCell>{kindLabel(r.kind)}</TableCell>
                <TableCell>{r.shiftTypeCode ?? ''}</TableCell>
                <TableCell>{r.note ?? ''}</TableCell>
                <TableCell>
                  {periodStatus.get(r.rosterPeriodId) === 'draft' ? (
                    <Button
                      size="small"
                      disabled={remove.isPending}
                      onClick={() => remove.mutate(r.id)}
                      aria-label={`Delete the request for ${dateLabel(r.date)}`}
                    >
                      Delete
                    </Button>
                  ) : null}
                </TableCell>
              </TableRow>
            ))}
          </DataTable>
        ) : null}
      </section>

      <section className={styles.section} aria-labelledby="leave-title">
        <Subtitle1 as="h2" id="leave-title">
          Leave
        </Subtitle1>
        {data.staffMembers.length ? <LeaveForm staffMembers={data.staffMembers} /> : null}
        {cancel.error ? <ErrorBanner error={cancel.error} title="The leave was not cancelled" /> : null}
        {data.leave.length ? (
          <DataTable
            label="My leave"
            columns={['Dates', 'Type', 'Status', 'Note']}
            actionsColumn
            size="small"
          >
            {data.leave.map((l) => (
              <TableRow key={l.id}>
                <TableCell>{rangeLabel(l.startDate, l.endDate)}</TableCell>
                <TableCell>{kindLabel(l.type)}</TableCell>
                <TableCell>
                  <Badge appearance="tint" shape="rounded" color={STATUS_COLOURS[l.status]}>
                    {STATUS_LABELS[l.status]}
                  </Badge>
                  {l.decidedBy ? ` by ${l.decidedBy}` : ''}
                </TableCell>
                <TableCell>{[l.note, l.decisionNote].filter(Boolean).join(' / ')}</TableCell>
                <TableCell>
                  {l.status === 'pending' || l.status === 'approved' ? (
                    <Button
                      size="small"
                      disabled={cancel.isPending}
                      onClick={() => cancel.mutate(l.id)}
                      aria-label={`Cancel the leave ${rangeLabel(l.startDate, l.endDate)}`}
                    >
                      Cancel
                    </Button>
                  ) : null}
                </TableCell>
              </TableRow>
            ))}
          </DataTable>
        ) : (
          <EmptyState title="No leave requested yet" headingLevel="h3" />
        )}
      </section>
    </>
  );
}
