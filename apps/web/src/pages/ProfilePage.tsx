import { Avatar, Body1, Caption1, makeStyles, Subtitle1, tokens } from '@fluentui/react-components';
import { useQuery } from '@tanstack/react-query';
import { ROLE_LABELS } from '@/features/auth/roleText';
import { useCurrentUser } from '@/features/auth/hooks/useCurrentUser';
import { ChangePasswordForm } from '@/features/profile/components/ChangePasswordForm';
import { unitsQuery } from '@/features/units/api/units.queries';
import { PageHeader } from '@/ui/PageHeader';

const useStyles = makeStyles({
  grid: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fit, minmax(20rem, 1fr))',
    gap: tokens.spacingHorizontalXL,
    alignItems: 'start',
  },
  panel: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalM,
    backgroundColor: tokens.colorNeutralBackground1,
    borderRadius: tokens.borderRadiusLarge,
    boxShadow: tokens.shadow2,
    padding: tokens.spacingHorizontalXL,
  },
  identity: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalL },
  meta: {
    display: 'grid',
    gridTemplateColumns: 'max-content 1fr',
    columnGap: tokens.spacingHorizontalL,
    rowGap: tokens.spacingVerticalS,
    margin: 0,
  },
  term: { color: tokens.colorNeutralForeground3 },
  detail: { margin: 0 },
  muted: { color: tokens.colorNeutralForeground3 },
});

export function ProfilePage() {
  const styles = useStyles();
  const me = useCurrentUser();
  const units = useQuery(unitsQuery());
  const unitNames = me.unitIds.map((id) => units.data?.find((u) => u.id === id)?.name).filter(Boolean);

  return (
    <>
      <PageHeader title="Profile" description="Your account in Rotaplex." />
      <div className={styles.grid}>
        <section className={styles.panel} aria-labelledby="profile-details">
          <div className={styles.identity}>
            <Avatar name={me.displayName} size={56} color="colorful" aria-hidden />
            <div>
              <Subtitle1 as="h2" id="profile-details">
                {me.displayName}
              </Subtitle1>
              <Body1 className={styles.muted}>{me.email}</Body1>
            </div>
          </div>
          <dl className={styles.meta}>
            <dt className={styles.term}>Role</dt>
            <dd className={styles.detail}>{ROLE_LABELS[me.role]}</dd>
            <dt className={styles.term}>Organisation</dt>
            <dd className={styles.detail}>{me.organisation.name}</dd>
            <dt className={styles.term}>Units</dt>
            <dd className={styles.detail}>
              {me.unitIds.length === 0 ? 'All units (administrator)' : unitNames.join(', ') || '…'}
            </dd>
          </dl>
          <Caption1 className={styles.muted}>
            To change your name, role or units, ask an administrator of your organisation.
          </Caption1>
        </section>
        <section className={styles.panel} aria-labelledby="profile-password">
          <Subtitle1 as="h2" id="profile-password">
            Password
          </Subtitle1>
          <ChangePasswordForm />
        </section>
      </div>
    </>
  );
}
