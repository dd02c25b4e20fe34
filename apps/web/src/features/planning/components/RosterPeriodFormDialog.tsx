import { useState, type FormEvent } from 'react';
import {
  Caption1,
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
import { ROSTER_PERIOD_MAX_DAYS, ROSTER_PERIOD_MIN_DAYS, type RosterPeriodDto } from '@rotaplex/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { formErrors } from '@/api/errors';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import {
  createRosterPeriod,
  planningKeys,
  updateRosterPeriod,
} from '@/features/planning/api/planning.queries';
import { addDays } from '@/features/planning/utils/periodDates';
import { FormDialogActions } from '@/ui/FormDialogActions';

const useStyles = makeStyles({
  content: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalM,
    // A scrolling dialog must not squeeze its messages into each other.
    '& > *': { flexShrink: 0 },
  },
  muted: { color: tokens.colorNeutralForeground3 },
});

const FIELDS = ['startDate', 'days'] as const;
type F = (typeof FIELDS)[number];

export interface RosterPeriodFormDialogProps {
  unitId: string;
  unitName: string;
  period?: RosterPeriodDto;
  suggestedStart: string;
  onClose: () => void;
}

const longDate = new Intl.DateTimeFormat('en-GB', {
  weekday: 'long',
  day: 'numeric',
  month: 'long',
  year: 'numeric',
  timeZone: 'UTC',
});

export function RosterPeriodFormDialog({
  unitId,
  unitName,
  period,
  suggestedStart,
  onClose,
}: RosterPeriodFormDialogProps) {
  const styles = useStyles();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const [startDate, setStartDate] = useState(period?.startDate ?? suggestedStart);
  const [days, setDays] = useState(String(period?.days ?? 28));
  const [local, setLocal] = useState<Partial<Record<F, string>>>({});
  const mutation = useMutation({
    mutationFn: () =>
      period
        ? updateRosterPeriod(period.id, { startDate, days: Number(days), version: period.version })
        : createRosterPeriod({ unitId, startDate, days: Number(days) }),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: planningKeys.rosterPeriods });
      notify(period ? 'Saved the roster period' : `Created a roster period for ${unitName}`);
      onClose();
    },
  });
  const server = formErrors(mutation.error, FIELDS);
  const error = (f: F) => local[f] ?? server.fields[f];
  const n = Number(days);
  const validDays = Number.isInteger(n) && n >= ROSTER_PERIOD_MIN_DAYS && n <= ROSTER_PERIOD_MAX_DAYS;
  const validStart = /^\d{4}-\d{2}-\d{2}$/.test(startDate);

  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    const errors: Partial<Record<F, string>> = {};
    if (!validStart) errors.startDate = 'Choose the first day.';
    if (!validDays)
      errors.days = `Between ${ROSTER_PERIOD_MIN_DAYS} and ${ROSTER_PERIOD_MAX_DAYS} days (1 to 12 weeks).`;
    setLocal(errors);
    if (Object.keys(errors).length === 0) mutation.mutate();
  };

  return (
    <Dialog open onOpenChange={(_, d) => !d.open && onClose()}>
      <DialogSurface aria-describedby={undefined}>
        <form onSubmit={handleSubmit} noValidate>
          <DialogBody>
            <DialogTitle>{period ? 'Edit roster period' : 'New roster period'}</DialogTitle>
            <DialogContent className={styles.content}>
              <ErrorBanner messages={server.general} />
              <Field
                label="First day"
                required
                validationMessage={error('startDate')}
                validationState={error('startDate') ? 'error' : 'none'}
              >
                <Input type="date" value={startDate} onChange={(_, d) => setStartDate(d.value)} />
              </Field>
              <Field
                label="Length in days"
                required
                hint="Rosters usually run for whole weeks: 28 days is four weeks."
                validationMessage={error('days')}
                validationState={error('days') ? 'error' : 'none'}
              >
                <Input
                  type="number"
                  min={ROSTER_PERIOD_MIN_DAYS}
                  max={ROSTER_PERIOD_MAX_DAYS}
                  value={days}
                  onChange={(_, d) => setDays(d.value)}
                />
              </Field>
              {validDays && validStart && (
                <Caption1 className={styles.muted} aria-live="polite">
                  {`From ${longDate.format(new Date(`${startDate}T00:00:00Z`))} to ${longDate.format(
                    new Date(`${addDays(startDate, n - 1)}T00:00:00Z`),
                  )}.`}
                </Caption1>
              )}
            </DialogContent>
            <FormDialogActions
              pending={mutation.isPending}
              onCancel={onClose}
              submitLabel={period ? 'Save changes' : 'Create period'}
            />
          </DialogBody>
        </form>
      </DialogSurface>
    </Dialog>
  );
}
