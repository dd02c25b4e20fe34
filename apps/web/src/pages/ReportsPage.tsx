import { useQuery } from '@tanstack/react-query';
import { useParams } from 'react-router-dom';
import { PATHS } from '@/app/paths';
import { periodReportQuery } from '@/features/reports/api/reports.queries';
import { DownloadPayrollButton } from '@/features/reports/components/DownloadPayrollButton';
import { PeriodReport } from '@/features/reports/components/PeriodReport';
import { formatDate } from '@/features/reports/utils/reportFigures';
import { AppLink } from '@/ui/AppLink';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { LoadingState } from '@/ui/LoadingState';
import { PageHeader } from '@/ui/PageHeader';

export function ReportsPage() {
  const { periodId = '' } = useParams();
  const report = useQuery(periodReportQuery(periodId));
  if (report.isError) return <ErrorBanner error={report.error} onRetry={() => void report.refetch()} />;
  if (!report.data) return <LoadingState label="Preparing the reports…" />;
  const r = report.data;
  return (
    <>
      <PageHeader
        title={`Reports: ${r.unitName}`}
        description={
          <>
            {formatDate(r.dates[0])} to {formatDate(r.dates[r.dates.length - 1])}, {r.days} days, {r.status}.{' '}
            <AppLink to={PATHS.planningBoard(r.periodId)} inline>
              Planning board
            </AppLink>{' '}
            ·{' '}
            <AppLink to={PATHS.rosterPeriods} inline>
              All roster periods
            </AppLink>
          </>
        }
        actions={<DownloadPayrollButton periodId={r.periodId} />}
      />
      <PeriodReport report={r} />
    </>
  );
}
