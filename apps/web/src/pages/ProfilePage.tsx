import { Avatar, Body1, Caption1, makeStyles, Subtitle1, tokens } from '@fluentui/react-components';
import { useQuery } from '@tanstack/react-query';
import { ROLE_LABELS } from '@/features/auth/roleText';
import { useCurrentUser } from '@/features/auth/hooks/useCurrentUser';
import { ChangePasswordForm } from '@/features/profile/components/ChangePasswordForm';
import { unitsQuery } from '@/features/units/api/units.queries';
import { PageHeader } from '@/ui/PageHeader';
import { useSurfaceStyles } from '@/ui/surfaceStyles';

const useStyles = makeStyles({
  grid: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fit, minmax(20rem, 1fr))',
    gap: tokens.spacingHorizontalXL,
    alignItems: 'start',
  },
  identity: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalL },
  muted: { color: tokens.colorNeutralForeground3 },
});

export function ProfilePage() {
  const styles = useStyles();
  const surface = useSurfaceStyles();
  const me = useCurrentUser();
  const units = useQuery(unitsQuery());
  const unitNames = me.unitIds.map((id) => units.data?.find((u) => u.id === id)?.name).filter(Boolean);

  return (
    <>
      <PageHeader title="Profile" description="Your account in Rotaplex." />
      <div className={styles.grid}>
        <section className={surface.panel} aria-labelledby="profile-details">
          <div className={styles.identity}>
            <Avatar name={me.displayName} size={56} color="colorful" aria-hidden />
            <div>
              <Subtitle1 as="h2" id="profile-details">
                {me.displayName}
              </Subtitle1>
              <Body1 className={styles.muted}>{me.email}</Body1>
            </div>
          </div>
          <dl className={surface.facts}>
            <dt className={surface.term}>Role</dt>
            <dd className={surface.detail}>{ROLE_LABELS[me.role]}</dd>
            <dt className={surface.term}>Organisation</dt>
            <dd className={surface.detail}>{me.organisation.name}</dd>
            <dt className={surface.term}>Units</dt>
            <dd className={surface.detail}>
              {me.unitIds.length === 0 ? 'All units (administrator)' : unitNames.join(', ') || '…'}
            </dd>
          </dl>
          <Caption1 className={styles.muted}>
            To change your name, role or units, ask an administrator of your organisation.
          </Caption1>
        </section>
        <section className={surface.panel} aria-labelledby="profile-password">
          <Subtitle1 as="h2" id="profile-password">
            Password
          </Subtitle1>
          <ChangePasswordForm />
        </section>
      </div>
    </>
  );
}
