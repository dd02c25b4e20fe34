import { makeStyles, MessageBar, MessageBarBody, tokens } from '@fluentui/react-components';
import type { PeriodReportDto } from '@rotaplex/contracts';
import { CoverChart } from './CoverChart';
import { HoursChart } from './HoursChart';
import { LateChanges } from './LateChanges';
import { NightsWeekendsChart } from './NightsWeekendsChart';
import { ReportTotals } from './ReportTotals';
import { RequestsNotHonoured } from './RequestsNotHonoured';

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
});

/** Every report of one period: totals, hours, nights and weekends, cover, requests, late changes. */
export function PeriodReport({ report }: { report: PeriodReportDto }) {
  const styles = useStyles();
  const worked = report.totals.shifts > 0;
  return (
    <div className={styles.root}>
      {report.status === 'draft' && (
        <MessageBar intent="info">
          <MessageBarBody>
            This period is a draft: the figures are for the roster as it stands now and change with every edit
            or Generate.
          </MessageBarBody>
        </MessageBar>
      )}
      {!worked && (
        <MessageBar intent="warning">
          <MessageBarBody>
            Nobody has a shift in this period yet, so every figure below is zero.
          </MessageBarBody>
        </MessageBar>
      )}
      <ReportTotals totals={report.totals} cover={report.cover} />
      <HoursChart people={report.people} />
      <NightsWeekendsChart people={report.people} />
      <CoverChart days={report.coverByDay} cover={report.cover} />
      <RequestsNotHonoured
        requests={report.totals.requests}
        honoured={report.totals.requestsHonoured}
        items={report.requestsNotHonoured}
      />
      {report.status !== 'draft' && <LateChanges periodId={report.periodId} />}
    </div>
  );
}
