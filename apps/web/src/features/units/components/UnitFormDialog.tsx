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
import { PUBLISH_LEAD_DAYS_DEFAULT, PUBLISH_LEAD_DAYS_MAX } from '@rotaplex/contracts';
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
  const [lead, setLead] = useState(String(unit?.publishLeadDays ?? PUBLISH_LEAD_DAYS_DEFAULT));
  const [localError, setLocalError] = useState<{ name?: string; timeZone?: string; lead?: string }>({});

  const mutation = useMutation({
    mutationFn: () =>
      unit
        ? updateUnit(unit.id, { name: name.trim(), timeZone, publishLeadDays: Number(lead) })
        : createUnit({ name: name.trim(), timeZone, publishLeadDays: Number(lead) }),
    onSuccess: async (saved) => {
      await queryClient.invalidateQueries({ queryKey: unitKeys.all });
      notify(unit ? `Saved ${saved.name}` : `Created ${saved.name}`);
      onClose();
    },
  });
  const errors = formErrors(mutation.error, ['name', 'timeZone', 'publishLeadDays'] as const);

  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    const next: { name?: string; timeZone?: string; lead?: string } = {};
    if (!name.trim()) next.name = 'Give the unit a name, e.g. "Ward 7" or "Night desk".';
    if (!isValidTimeZone(timeZone)) next.timeZone = 'Pick a time zone from the list.';
    const days = Number(lead);
    if (!/^\d+$/.test(lead.trim()) || days > PUBLISH_LEAD_DAYS_MAX) {
      next.lead = `Enter whole days from 0 to ${PUBLISH_LEAD_DAYS_MAX}.`;
    }
    setLocalError(next);
    if (next.name || next.timeZone || next.lead) return;
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
              <Field
                label="Publish lead time (days before a period starts)"
                hint="Six weeks (42 days) is a common aim for hospital rosters; fair-workweek laws often ask for 14 days. Local law and agreements decide."
                validationMessage={localError.lead ?? errors.fields.publishLeadDays}
                validationState={(localError.lead ?? errors.fields.publishLeadDays) ? 'error' : 'none'}
              >
                <Input inputMode="numeric" value={lead} onChange={(_, d) => setLead(d.value)} />
              </Field>
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
