import { useState } from 'react';
import {
  Button,
  makeStyles,
  Table,
  TableBody,
  TableCell,
  TableCellLayout,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import { ArrowClockwiseRegular, MailInboxRegular, MailRegular } from '@fluentui/react-icons';
import { useQuery } from '@tanstack/react-query';
import { PATHS } from '@/app/paths';
import { DEFAULT_MAILBOX_PAGE, mailboxListQuery } from '@/features/mailbox/api/mailbox.queries';
import { AppLink } from '@/ui/AppLink';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { TableSkeleton } from '@/ui/LoadingState';
import { PageHeader } from '@/ui/PageHeader';
import { Pagination } from '@/ui/Pagination';

const useStyles = makeStyles({
  panel: {
    backgroundColor: tokens.colorNeutralBackground1,
    borderRadius: tokens.borderRadiusLarge,
    boxShadow: tokens.shadow2,
    padding: tokens.spacingHorizontalL,
    overflowX: 'auto',
  },
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
      <section className={styles.panel} aria-label="Messages">
        {mail.isError && <ErrorBanner error={mail.error} onRetry={() => void mail.refetch()} />}
        {mail.isPending && <TableSkeleton label="Loading messages" />}
        {mail.data && mail.data.items.length === 0 && (
          <EmptyState icon={<MailInboxRegular />} title="No messages yet">
            Invitations and password-reset e-mails appear here as soon as Rotaplex sends them.
          </EmptyState>
        )}
        {mail.data && mail.data.items.length > 0 && (
          <>
            <Table aria-label="Messages">
              <TableHeader>
                <TableRow>
                  <TableHeaderCell>Subject</TableHeaderCell>
                  <TableHeaderCell>To</TableHeaderCell>
                  <TableHeaderCell>Received</TableHeaderCell>
                </TableRow>
              </TableHeader>
              <TableBody>
                {mail.data.items.map((message) => (
                  <TableRow key={message.id}>
                    <TableCell>
                      <TableCellLayout media={<MailRegular aria-hidden />}>
                        <AppLink to={PATHS.mailboxMessage(message.id)}>
                          {message.subject || '(no subject)'}
                        </AppLink>
                      </TableCellLayout>
                    </TableCell>
                    <TableCell>{message.to.join(', ')}</TableCell>
                    <TableCell className={styles.when}>{when.format(new Date(message.receivedAt))}</TableCell>
                  </TableRow>
                ))}
              </TableBody>
            </Table>
            <Pagination
              label="Messages"
              page={page}
              pageSize={params.pageSize}
              total={mail.data.total}
              onPageChange={setPage}
            />
          </>
        )}
      </section>
    </>
  );
}
