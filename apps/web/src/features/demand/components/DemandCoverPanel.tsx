import { Body1, makeStyles, Subtitle2, tokens } from '@fluentui/react-components';
import type { RosterPeriodDto } from '@rotaplex/contracts';
import { useQuery } from '@tanstack/react-query';
import { PATHS } from '@/app/paths';
import { AppLink } from '@/ui/AppLink';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { LoadingState } from '@/ui/LoadingState';
import { demandPlanQuery, unitDemandQuery } from '../api/demand.queries';
import { intervalPoints, rosteredShortfall } from '../utils/demandFigures';
import { DemandCoverChart } from './DemandCharts';

const useStyles = makeStyles({
  root: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalS,
    marginTop: tokens.spacingVerticalL,
  },
  head: { display: 'flex', flexWrap: 'wrap', alignItems: 'baseline', gap: tokens.spacingHorizontalM },
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
  const points = cc ? intervalPoints(cc, plan.data!.dates, true) : [];
  const short = rosteredShortfall(points);
  return (
    <section className={styles.root} aria-labelledby="board-demand-heading">
      <div className={styles.head}>
        <Subtitle2 as="h2" id="board-demand-heading">
          Requirement against rostered cover
        </Subtitle2>
        {link}
      </div>
      {plan.isError && <ErrorBanner error={plan.error} onRetry={() => void plan.refetch()} />}
      {plan.isPending && <LoadingState label="Working out the requirement…" />}
      {cc && (
        <>
          <Body1>
            {short.intervals === 0
              ? 'The rostered people meet the forecast requirement in every interval of the period.'
              : `The rostered people are below the forecast requirement in ${short.intervals} intervals of the period.`}
          </Body1>
          <DemandCoverChart title="Requirement and rostered people per interval" points={points} compact />
        </>
      )}
    </section>
  );
}
