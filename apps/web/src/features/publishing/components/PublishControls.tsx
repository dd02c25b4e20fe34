import { useCallback, useEffect, useState } from 'react';
import {
  Badge,
  Button,
  Field,
  makeStyles,
  MessageBar,
  MessageBarBody,
  SpinButton,
  Spinner,
  tokens,
} from '@fluentui/react-components';
import { ArrowDownloadRegular, HistoryRegular, SendRegular, WrenchRegular } from '@fluentui/react-icons';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  isSolveRunEnded,
  REPAIR_TIME_LIMIT_MAX_SECONDS,
  REPAIR_TIME_LIMIT_MIN_SECONDS,
  type RosterPeriodDto,
  SOLVING_ROUTES,
  type SolveRunDto,
} from '@rotaplex/contracts';
import { api } from '@/api/client';
import { errorText } from '@/api/errors';
import { PATHS } from '@/app/paths';
import { boardKeys } from '@/features/planning-board/api/board.queries';
import { lateChangesQuery, reportKeys } from '@/features/reports/api/reports.queries';
import { AppLink } from '@/ui/AppLink';
import { ConfirmDialog } from '@/ui/ConfirmDialog';
import { downloadExport, publishingKeys, publishPeriod, repairPeriod } from '../api/publishing.queries';
import { PublishDialog } from './PublishDialog';

const useStyles = makeStyles({
  bar: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: tokens.spacingHorizontalM,
    marginTop: tokens.spacingVerticalM,
  },
  note: { color: tokens.colorNeutralForeground2 },
});

const when = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

export interface PublishControlsProps {
  period: RosterPeriodDto;
  /** A solve of this period is queued or running: publishing waits for it. */
  solveActive?: boolean;
}

/**
 * Publish a draft roster (after the publish check and confirmation; everyone on it is e-mailed their
 * own shifts), and on
 * a published roster: the read-only notice, Repair (re-solve with the fewest changes), the audit
 * trail and the CSV export.
 */
export function PublishControls({ period, solveActive = false }: PublishControlsProps) {
  const styles = useStyles();
  const queryClient = useQueryClient();
  const [confirming, setConfirming] = useState(false);
  const [repairing, setRepairing] = useState(false);
  const [limit, setLimit] = useState(30);
  const [repairRunId, setRepairRunId] = useState<string | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [exportError, setExportError] = useState<string | null>(null);

  const refresh = useCallback(
    () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: boardKeys.period(period.id) }),
        queryClient.invalidateQueries({ queryKey: ['roster-periods'] }),
        queryClient.invalidateQueries({ queryKey: boardKeys.grid(period.id) }),
        queryClient.invalidateQueries({ queryKey: boardKeys.runs(period.id) }),
        queryClient.invalidateQueries({ queryKey: publishingKeys.auditAll(period.id) }),
        queryClient.invalidateQueries({ queryKey: reportKeys.lateChanges(period.id) }),
      ]),
    [queryClient, period.id],
  );

  const publish = useMutation({
    mutationFn: (acknowledgement: { reason: string } | null) =>
      publishPeriod(period.id, period.version, acknowledgement),
    onSuccess: async (result) => {
      setConfirming(false);
      setMessage(
        `Published. ${result.emailed} ${result.emailed === 1 ? 'person was' : 'people were'} e-mailed their shifts.`,
      );
      await refresh();
    },
  });

  const repair = useMutation({
    mutationFn: () => repairPeriod(period.id, limit),
    onSuccess: ({ id }) => {
      setRepairing(false);
      setMessage(null);
      setRepairRunId(id);
    },
  });

  const repairRun = useQuery({
    queryKey: ['solve-run', repairRunId],
    queryFn: ({ signal }) =>
      api.get<SolveRunDto>(SOLVING_ROUTES.solveRun(repairRunId ?? ''), undefined, signal),
    enabled: repairRunId !== null,
    refetchInterval: (q) => (q.state.data && isSolveRunEnded(q.state.data.status) ? false : 1000),
  });
  const ended = repairRun.data && isSolveRunEnded(repairRun.data.status) ? repairRun.data : null;
  // Changes after publishing inside the organisation's notice window (fair-workweek laws: 14 days).
  const late = useQuery({ ...lateChangesQuery(period.id), enabled: period.status !== 'draft' });
  const lateCount = late.data?.changes.length ?? 0;
  const windowDays = late.data?.settings.noticeWindowDays ?? null;
  useEffect(() => {
    if (!ended || ended.id !== repairRunId) return;
    setRepairRunId(null);
    setMessage(
      ended.status === 'failed'
        ? `The repair did not change the roster: ${ended.errorMessage ?? 'it failed'}`
        : 'Repaired. The people whose shifts changed were e-mailed; the changes are in the audit trail.',
    );
    void refresh();
  }, [ended, repairRunId, refresh]);

  const exportCsv = () => {
    setExportError(null);
    downloadExport(period.id).catch((e: unknown) => setExportError(errorText(e)));
  };

  if (period.status === 'draft') {
    return (
      <div className={styles.bar}>
        <Button
          appearance="primary"
          icon={<SendRegular />}
          disabled={solveActive}
          onClick={() => {
            publish.reset();
            setConfirming(true);
          }}
        >
          Publish
        </Button>
        <span className={styles.note}>
          {solveActive
            ? 'Publishing waits until the solve ends.'
            : 'Publishing e-mails everyone their shifts.'}
        </span>
        {message && (
          <MessageBar intent="success">
            <MessageBarBody>{message}</MessageBarBody>
          </MessageBar>
        )}
        {confirming && (
          <PublishDialog
            period={period}
            pending={publish.isPending}
            error={publish.error}
            onPublish={(acknowledgement) => publish.mutate(acknowledgement)}
            onCancel={() => setConfirming(false)}
          />
        )}
      </div>
    );
  }

  return (
    <div className={styles.bar}>
      <Badge appearance="filled" color="success">
        {period.status === 'published' ? 'Published' : 'Archived'}
      </Badge>
      <span className={styles.note}>
        {period.publishedAt ? `Published ${when.format(new Date(period.publishedAt))}. ` : ''}
        Read-only: change it through repair or a swap.
      </span>
      {lateCount > 0 && windowDays !== null && (
        <AppLink to={PATHS.periodReports(period.id)}>
          {lateCount} {lateCount === 1 ? 'change' : 'changes'} inside the {windowDays}-day notice window
        </AppLink>
      )}
      {period.status === 'published' && (
        <Button
          icon={repairRunId ? <Spinner size="tiny" /> : <WrenchRegular />}
          disabled={repairRunId !== null || solveActive}
          onClick={() => {
            repair.reset();
            setRepairing(true);
          }}
        >
          {repairRunId ? 'Repairing…' : 'Repair'}
        </Button>
      )}
      <AppLink to={PATHS.periodAudit(period.id)}>
        <HistoryRegular aria-hidden /> Audit trail
      </AppLink>
      <Button appearance="subtle" icon={<ArrowDownloadRegular />} onClick={exportCsv}>
        Export CSV
      </Button>
      {message && (
        <MessageBar intent={message.startsWith('The repair did not') ? 'warning' : 'success'}>
          <MessageBarBody>{message}</MessageBarBody>
        </MessageBar>
      )}
      {exportError && (
        <MessageBar intent="error">
          <MessageBarBody>The export failed: {exportError}</MessageBarBody>
        </MessageBar>
      )}
      <ConfirmDialog
        open={repairing}
        title="Repair the published roster?"
        confirmLabel="Repair"
        pending={repair.isPending}
        error={repair.error}
        onConfirm={() => repair.mutate()}
        onCancel={() => setRepairing(false)}
      >
        <p>
          The solver re-plans the period around what changed (leave, sickness, cover) while changing as few
          published shifts as it can. People whose shifts change are e-mailed, and every change is recorded in
          the audit trail.
        </p>
        {windowDays !== null && windowDays > 0 && (
          <p>
            Changes to shifts less than {windowDays} days away are late changes (the organisation’s notice
            window). Where a fair-workweek law or agreement applies they may carry predictability pay: local
            law and agreements decide.
          </p>
        )}
        <Field label="Time limit (seconds)">
          <SpinButton
            value={limit}
            min={REPAIR_TIME_LIMIT_MIN_SECONDS}
            max={REPAIR_TIME_LIMIT_MAX_SECONDS}
            onChange={(_, data) => {
              const v = data.value ?? Number(data.displayValue);
              if (Number.isInteger(v))
                setLimit(Math.min(Math.max(v, REPAIR_TIME_LIMIT_MIN_SECONDS), REPAIR_TIME_LIMIT_MAX_SECONDS));
            }}
          />
        </Field>
      </ConfirmDialog>
    </div>
  );
}
