import { Body1, Button, Caption1, makeStyles, Title2, tokens } from '@fluentui/react-components';
import { ErrorCircleRegular } from '@fluentui/react-icons';
import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { errorText } from '@/api/errors';
import { PATHS } from '@/app/paths';

const useStyles = makeStyles({
  root: {
    minHeight: '60vh',
    display: 'flex',
    flexDirection: 'column',
    alignItems: 'center',
    justifyContent: 'center',
    textAlign: 'center',
    gap: tokens.spacingVerticalM,
    padding: tokens.spacingHorizontalXXL,
  },
  icon: { fontSize: tokens.fontSizeHero900, color: tokens.colorPaletteRedForeground1, display: 'flex' },
  detail: { color: tokens.colorNeutralForeground3, maxWidth: '60ch', overflowWrap: 'anywhere' },
  actions: { display: 'flex', gap: tokens.spacingHorizontalS },
});

/** Shown when a page fails to render or load (the router's error boundary). */
export function ErrorPage() {
  const styles = useStyles();
  const error = useRouteError();
  const detail = isRouteErrorResponse(error) ? `${error.status} ${error.statusText}` : errorText(error);
  // A failed chunk load after a new release is fixed by loading the page again.
  return (
    <section className={styles.root} role="alert">
      <span className={styles.icon} aria-hidden="true">
        <ErrorCircleRegular />
      </span>
      <Title2 as="h1">Something went wrong on this page</Title2>
      <Body1>Your data is safe. Reload the page, or go back to the overview and try again.</Body1>
      <Caption1 className={styles.detail}>{detail}</Caption1>
      <div className={styles.actions}>
        <Button appearance="primary" onClick={() => window.location.reload()}>
          Reload
        </Button>
        <Button onClick={() => window.location.assign(PATHS.home)}>Go to the overview</Button>
      </div>
    </section>
  );
}
