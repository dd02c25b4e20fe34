import { Body1, makeStyles, Subtitle1, tokens } from '@fluentui/react-components';
import type { UnitDto } from '@rotaplex/contracts';
import { useQuery } from '@tanstack/react-query';
import { PATHS } from '@/app/paths';
import { rosterPeriodsQuery } from '@/features/planning/api/planning.queries';
import { formatDay } from '@/features/planning-board/utils/days';
import { AppLink } from '@/ui/AppLink';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { LoadingState } from '@/ui/LoadingState';
import { addDays } from '../utils/demandFigures';

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS },
  list: { margin: 0, paddingLeft: tokens.spacingHorizontalL, display: 'grid', gap: tokens.spacingVerticalXS },
  muted: { color: tokens.colorNeutralForeground3 },
});

/** The unit's open roster periods, each linking to its demand plan (requirement, covering, accept). */
export function DemandPeriodsList({ unit }: { unit: UnitDto }) {
  const styles = useStyles();
  const periods = useQuery(rosterPeriodsQuery(unit.id));
  const open = (periods.data ?? []).filter((p) => p.status !== 'archived');
  return (
    <section className={styles.root} aria-labelledby="demand-periods">
      <Subtitle1 as="h2" id="demand-periods">
        Plans of the roster periods
      </Subtitle1>
      <Body1 className={styles.muted}>
        Open a period to see its requirement per interval, the shifts that cover it, and to accept the plan as
        the period&apos;s cover needs.
      </Body1>
      {periods.isError && <ErrorBanner error={periods.error} onRetry={() => void periods.refetch()} />}
      {periods.isPending && <LoadingState label="Loading roster periods" />}
      {periods.data && open.length === 0 && (
        <Body1>
          No open roster period. <AppLink to={PATHS.rosterPeriods}>Create one</AppLink> first.
        </Body1>
      )}
      {open.length > 0 && (
        <ul className={styles.list}>
          {open.map((p) => (
            <li key={p.id}>
              <AppLink to={PATHS.demandPlan(p.id)}>
                {`Plan for ${formatDay(p.startDate)} to ${formatDay(addDays(p.startDate, p.days - 1))}`}
              </AppLink>{' '}
              <span className={styles.muted}>({p.status})</span>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
