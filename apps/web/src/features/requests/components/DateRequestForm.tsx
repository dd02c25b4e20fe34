import { useState, type FormEvent } from 'react';
import { Button, Field, Input, makeStyles, Select, tokens } from '@fluentui/react-components';
import {
  DATE_REQUEST_KIND_LABELS,
  DATE_REQUEST_KINDS,
  type DateRequestKind,
  type RequestPeriodDto,
} from '@rotaplex/contracts';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { shiftTypesQuery } from '@/features/planning/api/planning.queries';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import { createDateRequest, requestKeys } from '../api/requests.queries';
import { dateLabel, periodDates } from '../utils/requestText';

const useStyles = makeStyles({
  form: { display: 'flex', flexWrap: 'wrap', alignItems: 'flex-end', gap: tokens.spacingHorizontalM },
  note: { minWidth: '16rem' },
});

/** A shift-on, shift-off or day-off request for one date of a draft period. */
export function DateRequestForm({ period, used }: { period: RequestPeriodDto; used: number }) {
  const styles = useStyles();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const shifts = useQuery(shiftTypesQuery(period.unitId));
  const [date, setDate] = useState('');
  const [kind, setKind] = useState<DateRequestKind>('dayOff');
  const [shiftTypeId, setShiftTypeId] = useState('');
  const [note, setNote] = useState('');
  const create = useMutation({
    mutationFn: () =>
      createDateRequest({
        rosterPeriodId: period.id,
        date,
        kind,
        shiftTypeId: kind === 'dayOff' ? null : shiftTypeId,
        note: note.trim() || null,
      }),
    onSuccess: async () => {
      notify(`${DATE_REQUEST_KIND_LABELS[kind]} request sent for ${dateLabel(date)}`, 'success');
      setDate('');
      setNote('');
      await queryClient.invalidateQueries({ queryKey: requestKeys.all });
    },
  });
  const submit = (e: FormEvent) => {
    e.preventDefault();
    create.mutate();
  };
  const complete = !!date && (kind === 'dayOff' || !!shiftTypeId);

  return (
    <form aria-label="New date request" onSubmit={submit}>
      <p>
        {used} of {period.requestLimit} date requests used in this period.
      </p>
      <div className={styles.form}>
        <Field label="Date" required>
          <Select value={date} onChange={(_, d) => setDate(d.value)}>
            <option value="">Choose…</option>
            {periodDates(period.startDate, period.days).map((d) => (
              <option key={d} value={d}>
                {dateLabel(d)}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Request" required>
          <Select value={kind} onChange={(_, d) => setKind(d.value as DateRequestKind)}>
            {DATE_REQUEST_KINDS.map((k) => (
              <option key={k} value={k}>
                {DATE_REQUEST_KIND_LABELS[k]}
              </option>
            ))}
          </Select>
        </Field>
        {kind !== 'dayOff' ? (
          <Field label="Shift" required>
            <Select value={shiftTypeId} onChange={(_, d) => setShiftTypeId(d.value)}>
              <option value="">Choose…</option>
              {shifts.data?.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.code}: {s.name} ({s.start}-{s.end})
                </option>
              ))}
            </Select>
          </Field>
        ) : null}
        <Field label="Note (optional)" className={styles.note}>
          <Input value={note} maxLength={500} onChange={(_, d) => setNote(d.value)} />
        </Field>
        <Button type="submit" appearance="primary" disabled={!complete || create.isPending}>
          Send request
        </Button>
      </div>
      {create.error ? <ErrorBanner error={create.error} title="The request was not saved" /> : null}
    </form>
  );
}
