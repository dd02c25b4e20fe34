import {
  Button,
  MessageBar,
  MessageBarActions,
  MessageBarBody,
  MessageBarTitle,
} from '@fluentui/react-components';
import { errorText } from '@/api/errors';

export interface ErrorBannerProps {
  /** An error object, or ready-made messages. */
  error?: unknown;
  messages?: readonly string[];
  title?: string;
  onRetry?: () => void;
}

/** An error message in a live region, so screen readers announce it when it appears. */
export function ErrorBanner({ error, messages, title, onRetry }: ErrorBannerProps) {
  const text = messages && messages.length ? messages.join(' ') : error ? errorText(error) : '';
  if (!text) return null;
  return (
    <MessageBar intent="error" role="alert" layout="multiline">
      <MessageBarBody>
        {title && <MessageBarTitle>{title}</MessageBarTitle>}
        {text}
      </MessageBarBody>
      {onRetry && (
        <MessageBarActions>
          <Button onClick={onRetry}>Try again</Button>
        </MessageBarActions>
      )}
    </MessageBar>
  );
}
