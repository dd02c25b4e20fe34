import type { ReactNode } from 'react';
import {
  Button,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { useNavigate } from 'react-router-dom';
import { PATHS } from '@/app/paths';

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
});

export interface LinkOutcomeProps {
  intent: 'success' | 'error';
  title: string;
  children: ReactNode;
}

/** The end of an e-mailed link's journey: what happened and the way to sign in. */
export function LinkOutcome({ intent, title, children }: LinkOutcomeProps) {
  const styles = useStyles();
  const navigate = useNavigate();
  return (
    <div className={styles.root}>
      <MessageBar intent={intent} layout="multiline" role={intent === 'error' ? 'alert' : 'status'}>
        <MessageBarBody>
          <MessageBarTitle>{title}</MessageBarTitle>
          {children}
        </MessageBarBody>
      </MessageBar>
      <Button appearance="primary" onClick={() => navigate(PATHS.signIn)}>
        Go to sign-in
      </Button>
    </div>
  );
}
