import { useState } from 'react';
import {
  Badge,
  Button,
  Dropdown,
  Field,
  makeStyles,
  Option,
  TableCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import { ArrowClockwiseRegular, ArrowRepeatAllRegular, MailInboxRegular } from '@fluentui/react-icons';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { OUTBOX_STATUSES, type OutboxStatus } from '@rotaplex/contracts';
import { PATHS } from '@/app/paths';
import {
  DEFAULT_OUTBOX_PAGE,
  outboxKeys,
  outboxListQuery,
  retryOutboxMessage,
} from '@/features/outbox/api/outbox.queries';
import { AppLink } from '@/ui/AppLink';
import { PagedTable, TablePanel } from '@/ui/DataTable';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { PageHeader } from '@/ui/PageHeader';

const useStyles = makeStyles({
  filter: { maxWidth: '240px', marginBottom: tokens.spacingVerticalM },
  when: { whiteSpace: 'nowrap', color: tokens.colorNeutralForeground3 },
  error: { fontSize: tokens.fontSizeBase200, color: tokens.colorPaletteRedForeground1 },
});

const when = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'medium' });

const STATUS_TEXT: Record<OutboxStatus, string> = {
  pending: 'Waiting',
  sending: 'Sending',
  sent: 'Sent',
  failed: 'Failed',
};
const STATUS_COLOUR = {
  pending: 'warning',
  sending: 'informative',
  sent: 'success',
  failed: 'danger',
} as const;

/** Every e-mail Rotaplex sends goes through the outbox: what left, what waits for a retry, what failed. */
export function OutboxPage() {
  const styles = useStyles();
  const queryClient = useQueryClient();
  const [page, setPage] = useState(DEFAULT_OUTBOX_PAGE.page);
  const [status, setStatus] = useState<OutboxStatus | null>(null);
  const params = { ...DEFAULT_OUTBOX_PAGE, page, status };
  const list = useQuery(outboxListQuery(params));
  const retry = useMutation({
    mutationFn: retryOutboxMessage,
    onSettled: () => queryClient.invalidateQueries({ queryKey: outboxKeys.all }),
  });

  return (
    <>
      <PageHeader
        title="Outbox"
        description={
          <>
            Every e-mail is queued here and retried with growing pauses while the mail server cannot take it.
            Received copies of local mail are in the{' '}
            <AppLink to={PATHS.mailbox} inline>
              mailbox
            </AppLink>
            .
          </>
        }
        actions={
          <Button
            icon={<ArrowClockwiseRegular />}
            onClick={() => void list.refetch()}
            disabled={list.isFetching}
          >
            Refresh
          </Button>
        }
      />
      <TablePanel label="Outbox messages">
        <Field label="Show" className={styles.filter}>
          <Dropdown
            value={status ? STATUS_TEXT[status] : 'All messages'}
            selectedOptions={[status ?? 'all']}
            onOptionSelect={(_, d) => {
              setPage(1);
              setStatus(d.optionValue && d.optionValue !== 'all' ? (d.optionValue as OutboxStatus) : null);
            }}
          >
            <Option value="all">All messages</Option>
            {OUTBOX_STATUSES.map((s) => (
              <Option key={s} value={s}>
                {STATUS_TEXT[s]}
              </Option>
            ))}
          </Dropdown>
        </Field>
        {list.isError && <ErrorBanner error={list.error} onRetry={() => void list.refetch()} />}
        {retry.isError && <ErrorBanner error={retry.error} />}
        <PagedTable
          result={list}
          loadingLabel="Loading the outbox"
          empty={
            <EmptyState icon={<MailInboxRegular />} title="Nothing here">
              {status
                ? 'No message is in this state.'
                : 'Messages appear here as soon as Rotaplex sends one.'}
            </EmptyState>
          }
          label="Outbox messages"
          columns={['Status', 'Subject', 'To', 'Queued', 'Attempts']}
          actionsColumn
          page={page}
          pageSize={params.pageSize}
          onPageChange={setPage}
          row={(m) => (
            <TableRow key={m.id}>
              <TableCell>
                <Badge appearance="tint" color={STATUS_COLOUR[m.status]}>
                  {STATUS_TEXT[m.status]}
                </Badge>
              </TableCell>
              <TableCell>
                {m.subject}
                {m.lastError && m.status !== 'sent' && (
                  <div className={styles.error}>
                    {m.lastError}
                    {m.status === 'pending' && m.nextAttemptAt
                      ? ` · next try ${when.format(new Date(m.nextAttemptAt))}`
                      : ''}
                  </div>
                )}
              </TableCell>
              <TableCell>{m.to}</TableCell>
              <TableCell className={styles.when}>{when.format(new Date(m.createdAt))}</TableCell>
              <TableCell>{m.attempts}</TableCell>
              <TableCell>
                {(m.status === 'failed' || m.status === 'pending') && (
                  <Button
                    size="small"
                    icon={<ArrowRepeatAllRegular />}
                    disabled={retry.isPending}
                    onClick={() => retry.mutate(m.id)}
                  >
                    Retry now
                  </Button>
                )}
              </TableCell>
            </TableRow>
          )}
        />
      </TablePanel>
    </>
  );
}
