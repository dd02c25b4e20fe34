import {
  Button,
  MessageBar,
  MessageBarActions,
  MessageBarBody,
  MessageBarTitle,
} from '@fluentui/react-components';
import { useInRouterContext, useNavigate } from 'react-router-dom';
import { PATHS } from '@/app/paths';
import { errorText, isForbidden } from '@/api/errors';

export interface ErrorBannerProps {
  /** An error object, or ready-made messages. */
  error?: unknown;
  messages?: readonly string[];
  title?: string;
  /** Offered as "Try again" when loading failed; never on a refusal (403), which a retry cannot change. */
  onRetry?: () => void;
}

/** An error message in a live region, so screen readers announce it when it appears. */
export function ErrorBanner({ error, messages, title, onRetry }: ErrorBannerProps) {
  const inRouter = useInRouterContext();
  const text = messages && messages.length ? messages.join(' ') : error ? errorText(error) : '';
  if (!text) return null;
  // A page whose data the server refuses: say so, and offer the way home instead of a retry.
  const forbidden = onRetry !== undefined && isForbidden(error);
  return (
    <MessageBar intent={forbidden ? 'warning' : 'error'} role="alert" layout="multiline">
      <MessageBarBody>
        {forbidden ? (
          <MessageBarTitle>You don&apos;t have access to this page</MessageBarTitle>
        ) : (
          title && <MessageBarTitle>{title}</MessageBarTitle>
        )}
        {text}
      </MessageBarBody>
      {forbidden
        ? inRouter && (
            <MessageBarActions>
              <HomeButton />
            </MessageBarActions>
          )
        : onRetry && (
            <MessageBarActions>
              <Button onClick={onRetry}>Try again</Button>
            </MessageBarActions>
          )}
    </MessageBar>
  );
}

function HomeButton() {
  const navigate = useNavigate();
  return (
    <Button appearance="primary" onClick={() => navigate(PATHS.home)}>
      Go to the overview
    </Button>
  );
}
