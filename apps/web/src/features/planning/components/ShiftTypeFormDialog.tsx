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
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Radio,
  RadioGroup,
  Select,
  tokens,
} from '@fluentui/react-components';
import {
  GUARD_RAIL_DEFERRAL,
  SHIFT_COLOURS,
  type ShiftColour,
  shiftTypeCautions,
  type ShiftTypeDto,
} from '@rotaplex/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { formErrors } from '@/api/errors';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import { createShiftType, planningKeys, updateShiftType } from '@/features/planning/api/planning.queries';
import { SHIFT_COLOUR_LABELS } from '@/features/planning/utils/shiftColours';
import {
  formatMinutes,
  shiftTypeFormErrors,
  summariseShiftTimes,
} from '@/features/planning/utils/shiftTimes';
import { ShiftChip } from './ShiftChip';
import { FormDialogActions } from '@/ui/FormDialogActions';

const useStyles = makeStyles({
  content: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalM,
    // A scrolling dialog must not squeeze its messages into each other.
    '& > *': { flexShrink: 0 },
  },
  row: { display: 'grid', gridTemplateColumns: '1fr 1fr', gap: tokens.spacingHorizontalM },
  swatches: { display: 'flex', flexWrap: 'wrap', columnGap: tokens.spacingHorizontalS },
  swatchLabel: { display: 'inline-flex', alignItems: 'center', gap: tokens.spacingHorizontalXS },
  muted: { color: tokens.colorNeutralForeground3 },
});

const FIELDS = ['code', 'name', 'start', 'end', 'paidMinutes', 'colour', 'night'] as const;
type NightChoice = 'auto' | 'yes' | 'no';

export interface ShiftTypeFormDialogProps {
  unitId: string;
  unitName: string;
  /** The shift type to edit; without one the dialog creates a new one. */
  shiftType?: ShiftTypeDto;
  /** A colour not yet used in the unit, for a new shift type. */
  suggestedColour: ShiftColour;
  onClose: () => void;
}

export function ShiftTypeFormDialog({
  unitId,
  unitName,
  shiftType,
  suggestedColour,
  onClose,
}: ShiftTypeFormDialogProps) {
  const styles = useStyles();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const [code, setCode] = useState(shiftType?.code ?? '');
  const [name, setName] = useState(shiftType?.name ?? '');
  const [start, setStart] = useState(shiftType?.start ?? '');
  const [end, setEnd] = useState(shiftType?.end ?? '');
  const [paid, setPaid] = useState(shiftType ? String(shiftType.paidMinutes) : '');
  const [colour, setColour] = useState<ShiftColour>(shiftType?.colour ?? suggestedColour);
  const [night, setNight] = useState<NightChoice>(
    shiftType?.night === true ? 'yes' : shiftType?.night === false ? 'no' : 'auto',
  );
  const [localErrors, setLocalErrors] = useState<ReturnType<typeof shiftTypeFormErrors>>({});

  const summary = summariseShiftTimes(start, end);
  const mutation = useMutation({
    mutationFn: () => {
      const body = {
        code: code.trim().toUpperCase(),
        name: name.trim(),
        start,
        end,
        paidMinutes: Number(paid),
        colour,
        night: night === 'auto' ? null : night === 'yes',
      };
      return shiftType ? updateShiftType(unitId, shiftType.id, body) : createShiftType(unitId, body);
    },
    onSuccess: async (saved) => {
      await queryClient.invalidateQueries({ queryKey: planningKeys.shiftTypes(unitId) });
      notify(shiftType ? `Saved shift type ${saved.code}` : `Added shift type ${saved.code} to ${unitName}`);
      onClose();
    },
  });
  const server = formErrors(mutation.error, FIELDS);
  const fieldError = (f: (typeof FIELDS)[number]) =>
    (f in localErrors ? localErrors[f as keyof typeof localErrors] : undefined) ?? server.fields[f];

  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    const errors = shiftTypeFormErrors({ code, name, start, end, paidMinutes: paid });
    setLocalErrors(errors);
    if (Object.keys(errors).length === 0) mutation.mutate();
  };

  const fieldProps = (f: (typeof FIELDS)[number]) => ({
    validationMessage: fieldError(f),
    validationState: fieldError(f) ? ('error' as const) : ('none' as const),
  });

  const title = shiftType ? `Edit shift type ${shiftType.code}` : 'New shift type';
  return (
    <Dialog open onOpenChange={(_, data) => !data.open && onClose()}>
      <DialogSurface aria-describedby={undefined}>
        <form onSubmit={handleSubmit} noValidate>
          <DialogBody>
            <DialogTitle>{title}</DialogTitle>
            <DialogContent className={styles.content}>
              <ErrorBanner messages={server.general} />
              <div className={styles.row}>
                <Field label="Code" required hint="1-4 letters or digits, e.g. E" {...fieldProps('code')}>
                  <Input
                    value={code}
                    maxLength={4}
                    autoComplete="off"
                    onChange={(_, d) => setCode(d.value.toUpperCase())}
                  />
                </Field>
                <Field label="Name" required {...fieldProps('name')}>
                  <Input value={name} autoComplete="off" onChange={(_, d) => setName(d.value)} />
                </Field>
              </div>
              <div className={styles.row}>
                <Field label="Starts" required hint={`Local time in ${unitName}`} {...fieldProps('start')}>
                  <Input type="time" value={start} onChange={(_, d) => setStart(d.value)} />
                </Field>
                <Field
                  label="Ends"
                  required
                  hint="At or before the start means the next day"
                  {...fieldProps('end')}
                >
                  <Input type="time" value={end} onChange={(_, d) => setEnd(d.value)} />
                </Field>
              </div>
              {summary && (
                <Caption1 className={styles.muted} aria-live="polite">
                  {formatMinutes(summary.lengthMinutes)} long
                  {summary.crossesMidnight ? ', ends the next day' : ''}
                  {summary.nightByTimes ? '; counts as a night shift by its times' : ''}.
                </Caption1>
              )}
              {summary && shiftTypeCautions({ start, end }).length > 0 && (
                <MessageBar intent="warning" layout="multiline">
                  <MessageBarBody>
                    <MessageBarTitle>Long shift</MessageBarTitle>
                    {shiftTypeCautions({ start, end }).join(' ')} {GUARD_RAIL_DEFERRAL}
                  </MessageBarBody>
                </MessageBar>
              )}
              <Field
                label="Paid minutes"
                required
                hint={
                  summary
                    ? `The length less unpaid breaks; at most ${summary.lengthMinutes}.`
                    : 'The length less unpaid breaks.'
                }
                {...fieldProps('paidMinutes')}
              >
                <Input
                  type="number"
                  min={0}
                  step={5}
                  value={paid}
                  onChange={(_, d) => setPaid(d.value)}
                  onFocus={() => {
                    if (paid === '' && summary) setPaid(String(summary.lengthMinutes));
                  }}
                />
              </Field>
              <Field label="Colour" {...fieldProps('colour')}>
                <RadioGroup
                  layout="horizontal"
                  className={styles.swatches}
                  value={colour}
                  onChange={(_, d) => setColour(d.value as ShiftColour)}
                >
                  {SHIFT_COLOURS.map((c) => (
                    <Radio
                      key={c}
                      value={c}
                      label={{
                        className: styles.swatchLabel,
                        children: (
                          <>
                            <ShiftChip code={code.trim() || '··'} colour={c} />
                            {SHIFT_COLOUR_LABELS[c]}
                          </>
                        ),
                      }}
                    />
                  ))}
                </RadioGroup>
              </Field>
              <Field
                label="Night shift"
                hint="Night rules (most nights in a row) count these shifts."
                {...fieldProps('night')}
              >
                <Select value={night} onChange={(_, d) => setNight(d.value as NightChoice)}>
                  <option value="auto">
                    From the times{summary ? ` (${summary.nightByTimes ? 'night' : 'not night'})` : ''}
                  </option>
                  <option value="yes">Always a night shift</option>
                  <option value="no">Never a night shift</option>
                </Select>
              </Field>
            </DialogContent>
            <FormDialogActions
              pending={mutation.isPending}
              onCancel={onClose}
              submitLabel={shiftType ? 'Save changes' : 'Create shift type'}
            />
          </DialogBody>
        </form>
      </DialogSurface>
    </Dialog>
  );
}
