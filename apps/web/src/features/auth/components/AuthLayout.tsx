import type { ReactNode } from 'react';
import { Body1, Caption1, makeStyles, Title1, Title3, tokens } from '@fluentui/react-components';
import { BrandMark } from '@/ui/BrandMark';

const useStyles = makeStyles({
  root: {
    minHeight: '100vh',
    display: 'grid',
    gridTemplateColumns: 'minmax(0, 5fr) minmax(0, 6fr)',
    backgroundColor: tokens.colorNeutralBackground2,
    '@media (max-width: 860px)': { gridTemplateColumns: 'minmax(0, 1fr)' },
  },
  aside: {
    display: 'flex',
    flexDirection: 'column',
    justifyContent: 'space-between',
    gap: tokens.spacingVerticalXXL,
    padding: `${tokens.spacingVerticalXXXL} ${tokens.spacingHorizontalXXXL}`,
    backgroundColor: tokens.colorBrandBackgroundPressed,
    backgroundImage: `linear-gradient(160deg, ${tokens.colorBrandBackground} 0%, ${tokens.colorBrandBackgroundPressed} 70%)`,
    color: tokens.colorNeutralForegroundOnBrand,
    '@media (max-width: 860px)': { padding: tokens.spacingHorizontalXL },
  },
  brand: {
    display: 'flex',
    alignItems: 'center',
    gap: tokens.spacingHorizontalM,
    fontSize: tokens.fontSizeBase600,
  },
  pitch: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalL,
    maxWidth: '30rem',
    '@media (max-width: 860px)': { display: 'none' },
  },
  points: {
    margin: 0,
    paddingLeft: tokens.spacingHorizontalXL,
    display: 'grid',
    gap: tokens.spacingVerticalS,
  },
  muted: { color: tokens.colorNeutralForegroundOnBrand, opacity: 0.8 },
  main: {
    display: 'flex',
    alignItems: 'center',
    justifyContent: 'center',
    padding: tokens.spacingHorizontalXL,
  },
  card: {
    width: '100%',
    maxWidth: '26rem',
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalL,
    padding: `${tokens.spacingVerticalXXL} ${tokens.spacingHorizontalXXL}`,
    backgroundColor: tokens.colorNeutralBackground1,
    borderRadius: tokens.borderRadiusXLarge,
    boxShadow: tokens.shadow16,
  },
  intro: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXS },
  lead: { color: tokens.colorNeutralForeground3 },
});

export interface AuthLayoutProps {
  title: string;
  lead?: ReactNode;
  children: ReactNode;
}

/** The frame of the signed-out pages: the product's promise on one side, one task on the other. */
export function AuthLayout({ title, lead, children }: AuthLayoutProps) {
  const styles = useStyles();
  return (
    <div className={styles.root}>
      <aside className={styles.aside}>
        <div className={styles.brand}>
          <BrandMark />
          <Title3 as="p">Rotaplex</Title3>
        </div>
        <div className={styles.pitch}>
          <Title1 as="p">Rosters that cover every shift and treat people fairly.</Title1>
          <ul className={styles.points}>
            <li>
              <Body1>Cover needs, contracts and rest rules in one model.</Body1>
            </li>
            <li>
              <Body1>Each roster states how close it is to the best possible.</Body1>
            </li>
            <li>
              <Body1>Swaps and leave checked against the rules before anyone approves.</Body1>
            </li>
          </ul>
        </div>
        <Caption1 className={styles.muted}>
          Rule presets reflect common working-time limits and are not legal advice.
        </Caption1>
      </aside>
      <main className={styles.main}>
        <section className={styles.card} aria-labelledby="auth-title">
          <div className={styles.intro}>
            <Title3 as="h1" id="auth-title">
              {title}
            </Title3>
            {lead && <Body1 className={styles.lead}>{lead}</Body1>}
          </div>
          {children}
        </section>
      </main>
    </div>
  );
}
