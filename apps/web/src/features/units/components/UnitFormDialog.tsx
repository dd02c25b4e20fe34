import { useState, type FormEvent } from 'react';
import {
  Dialog,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  Field,
  Input,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import type { UnitDto } from '@rotaplex/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { formErrors } from '@/api/errors';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import { createUnit, unitKeys, updateUnit } from '@/features/units/api/units.queries';
import { isValidTimeZone } from '@/features/units/timeZones';
import { TimeZonePicker } from './TimeZonePicker';
import { FormDialogActions } from '@/ui/FormDialogActions';

const useStyles = makeStyles({
  content: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
});

export interface UnitFormDialogProps {
  unit?: UnitDto;
  open: boolean;
  onClose: () => void;
}

function browserTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
}

export function UnitFormDialog({ unit, open, onClose }: UnitFormDialogProps) {
  const styles = useStyles();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const [name, setName] = useState(unit?.name ?? '');
  const [timeZone, setTimeZone] = useState(unit?.timeZone ?? browserTimeZone());
  const [localError, setLocalError] = useState<{ name?: string; timeZone?: string }>({});

  const mutation = useMutation({
    mutationFn: () =>
      unit
        ? updateUnit(unit.id, { name: name.trim(), timeZone })
        : createUnit({ name: name.trim(), timeZone }),
    onSuccess: async (saved) => {
      await queryClient.invalidateQueries({ queryKey: unitKeys.all });
      notify(unit ? `Saved ${saved.name}` : `Created ${saved.name}`);
      onClose();
    },
  });
  const errors = formErrors(mutation.error, ['name', 'timeZone'] as const);

  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    const next: { name?: string; timeZone?: string } = {};
    if (!name.trim()) next.name = 'Give the unit a name, e.g. "Ward 7" or "Night desk".';
    if (!isValidTimeZone(timeZone)) next.timeZone = 'Pick a time zone from the list.';
    setLocalError(next);
    if (next.name || next.timeZone) return;
    mutation.mutate();
  };

  const nameError = localError.name ?? errors.fields.name;
  return (
    <Dialog open={open} onOpenChange={(_, data) => !data.open && onClose()}>
      <DialogSurface aria-describedby={undefined}>
        <form onSubmit={handleSubmit} noValidate>
          <DialogBody>
            <DialogTitle>{unit ? `Edit ${unit.name}` : 'New unit'}</DialogTitle>
            <DialogContent className={styles.content}>
              <ErrorBanner messages={errors.general} />
              <Field
                label="Name"
                required
                validationMessage={nameError}
                validationState={nameError ? 'error' : 'none'}
              >
                <Input value={name} maxLength={120} onChange={(_, d) => setName(d.value)} />
              </Field>
              <TimeZonePicker
                value={timeZone}
                onChange={setTimeZone}
                error={localError.timeZone ?? errors.fields.timeZone}
              />
            </DialogContent>
            <FormDialogActions
              pending={mutation.isPending}
              onCancel={onClose}
              submitLabel={unit ? 'Save changes' : 'Create unit'}
            />
          </DialogBody>
        </form>
      </DialogSurface>
    </Dialog>
  );
}
