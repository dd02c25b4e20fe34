import { useEffect, useState } from 'react';
import {
  Button,
  Caption1,
  DrawerBody,
  DrawerHeader,
  DrawerHeaderTitle,
  makeStyles,
  OverlayDrawer,
  ProgressBar,
  Text,
  tokens,
} from '@fluentui/react-components';
import { DismissRegular, NavigationRegular } from '@fluentui/react-icons';
import { Link, Outlet, useLocation, useNavigation } from 'react-router-dom';
import { useMediaQuery } from '@/hooks/useMediaQuery';
import { PATHS } from '@/app/paths';
import { BrandMark } from '@/ui/BrandMark';
import { useCurrentUser } from '@/features/auth/hooks/useCurrentUser';
import { SideNav } from './SideNav';
import { UserMenu } from './UserMenu';

const useStyles = makeStyles({
  root: {
    minHeight: '100vh',
    display: 'grid',
    gridTemplateRows: 'auto 1fr',
    gridTemplateColumns: '15rem minmax(0, 1fr)',
    gridTemplateAreas: '"header header" "nav main"',
    backgroundColor: tokens.colorNeutralBackground2,
    '@media (max-width: 720px)': {
      gridTemplateColumns: 'minmax(0, 1fr)',
      gridTemplateAreas: '"header" "main"',
      gridTemplateRows: 'auto 1fr',
    },
  },
  start: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalS, minWidth: 0 },
  menuButton: {
    color: tokens.colorNeutralForegroundOnBrand,
    ':hover': { color: tokens.colorNeutralForegroundOnBrand },
    ':hover:active': { color: tokens.colorNeutralForegroundOnBrand },
  },
  skip: {
    position: 'absolute',
    left: tokens.spacingHorizontalM,
    top: `calc(${tokens.spacingVerticalXXXL} * -2)`,
    zIndex: 10,
    padding: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalM}`,
    backgroundColor: tokens.colorNeutralBackground1,
    color: tokens.colorBrandForeground1,
    borderRadius: tokens.borderRadiusMedium,
    boxShadow: tokens.shadow16,
    ':focus': { top: tokens.spacingVerticalS },
  },
  header: {
    gridArea: 'header',
    position: 'sticky',
    top: 0,
    zIndex: 5,
    display: 'flex',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: tokens.spacingHorizontalL,
    padding: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalL}`,
    backgroundColor: tokens.colorBrandBackground,
    color: tokens.colorNeutralForegroundOnBrand,
    boxShadow: tokens.shadow4,
  },
  brand: {
    display: 'flex',
    alignItems: 'center',
    gap: tokens.spacingHorizontalM,
    color: 'inherit',
    textDecorationLine: 'none',
    minWidth: 0,
    borderRadius: tokens.borderRadiusMedium,
    ':focus-visible': { outline: `${tokens.strokeWidthThick} solid ${tokens.colorNeutralForegroundOnBrand}` },
  },
  product: { fontWeight: tokens.fontWeightBold, fontSize: tokens.fontSizeBase500, letterSpacing: '0.01em' },
  organisation: {
    color: tokens.colorNeutralForegroundOnBrand,
    opacity: 0.85,
    borderLeft: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralForegroundOnBrand}`,
    paddingLeft: tokens.spacingHorizontalM,
    whiteSpace: 'nowrap',
    overflow: 'hidden',
    textOverflow: 'ellipsis',
    '@media (max-width: 720px)': { display: 'none' },
  },
  nav: {
    gridArea: 'nav',
    backgroundColor: tokens.colorNeutralBackground1,
    borderRight: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
  },
  main: {
    gridArea: 'main',
    padding: `${tokens.spacingVerticalXXL} ${tokens.spacingHorizontalXXXL}`,
    outline: 'none',
    minWidth: 0,
    '@media (max-width: 720px)': { padding: tokens.spacingHorizontalL },
  },
  content: { maxWidth: '72rem', margin: '0 auto' },
  progress: { position: 'absolute', left: 0, right: 0, bottom: 0 },
});

/** Widths at which the menu collapses behind a button (phones, 390 px wide and the like). */
const NARROW = '(max-width: 720px)';

/** The signed-in frame: header with product, organisation and account menu; navigation; page. */
export function AppShell() {
  const styles = useStyles();
  const user = useCurrentUser();
  const navigation = useNavigation();
  // On a phone the menu collapses behind a button and opens as a drawer; it closes on navigation.
  const narrow = useMediaQuery(NARROW);
  const [menuOpen, setMenuOpen] = useState(false);
  const location = useLocation();
  useEffect(() => setMenuOpen(false), [location.pathname, narrow]);
  return (
    <div className={styles.root}>
      <a className={styles.skip} href="#main">
        Skip to content
      </a>
      <header className={styles.header}>
        <div className={styles.start}>
          {narrow && (
            <Button
              appearance="transparent"
              className={styles.menuButton}
              icon={<NavigationRegular />}
              aria-label="Menu"
              aria-expanded={menuOpen}
              onClick={() => setMenuOpen(true)}
            />
          )}
          <Link to={PATHS.home} className={styles.brand}>
            <BrandMark />
            <Text className={styles.product}>Rotaplex</Text>
            <Caption1 className={styles.organisation}>{user.organisation.name}</Caption1>
          </Link>
        </div>
        <UserMenu user={user} />
        {navigation.state === 'loading' && (
          <ProgressBar className={styles.progress} thickness="medium" aria-label="Loading page" />
        )}
      </header>
      {narrow ? (
        <OverlayDrawer
          position="start"
          open={menuOpen}
          onOpenChange={(_, d) => setMenuOpen(d.open)}
          aria-label="Menu"
        >
          <DrawerHeader>
            <DrawerHeaderTitle
              action={
                <Button
                  appearance="subtle"
                  aria-label="Close the menu"
                  icon={<DismissRegular />}
                  onClick={() => setMenuOpen(false)}
                />
              }
            >
              Menu
            </DrawerHeaderTitle>
          </DrawerHeader>
          <DrawerBody>
            <SideNav permissions={user.permissions} />
          </DrawerBody>
        </OverlayDrawer>
      ) : (
        <div className={styles.nav}>
          <SideNav permissions={user.permissions} />
        </div>
      )}
      <main id="main" className={styles.main} tabIndex={-1}>
        <div className={styles.content}>
          <Outlet />
        </div>
      </main>
    </div>
  );
}
