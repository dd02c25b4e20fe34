import type { ReactNode } from 'react';
import {
  Button,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  Spinner,
} from '@fluentui/react-components';
import { ErrorBanner } from './ErrorBanner';

export interface ConfirmDialogProps {
  open: boolean;
  title: string;
  children: ReactNode;
  confirmLabel: string;
  pending?: boolean;
  error?: unknown;
  onConfirm: () => void;
  onCancel: () => void;
}

/** Asks before an action with consequences. Escape or Cancel closes it without acting. */
export function ConfirmDialog(props: ConfirmDialogProps) {
  const { open, title, children, confirmLabel, pending, error, onConfirm, onCancel } = props;
  return (
    <Dialog open={open} modalType="alert" onOpenChange={(_, data) => !data.open && onCancel()}>
      <DialogSurface>
        <DialogBody>
          <DialogTitle>{title}</DialogTitle>
          <DialogContent>
            {children}
            <ErrorBanner error={error} />
          </DialogContent>
          <DialogActions>
            <Button appearance="secondary" onClick={onCancel} disabled={pending}>
              Cancel
            </Button>
            <Button
              appearance="primary"
              onClick={onConfirm}
              disabled={pending}
              icon={pending ? <Spinner size="tiny" /> : undefined}
            >
              {confirmLabel}
            </Button>
          </DialogActions>
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}
