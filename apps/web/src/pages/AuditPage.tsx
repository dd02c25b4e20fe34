import { useState } from 'react';
import { Badge, Button, makeStyles, TableCell, TableRow, tokens } from '@fluentui/react-components';
import { ArrowDownloadRegular, HistoryRegular } from '@fluentui/react-icons';
import { useQuery } from '@tanstack/react-query';
import { useParams } from 'react-router-dom';
import type { AuditEntryDto, AuditKind } from '@rotaplex/contracts';
import { errorText } from '@/api/errors';
import { PATHS } from '@/app/paths';
import { rosterPeriodQuery } from '@/features/planning-board/api/board.queries';
import { auditQuery, DEFAULT_AUDIT_PAGE, downloadExport } from '@/features/publishing/api/publishing.queries';
import {
  daysInsideNoticeWindow,
  NOTICE_WINDOW_CAUTION,
  NOTICE_WINDOW_DAYS,
} from '@/features/publishing/utils/noticeWindow';
import { AppLink } from '@/ui/AppLink';
import { PagedTable, TablePanel } from '@/ui/DataTable';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { PageHeader } from '@/ui/PageHeader';

const useStyles = makeStyles({
  when: { whiteSpace: 'nowrap', color: tokens.colorNeutralForeground3 },
  details: { fontSize: tokens.fontSizeBase200, color: tokens.colorNeutralForeground3 },
  notice: { marginTop: tokens.spacingVerticalXS },
});

const when = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'medium' });

const KIND_LABELS: Record<AuditKind, string> = {
  publish: 'Published',
  repair: 'Repair',
  swap: 'Swap',
  'open-shift-claim': 'Open shift claimed',
  'manual-edit': 'Edit',
  'open-shift-outside': 'Open shift outside the roster',
};

/** How many cells an entry's before/after lists (when they are lists of cells). */
function cellCount(entry: AuditEntryDto): string {
  const list = Array.isArray(entry.after) ? entry.after : Array.isArray(entry.before) ? entry.before : null;
  return list ? `${list.length} cell${list.length === 1 ? '' : 's'}` : '';
}

/** Every change to a period's published roster: who, when, what. */
export function AuditPage() {
  const styles = useStyles();
  const { periodId = '' } = useParams();
  const [page, setPage] = useState(DEFAULT_AUDIT_PAGE.page);
  const params = { ...DEFAULT_AUDIT_PAGE, page };
  const period = useQuery(rosterPeriodQuery(periodId));
  const trail = useQuery(auditQuery(periodId, params));
  const [exportError, setExportError] = useState<string | null>(null);

  return (
    <>
      <PageHeader
        title="Audit trail"
        description={
          <>
            Every change to this period once published: publishing, repairs, swaps, claimed open shifts and
            edits, newest first.{' '}
            <AppLink to={PATHS.planningBoard(periodId)} inline>
              Back to the planning board
            </AppLink>
          </>
        }
        actions={
          <Button
            icon={<ArrowDownloadRegular />}
            onClick={() => {
              setExportError(null);
              downloadExport(periodId).catch((e: unknown) => setExportError(errorText(e)));
            }}
          >
            Export CSV
          </Button>
        }
      />
      <TablePanel label="Audit entries">
        {exportError && <ErrorBanner error={new Error(`The export failed: ${exportError}`)} />}
        {period.isError && <ErrorBanner error={period.error} onRetry={() => void period.refetch()} />}
        {trail.isError && <ErrorBanner error={trail.error} onRetry={() => void trail.refetch()} />}
        <PagedTable
          result={trail}
          loadingLabel="Loading the audit trail"
          empty={
            <EmptyState icon={<HistoryRegular />} title="Nothing recorded yet">
              Entries appear here once the roster is published.
            </EmptyState>
          }
          label="Audit entries"
          columns={['When', 'What', 'Who', 'Summary']}
          page={page}
          pageSize={params.pageSize}
          onPageChange={setPage}
          row={(entry) => (
            <TableRow key={entry.id}>
              <TableCell className={styles.when}>{when.format(new Date(entry.at))}</TableCell>
              <TableCell>
                <Badge appearance="tint">{KIND_LABELS[entry.kind]}</Badge>
              </TableCell>
              <TableCell>{entry.actorName}</TableCell>
              <TableCell>
                {entry.summary} <span className={styles.details}>{cellCount(entry)}</span>
                {daysInsideNoticeWindow(entry).length > 0 && (
                  <div className={styles.notice}>
                    <Badge appearance="tint" color="warning">
                      Inside the {NOTICE_WINDOW_DAYS}-day notice window
                    </Badge>{' '}
                    <span className={styles.details}>{NOTICE_WINDOW_CAUTION}</span>
                  </div>
                )}
              </TableCell>
            </TableRow>
          )}
        />
      </TablePanel>
    </>
  );
}
