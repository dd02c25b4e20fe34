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
  MessageBar,
  MessageBarBody,
  Textarea,
  tokens,
} from '@fluentui/react-components';
import {
  OUTSIDE_OFFER_NOTE_MAX_LENGTH,
  OUTSIDE_OFFER_TO_MAX_LENGTH,
  type OpenShiftDto,
} from '@rotaplex/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { formErrors } from '@/api/errors';
import { swapKeys } from '@/features/swaps/api/swaps.queries';
import { dayLabel } from '@/features/swaps/utils/swapText';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { FormDialogActions } from '@/ui/FormDialogActions';
import { useNotify } from '@/ui/notify';
import { offerOutside } from '../api/openShifts.queries';

const useStyles = makeStyles({
  content: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalM,
    '& > *': { flexShrink: 0 },
  },
});

const FIELDS = ['offeredTo', 'note'] as const;

export interface OutsideOfferDialogProps {
  openShift: OpenShiftDto;
  onClose: () => void;
}

/** Records that an open shift was offered to bank or agency staff outside the roster. */
export function OutsideOfferDialog({ openShift: o, onClose }: OutsideOfferDialogProps) {
  const styles = useStyles();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const [offeredTo, setOfferedTo] = useState('');
  const [note, setNote] = useState('');
  const [local, setLocal] = useState<Partial<Record<(typeof FIELDS)[number], string>>>({});
  const mutation = useMutation({
    mutationFn: () =>
      offerOutside({
        rosterPeriodId: o.rosterPeriodId,
        date: o.date,
        shiftTypeId: o.shiftTypeId,
        skillId: o.skillId,
        offeredTo: offeredTo.trim(),
        ...(note.trim() ? { note: note.trim() } : {}),
      }),
    onSuccess: async (saved) => {
      await queryClient.invalidateQueries({ queryKey: swapKeys.openShifts() });
      notify(`Recorded: offered outside the roster to ${saved.offeredTo}`, 'success');
      onClose();
    },
  });
  const server = formErrors(mutation.error, FIELDS);
  const error = (f: (typeof FIELDS)[number]) => local[f] ?? server.fields[f];
  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    const errors: typeof local = {};
    if (!offeredTo.trim()) errors.offeredTo = 'Say to whom: a bank office or an agency.';
    setLocal(errors);
    if (Object.keys(errors).length === 0) mutation.mutate();
  };
  return (
    <Dialog open onOpenChange={(_, d) => !d.open && onClose()}>
      <DialogSurface aria-describedby={undefined}>
        <form onSubmit={handleSubmit} noValidate>
          <DialogBody>
            <DialogTitle>
              Offer outside the roster: {o.shiftName} ({o.shiftCode}) on {dayLabel(o.date)}
              {o.skillCode ? `, ${o.skillCode}` : ''}
            </DialogTitle>
            <DialogContent className={styles.content}>
              <ErrorBanner messages={server.general} />
              <MessageBar intent="info">
                <MessageBarBody>
                  Staff still see the shift, marked as offered outside the roster, and may still claim it.
                  Bank or agency staff must hold the skill and registration the shift needs; local policy says
                  who may work it. The offer is kept in the period&apos;s audit trail.
                </MessageBarBody>
              </MessageBar>
              <Field
                label="Offered to"
                required
                hint="A bank office or an agency, e.g. Staff bank office"
                validationMessage={error('offeredTo')}
                validationState={error('offeredTo') ? 'error' : 'none'}
              >
                <Input
                  value={offeredTo}
                  maxLength={OUTSIDE_OFFER_TO_MAX_LENGTH}
                  autoComplete="off"
                  onChange={(_, d) => setOfferedTo(d.value)}
                />
              </Field>
              <Field
                label="Note"
                hint="Optional: who you spoke to, a booking reference"
                validationMessage={error('note')}
                validationState={error('note') ? 'error' : 'none'}
              >
                <Textarea
                  value={note}
                  maxLength={OUTSIDE_OFFER_NOTE_MAX_LENGTH}
                  onChange={(_, d) => setNote(d.value)}
                />
              </Field>
            </DialogContent>
            <FormDialogActions
              pending={mutation.isPending}
              onCancel={onClose}
              submitLabel="Record the offer"
            />
          </DialogBody>
        </form>
      </DialogSurface>
    </Dialog>
  );
}
