import { useState, type FormEvent } from 'react';
import { Button, Field, Input, makeStyles, Select, tokens } from '@fluentui/react-components';
import { LEAVE_TYPE_LABELS, LEAVE_TYPES, type LeaveType, type MyStaffMemberDto } from '@rotaplex/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import { createLeave, requestKeys } from '../api/requests.queries';
import { rangeLabel } from '../utils/requestText';

const useStyles = makeStyles({
  form: { display: 'flex', flexWrap: 'wrap', alignItems: 'flex-end', gap: tokens.spacingHorizontalM },
  note: { minWidth: '16rem' },
});

/** A leave request over a range of dates; a manager approves or declines it. */
export function LeaveForm({ staffMembers }: { staffMembers: MyStaffMemberDto[] }) {
  const styles = useStyles();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const [staffMemberId, setStaffMemberId] = useState(staffMembers[0]?.id ?? '');
  const [startDate, setStartDate] = useState('');
  const [endDate, setEndDate] = useState('');
  const [type, setType] = useState<LeaveType>('annual');
  const [note, setNote] = useState('');
  const create = useMutation({
    mutationFn: () =>
      createLeave({
        staffMemberId,
        startDate,
        endDate: endDate || startDate,
        type,
        note: note.trim() || null,
      }),
    onSuccess: async (leave) => {
      notify(`Leave requested: ${rangeLabel(leave.startDate, leave.endDate)}`, 'success');
      setStartDate('');
      setEndDate('');
      setNote('');
      await queryClient.invalidateQueries({ queryKey: requestKeys.all });
    },
  });
  const submit = (e: FormEvent) => {
    e.preventDefault();
    create.mutate();
  };

  return (
    <form aria-label="New leave request" onSubmit={submit}>
      <div className={styles.form}>
        {staffMembers.length > 1 ? (
          <Field label="Unit" required>
            <Select value={staffMemberId} onChange={(_, d) => setStaffMemberId(d.value)}>
              {staffMembers.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.unitName}
                </option>
              ))}
            </Select>
          </Field>
        ) : null}
        <Field label="First day" required>
          <Input type="date" value={startDate} onChange={(_, d) => setStartDate(d.value)} />
        </Field>
        <Field label="Last day" hint="Leave empty for one day">
          <Input type="date" value={endDate} min={startDate} onChange={(_, d) => setEndDate(d.value)} />
        </Field>
        <Field label="Type" required>
          <Select value={type} onChange={(_, d) => setType(d.value as LeaveType)}>
            {LEAVE_TYPES.map((t) => (
              <option key={t} value={t}>
                {LEAVE_TYPE_LABELS[t]}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Note (optional)" className={styles.note}>
          <Input value={note} maxLength={500} onChange={(_, d) => setNote(d.value)} />
        </Field>
        <Button type="submit" appearance="primary" disabled={!startDate || create.isPending}>
          Request leave
        </Button>
      </div>
      {create.error ? <ErrorBanner error={create.error} title="The leave request was not saved" /> : null}
    </form>
  );
}
