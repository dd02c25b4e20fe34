import { Button, DialogActions, Spinner } from '@fluentui/react-components';

export interface FormDialogActionsProps {
  /** Label of the submit button, e.g. "Create skill". */
  submitLabel: string;
  /** True while the form's request runs: both buttons are disabled and the submit button spins. */
  pending: boolean;
  onCancel: () => void;
}

/** Cancel and submit buttons at the foot of a form dialog (the form's own submit handles Enter). */
export function FormDialogActions({ submitLabel, pending, onCancel }: FormDialogActionsProps) {
  return (
    <DialogActions>
      <Button appearance="secondary" onClick={onCancel} disabled={pending}>
        Cancel
      </Button>
      <Button
        type="submit"
        appearance="primary"
        disabled={pending}
        icon={pending ? <Spinner size="tiny" /> : undefined}
      >
        {submitLabel}
      </Button>
    </DialogActions>
  );
}
