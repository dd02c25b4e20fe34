import { Body1, Caption1, makeStyles, Subtitle1, Title2, tokens } from '@fluentui/react-components';
import { GridRegular } from '@fluentui/react-icons';
import { isUnitScoped } from '@rotaplex/contracts';
import { useQuery } from '@tanstack/react-query';
import { ROLE_LABELS, ROLE_SUMMARIES } from '@/features/auth/roleText';
import { useCan, useCurrentUser } from '@/features/auth/hooks/useCurrentUser';
import { WaitingForYou } from '@/features/home/components/WaitingForYou';
import { YourNextShifts } from '@/features/home/components/YourNextShifts';
import { unitsQuery } from '@/features/units/api/units.queries';
import { localTime, utcOffset } from '@/features/units/timeZones';
import { usersCountQuery } from '@/features/users/api/users.queries';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { TableSkeleton } from '@/ui/LoadingState';
import { useSurfaceStyles } from '@/ui/surfaceStyles';

const useStyles = makeStyles({
  hello: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalXS,
    marginBottom: tokens.spacingVerticalXL,
  },
  muted: { color: tokens.colorNeutralForeground3 },
  grid: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fit, minmax(20rem, 1fr))',
    gap: tokens.spacingHorizontalXL,
    marginBottom: tokens.spacingVerticalXXL,
  },
  panelHead: {
    display: 'flex',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: tokens.spacingHorizontalM,
  },
  list: { listStyleType: 'none', margin: 0, padding: 0, display: 'grid', gap: tokens.spacingVerticalS },
  can: { display: 'flex', gap: tokens.spacingHorizontalS, alignItems: 'flex-start' },
  tick: {
    color: tokens.colorPaletteGreenForeground1,
    flexShrink: 0,
    fontSize: tokens.fontSizeBase400,
    display: 'flex',
  },
  unit: {
    display: 'flex',
    justifyContent: 'space-between',
    gap: tokens.spacingHorizontalM,
    padding: `${tokens.spacingVerticalS} 0`,
    borderBottom: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke3}`,
  },
  stat: {
    fontSize: tokens.fontSizeHero700,
    fontWeight: tokens.fontWeightSemibold,
    lineHeight: tokens.lineHeightHero700,
  },
  stats: { display: 'flex', gap: tokens.spacingHorizontalXXL },
});

function greeting(now: Date): string {
  const hour = now.getHours();
  return hour < 12 ? 'Good morning' : hour < 18 ? 'Good afternoon' : 'Good evening';
}

export function HomePage() {
  const styles = useStyles();
  const surface = useSurfaceStyles();
  const me = useCurrentUser();
  const units = useQuery(unitsQuery());
  const canReadUsers = useCan('users:read');
  const people = useQuery({ ...usersCountQuery(), enabled: canReadUsers });
  const firstName = me.displayName.split(' ')[0];
  const canPlan = useCan('rosters:plan');
  const canApprove = useCan('requests:approve');
  const canPlanOrApprove = canPlan || canApprove;
  const isStaff = useCan('requests:own');

  return (
    <>
      <div className={styles.hello}>
        <Title2 as="h1">
          {greeting(new Date())}, {firstName}
        </Title2>
        <Body1 className={styles.muted}>
          {me.organisation.name} · {ROLE_LABELS[me.role]}: {ROLE_SUMMARIES[me.role]}
        </Body1>
      </div>
      <div className={styles.grid}>
        {canPlanOrApprove && <WaitingForYou />}
        {isStaff && <YourNextShifts />}
        <section className={surface.panel} aria-labelledby="home-units">
          <div className={styles.panelHead}>
            <Subtitle1 as="h2" id="home-units">
              {isUnitScoped(me.role) ? 'Your units' : 'Units in your organisation'}
            </Subtitle1>
            {canReadUsers && people.data !== undefined && units.data && (
              <Caption1 className={styles.muted}>
                {units.data.length} {units.data.length === 1 ? 'unit' : 'units'} · {people.data}{' '}
                {people.data === 1 ? 'person' : 'people'}
              </Caption1>
            )}
          </div>
          {units.isPending && <TableSkeleton rows={2} label="Loading units" />}
          {units.isError && <ErrorBanner error={units.error} onRetry={() => void units.refetch()} />}
          {units.data && units.data.length === 0 && (
            <EmptyState icon={<GridRegular />} title="No units yet">
              {isUnitScoped(me.role)
                ? 'You are not in a unit yet. An administrator adds you to one.'
                : 'Create a unit under Units to start planning.'}
            </EmptyState>
          )}
          {units.data && units.data.length > 0 && (
            <ul className={styles.list}>
              {units.data.map((unit) => (
                <li key={unit.id} className={styles.unit}>
                  <Body1>{unit.name}</Body1>
                  <Caption1 className={styles.muted}>
                    {localTime(unit.timeZone)} · {unit.timeZone} ({utcOffset(unit.timeZone)})
                  </Caption1>
                </li>
              ))}
            </ul>
          )}
        </section>
      </div>
    </>
  );
}
