import {
  Body1,
  makeStyles,
  MessageBar,
  MessageBarBody,
  Subtitle2,
  TableCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import type { LateChangeDto, LateChangesDto } from '@rotaplex/contracts';
import { useQuery } from '@tanstack/react-query';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { DataTable } from '@/ui/DataTable';
import { LoadingState } from '@/ui/LoadingState';
import { lateChangesQuery } from '../api/reports.queries';
import { formatDate } from '../utils/reportFigures';
import { ReportCard } from './ChartSection';

const useStyles = makeStyles({
  root: { overflowX: 'auto' },
  muted: { color: tokens.colorNeutralForeground3 },
  list: {
    listStyleType: 'none',
    margin: 0,
    padding: 0,
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalS,
  },
  item: {
    display: 'flex',
    flexDirection: 'column',
    paddingBlock: tokens.spacingVerticalXS,
    borderBottom: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
  },
  what: { fontWeight: tokens.fontWeightSemibold },
});

const hoursFormat = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 2 });

/** "Early → day off" in words. */
export function changeText(c: Pick<LateChangeDto, 'shiftBefore' | 'shiftAfter'>): string {
  return `${c.shiftBefore ?? 'day off'} → ${c.shiftAfter ?? 'day off'}`;
}

/** One line on the period's late changes: how many, how many the people asked for, the window. */
export function lateSummary(data: LateChangesDto): string {
  const window = data.settings.noticeWindowDays;
  const n = data.changes.length;
  if (n === 0) {
    return window === 0
      ? 'The notice window is off (0 days), so no change is marked late.'
      : `No change to the published roster was made less than ${window} days before the shift.`;
  }
  const theirs = data.changes.filter((c) => c.initiatedBy === 'employee').length;
  return (
    `${n} ${n === 1 ? 'change' : 'changes'} to the published roster ${n === 1 ? 'was' : 'were'} made inside ` +
    `the notice window (less than ${window} days before the shift)` +
    (theirs > 0 ? `; ${theirs} of them asked for by the person.` : '.')
  );
}

/**
 * Changes to the published roster inside the notice window, who they came from and the
 * predictability pay recorded per person, with the caution that local law decides.
 */
export function LateChanges({ periodId }: { periodId: string }) {
  const styles = useStyles();
  const late = useQuery(lateChangesQuery(periodId));
  if (late.isError) return <ErrorBanner error={late.error} onRetry={() => void late.refetch()} />;
  if (!late.data) return <LoadingState label="Loading the late changes…" />;
  const data = late.data;
  const paid = data.settings.recordPredictabilityPay || data.owed.length > 0;
  return (
    <ReportCard title="Changes inside the notice window" className={styles.root}>
      <Body1>{lateSummary(data)}</Body1>
      <MessageBar intent="warning" layout="multiline">
        <MessageBarBody>{data.caution}</MessageBarBody>
      </MessageBar>
      {paid && (
        <>
          <Subtitle2 as="h3">Predictability pay recorded</Subtitle2>
          {data.owed.length === 0 ? (
            <span className={styles.muted}>None recorded for this period.</span>
          ) : (
            <DataTable
              label="Predictability pay recorded per person"
              columns={['Person', 'Late changes', 'Hours']}
            >
              {data.owed.map((o) => (
                <TableRow key={o.staffMemberId}>
                  <TableCell>{o.staffName}</TableCell>
                  <TableCell>{o.changes}</TableCell>
                  <TableCell>{hoursFormat.format(o.hours)} h</TableCell>
                </TableRow>
              ))}
            </DataTable>
          )}
          {data.settings.predictabilityPayRule && (
            <span className={styles.muted}>Your rule: {data.settings.predictabilityPayRule}</span>
          )}
        </>
      )}
      {data.changes.length > 0 && (
        <>
          <Subtitle2 as="h3">Late changes, latest first</Subtitle2>
          <ul className={styles.list} aria-label="Late changes">
            {data.changes.map((c) => (
              <li key={c.id} className={styles.item}>
                <span className={styles.what}>
                  {formatDate(c.date)}, {c.staffName}: {changeText(c)}
                </span>
                <span className={styles.muted}>
                  {c.daysNotice} {c.daysNotice === 1 ? "day's" : "days'"} notice ·{' '}
                  {c.initiatedBy === 'employee' ? 'asked for by the person' : 'made by the employer'}
                  {c.payHours !== null && ` · ${hoursFormat.format(c.payHours)} h recorded`}
                </span>
              </li>
            ))}
          </ul>
          <span className={styles.muted}>
            Changes people ask for themselves (their own swap, an open shift they claim, a shift taken off for
            their own leave) are commonly exempt from predictability pay, so none is recorded for them.
          </span>
        </>
      )}
    </ReportCard>
  );
}
