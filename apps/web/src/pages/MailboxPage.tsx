import { useState } from 'react';
import { Button, makeStyles, TableCell, TableCellLayout, TableRow, tokens } from '@fluentui/react-components';
import { ArrowClockwiseRegular, MailInboxRegular, MailRegular } from '@fluentui/react-icons';
import { useQuery } from '@tanstack/react-query';
import { PATHS } from '@/app/paths';
import { DEFAULT_MAILBOX_PAGE, mailboxListQuery } from '@/features/mailbox/api/mailbox.queries';
import { AppLink } from '@/ui/AppLink';
import { PagedTable, TablePanel } from '@/ui/DataTable';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { PageHeader } from '@/ui/PageHeader';

const useStyles = makeStyles({
  when: { whiteSpace: 'nowrap', color: tokens.colorNeutralForeground3 },
});

const when = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

export function MailboxPage() {
  const styles = useStyles();
  const [page, setPage] = useState(DEFAULT_MAILBOX_PAGE.page);
  const params = { ...DEFAULT_MAILBOX_PAGE, page };
  const mail = useQuery(mailboxListQuery(params));

  return (
    <>
      <PageHeader
        title="Mailbox"
        description="Every message Rotaplex has sent while the local mail catcher is on. Nothing here left this machine."
        actions={
          <Button
            icon={<ArrowClockwiseRegular />}
            onClick={() => void mail.refetch()}
            disabled={mail.isFetching}
          >
            Refresh
          </Button>
        }
      />
      <TablePanel label="Messages">
        {mail.isError && <ErrorBanner error={mail.error} onRetry={() => void mail.refetch()} />}
        <PagedTable
          result={mail}
          loadingLabel="Loading messages"
          empty={
            <EmptyState icon={<MailInboxRegular />} title="No messages yet">
              Invitations and password-reset e-mails appear here as soon as Rotaplex sends them.
            </EmptyState>
          }
          label="Messages"
          columns={['Subject', 'To', 'Received']}
          page={page}
          pageSize={params.pageSize}
          onPageChange={setPage}
          row={(message) => (
            <TableRow key={message.id}>
              <TableCell>
                <TableCellLayout media={<MailRegular aria-hidden />}>
                  <AppLink to={PATHS.mailboxMessage(message.id)}>{message.subject || '(no subject)'}</AppLink>
                </TableCellLayout>
              </TableCell>
              <TableCell>{message.to.join(', ')}</TableCell>
              <TableCell className={styles.when}>{when.format(new Date(message.receivedAt))}</TableCell>
            </TableRow>
          )}
        />
      </TablePanel>
    </>
  );
}
