import { Badge, Body1, Caption1, makeStyles, Subtitle1, Title2, tokens } from '@fluentui/react-components';
import { CheckmarkCircleRegular, GridRegular } from '@fluentui/react-icons';
import { isUnitScoped } from '@rotaplex/contracts';
import { useQuery } from '@tanstack/react-query';
import { PERMISSION_TEXT, ROLE_LABELS, ROLE_SUMMARIES } from '@/features/auth/roleText';
import { useCan, useCurrentUser } from '@/features/auth/hooks/useCurrentUser';
import { NextSteps } from '@/features/home/components/NextSteps';
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

  return (
    <>
      <div className={styles.hello}>
        <Title2 as="h1">
          {greeting(new Date())}, {firstName}
        </Title2>
        <Body1 className={styles.muted}>
          {me.organisation.name} · {ROLE_LABELS[me.role]}
        </Body1>
      </div>
      <div className={styles.grid}>
        <section className={surface.panel} aria-labelledby="home-role">
          <div className={styles.panelHead}>
            <Subtitle1 as="h2" id="home-role">
              Your role
            </Subtitle1>
            <Badge appearance="tint" color="brand">
              {ROLE_LABELS[me.role]}
            </Badge>
          </div>
          <Body1>{ROLE_SUMMARIES[me.role]}</Body1>
          <ul className={styles.list} aria-label="What your role allows">
            {me.permissions.map((permission) => (
              <li key={permission} className={styles.can}>
                <span className={styles.tick} aria-hidden="true">
                  <CheckmarkCircleRegular />
                </span>
                <Body1>{PERMISSION_TEXT[permission]}</Body1>
              </li>
            ))}
          </ul>
        </section>
        <section className={surface.panel} aria-labelledby="home-units">
          <div className={styles.panelHead}>
            <Subtitle1 as="h2" id="home-units">
              {isUnitScoped(me.role) ? 'Your units' : 'Units in your organisation'}
            </Subtitle1>
            {canReadUsers && people.data !== undefined && units.data && (
              <Caption1 className={styles.muted}>
                {units.data.length} units · {people.data} people
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
      <section aria-labelledby="home-next">
        <Subtitle1 as="h2" id="home-next" block>
          Where to go next
        </Subtitle1>
        <br />
        <NextSteps permissions={me.permissions} />
      </section>
    </>
  );
}
