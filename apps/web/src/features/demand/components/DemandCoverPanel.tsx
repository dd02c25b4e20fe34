import { Body1, makeStyles, tokens } from '@fluentui/react-components';
import type { RosterPeriodDto } from '@rotaplex/contracts';
import { useQuery } from '@tanstack/react-query';
import { PATHS } from '@/app/paths';
import { AppLink } from '@/ui/AppLink';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { LoadingState } from '@/ui/LoadingState';
import { demandPlanQuery, unitDemandQuery } from '../api/demand.queries';
import { intervalPoints } from '../utils/demandFigures';
import { DemandCoverChart } from './DemandCharts';

const useStyles = makeStyles({
  root: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalS,
    marginTop: tokens.spacingVerticalL,
  },
});

export interface DemandCoverPanelProps {
  period: RosterPeriodDto;
}

/**
 * The planning board's "requirement against rostered cover" for a unit with a contact forecast: a
 * sentence, a compact chart of the whole period and a link to the period's demand plan. A unit with
 * ward demand gets the link only; a unit without demand gets nothing.
 */
export function DemandCoverPanel({ period }: DemandCoverPanelProps) {
  const styles = useStyles();
  const demand = useQuery(unitDemandQuery(period.unitId));
  const hasContact = !!demand.data?.contactCentre;
  const plan = useQuery({ ...demandPlanQuery(period.id), enabled: hasContact });
  if (!demand.data || (!demand.data.contactCentre && !demand.data.ward)) return null;
  const link = (
    <AppLink to={PATHS.demandPlan(period.id)} inline>
      Open the demand plan
    </AppLink>
  );
  if (!hasContact)
    return (
      <section className={styles.root} aria-label="Demand of this period">
        <Body1>
          This unit has expected patients and ratios. {link} to see the requirement per shift and accept it as
          cover needs.
        </Body1>
      </section>
    );
  const cc = plan.data?.contactCentre;
  return (
    <div className={styles.root}>
      {plan.isError && <ErrorBanner error={plan.error} onRetry={() => void plan.refetch()} />}
      {plan.isPending && <LoadingState label="Working out the requirement…" />}
      {cc && (
        <DemandCoverChart
          title="Requirement against rostered cover"
          points={intervalPoints(cc, plan.data!.dates, true)}
          compact
          extra={link}
        />
      )}
    </div>
  );
}
