import { useQuery } from '@tanstack/react-query';
import { useParams } from 'react-router-dom';
import { unitsQuery } from '@/features/units/api/units.queries';
import { rosterPeriodQuery } from '@/features/planning-board/api/board.queries';
import { PlanningBoard } from '@/features/planning-board/components/PlanningBoard';
import { DemandCoverPanel } from '@/features/demand/components/DemandCoverPanel';
import { formatDay } from '@/features/planning-board/utils/days';
import { PATHS } from '@/app/paths';
import { AppLink } from '@/ui/AppLink';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { LoadingState } from '@/ui/LoadingState';
import { PageHeader } from '@/ui/PageHeader';

function lastDate(startDate: string, days: number): string {
  const d = new Date(`${startDate}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days - 1);
  return d.toISOString().slice(0, 10);
}

export function PlanningBoardPage() {
  const { periodId = '' } = useParams();
  const period = useQuery(rosterPeriodQuery(periodId));
  const units = useQuery(unitsQuery());
  if (period.isError) return <ErrorBanner error={period.error} onRetry={() => void period.refetch()} />;
  if (!period.data) return <LoadingState label="Opening the planning board…" />;
  const p = period.data;
  const unitName = units.data?.find((u) => u.id === p.unitId)?.name ?? 'Unit';
  return (
    <>
      <PageHeader
        title={`Planning board: ${unitName}`}
        description={
          <>
            {formatDay(p.startDate)} to {formatDay(lastDate(p.startDate, p.days))}, {p.days} days, {p.status}.{' '}
            <AppLink to={PATHS.rosterPeriods} inline>
              All roster periods
            </AppLink>
            {' · '}
            <AppLink to={PATHS.periodReports(p.id)} inline>
              Reports
            </AppLink>
          </>
        }
      />
      <PlanningBoard key={p.id} period={p} />
      <DemandCoverPanel period={p} />
    </>
  );
}
