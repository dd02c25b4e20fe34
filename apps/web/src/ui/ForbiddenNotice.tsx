import { Button, makeStyles, tokens } from '@fluentui/react-components';
import { LockClosedRegular } from '@fluentui/react-icons';
import { useNavigate } from 'react-router-dom';
import { PATHS } from '@/app/paths';
import { EmptyState } from './EmptyState';

const useStyles = makeStyles({ root: { paddingTop: tokens.spacingVerticalXXL } });

/** Shown in place of a page the user's role does not open. */
export function ForbiddenNotice() {
  const styles = useStyles();
  const navigate = useNavigate();
  return (
    <section className={styles.root}>
      <EmptyState
        headingLevel="h1"
        icon={<LockClosedRegular />}
        title="You don't have access to this page"
        action={
          <Button appearance="primary" onClick={() => navigate(PATHS.home)}>
            Go to the overview
          </Button>
        }
      >
        Your role does not include this part of Rotaplex. If you need it, ask an administrator of your
        organisation.
      </EmptyState>
    </section>
  );
}
