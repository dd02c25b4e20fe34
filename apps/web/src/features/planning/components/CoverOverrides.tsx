import { useState, type FormEvent } from 'react';
import {
  Button,
  Field,
  Input,
  makeStyles,
  Select,
  Spinner,
  TableCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import { AddRegular, DeleteRegular } from '@fluentui/react-icons';
import type { CoverOverrideDto, ShiftTypeDto, SkillDto } from '@rotaplex/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { formErrors } from '@/api/errors';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import {
  deleteCoverOverride,
  planningKeys,
  putCoverOverride,
} from '@/features/planning/api/planning.queries';
import { DataTable } from '@/ui/DataTable';
import { ShiftChip } from './ShiftChip';

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  form: { display: 'flex', flexWrap: 'wrap', alignItems: 'flex-start', gap: tokens.spacingHorizontalM },
  count: { width: '6rem' },
  submit: { marginTop: tokens.spacingVerticalXXL },
  muted: { color: tokens.colorNeutralForeground3 },
});

const FIELDS = ['date', 'shiftTypeId', 'skillId', 'min', 'target'] as const;
type F = (typeof FIELDS)[number];
const dateFormat = new Intl.DateTimeFormat('en-GB', {
  weekday: 'short',
  day: 'numeric',
  month: 'short',
  year: 'numeric',
  timeZone: 'UTC',
});

export interface CoverOverridesProps {
  unitId: string;
  overrides: readonly CoverOverrideDto[];
  shiftTypes: readonly ShiftTypeDto[];
  skills: readonly SkillDto[];
}

/** Needs for single dates (public holidays, events) that replace the weekly pattern's line on that date. */
export function CoverOverrides({ unitId, overrides, shiftTypes, skills }: CoverOverridesProps) {
  const styles = useStyles();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const [date, setDate] = useState('');
  const [shiftTypeId, setShiftTypeId] = useState(shiftTypes[0]?.id ?? '');
  const [skillId, setSkillId] = useState('');
  const [min, setMin] = useState('');
  const [target, setTarget] = useState('');
  const [local, setLocal] = useState<Partial<Record<F, string>>>({});
  const shiftById = new Map(shiftTypes.map((s) => [s.id, s]));
  const skillById = new Map(skills.map((s) => [s.id, s]));

  const add = useMutation({
    mutationFn: () =>
      putCoverOverride(unitId, {
        date,
        shiftTypeId,
        skillId: skillId || null,
        min: Number(min),
        target: target.trim() === '' ? Number(min) : Number(target),
      }),
    onSuccess: async (saved) => {
      await queryClient.invalidateQueries({ queryKey: planningKeys.coverNeeds(unitId) });
      // A minimum lowered to 0 on this date: say so, with the caution's own words.
      if (saved.cautions?.length) notify(`Saved the need for ${saved.date}. ${saved.cautions[0]}`, 'warning');
      else notify(`Saved the need for ${saved.date}`);
      setMin('');
      setTarget('');
    },
  });
  const remove = useMutation({
    mutationFn: (o: CoverOverrideDto) => deleteCoverOverride(unitId, o.id),
    onSuccess: async (_, o) => {
      await queryClient.invalidateQueries({ queryKey: planningKeys.coverNeeds(unitId) });
      notify(`Removed the need for ${o.date}`);
    },
  });
  const server = formErrors(add.error, FIELDS);
  const error = (f: F) => local[f] ?? server.fields[f];

  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    const errors: Partial<Record<F, string>> = {};
    if (!/^\d{4}-\d{2}-\d{2}$/.test(date)) errors.date = 'Choose a date.';
    if (!shiftTypeId) errors.shiftTypeId = 'Choose a shift type.';
    if (!/^\d{1,3}$/.test(min.trim())) errors.min = 'Whole number, 0 or more.';
    if (target.trim() !== '' && !/^\d{1,3}$/.test(target.trim())) errors.target = 'Whole number, 0 or more.';
    else if (!errors.min && target.trim() !== '' && Number(target) < Number(min))
      errors.target = 'At least the minimum.';
    setLocal(errors);
    if (Object.keys(errors).length === 0) add.mutate();
  };

  const sorted = [...overrides].sort((a, b) => a.date.localeCompare(b.date));
  return (
    <div className={styles.root}>
      <form className={styles.form} onSubmit={handleSubmit} noValidate aria-label="Add a date override">
        <Field
          label="Date"
          required
          validationMessage={error('date')}
          validationState={error('date') ? 'error' : 'none'}
        >
          <Input type="date" value={date} onChange={(_, d) => setDate(d.value)} />
        </Field>
        <Field
          label="Shift type"
          required
          validationMessage={error('shiftTypeId')}
          validationState={error('shiftTypeId') ? 'error' : 'none'}
        >
          <Select value={shiftTypeId} onChange={(_, d) => setShiftTypeId(d.value)}>
            {shiftTypes.map((s) => (
              <option key={s.id} value={s.id}>
                {s.code} · {s.name}
              </option>
            ))}
          </Select>
        </Field>
        <Field
          label="Skill needed"
          validationMessage={error('skillId')}
          validationState={error('skillId') ? 'error' : 'none'}
        >
          <Select value={skillId} onChange={(_, d) => setSkillId(d.value)}>
            <option value="">Anyone on the shift</option>
            {skills.map((s) => (
              <option key={s.id} value={s.id}>
                {s.code} · {s.name}
              </option>
            ))}
          </Select>
        </Field>
        <Field
          label="Minimum"
          required
          validationMessage={error('min')}
          validationState={error('min') ? 'error' : 'none'}
        >
          <Input
            className={styles.count}
            inputMode="numeric"
            value={min}
            onChange={(_, d) => setMin(d.value)}
          />
        </Field>
        <Field
          label="Target"
          validationMessage={error('target')}
          validationState={error('target') ? 'error' : 'none'}
        >
          <Input
            className={styles.count}
            inputMode="numeric"
            placeholder={min}
            value={target}
            onChange={(_, d) => setTarget(d.value)}
          />
        </Field>
        <Button
          className={styles.submit}
          type="submit"
          icon={add.isPending ? <Spinner size="tiny" /> : <AddRegular />}
          disabled={add.isPending || shiftTypes.length === 0}
        >
          Add override
        </Button>
      </form>
      <ErrorBanner messages={server.general} />
      <ErrorBanner error={remove.error} />
      {sorted.length === 0 ? (
        <span className={styles.muted}>No date overrides. Every date follows the weekly pattern.</span>
      ) : (
        <DataTable
          label="Date overrides"
          columns={['Date', 'Shift', 'Skill', 'Minimum', 'Target']}
          actionsColumn
          size="small"
        >
          {sorted.map((o) => {
            const shift = shiftById.get(o.shiftTypeId);
            const label = `${o.date} ${shift?.code ?? ''}`;
            return (
              <TableRow key={o.id}>
                <TableCell>{dateFormat.format(new Date(`${o.date}T00:00:00Z`))}</TableCell>
                <TableCell>
                  {shift ? (
                    <ShiftChip code={shift.code} colour={shift.colour} title={shift.name} />
                  ) : (
                    'Unknown'
                  )}
                </TableCell>
                <TableCell>{o.skillId ? (skillById.get(o.skillId)?.name ?? 'Unknown') : 'Anyone'}</TableCell>
                <TableCell>{o.min}</TableCell>
                <TableCell>{o.target}</TableCell>
                <TableCell>
                  <Button
                    appearance="subtle"
                    icon={<DeleteRegular />}
                    aria-label={`Remove the override of ${label}`}
                    disabled={remove.isPending}
                    onClick={() => remove.mutate(o)}
                  />
                </TableCell>
              </TableRow>
            );
          })}
        </DataTable>
      )}
    </div>
  );
}
