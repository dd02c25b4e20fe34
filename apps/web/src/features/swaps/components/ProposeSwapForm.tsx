import { useState, type FormEvent } from 'react';
import {
  Button,
  Field,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Radio,
  RadioGroup,
  Select,
  Textarea,
  tokens,
} from '@fluentui/react-components';
import type { ProposeSwapDto, SwapPreviewDto } from '@rotaplex/contracts';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import {
  previewSwap,
  proposeSwap,
  publishedPeriodsQuery,
  swapKeys,
  swapOptionsQuery,
} from '../api/swaps.queries';
import { changeSummary, dayLabel } from '../utils/swapText';

const useStyles = makeStyles({
  form: { display: 'grid', gap: tokens.spacingVerticalM, maxWidth: '40rem' },
  row: { display: 'flex', gap: tokens.spacingHorizontalM, flexWrap: 'wrap' },
  findings: { margin: 0, paddingLeft: tokens.spacingHorizontalL },
});

/** Propose a swap or offer a shift: pick the shifts, see the checker's findings, then send. */
export function ProposeSwapForm() {
  const styles = useStyles();
  const queryClient = useQueryClient();
  const notify = useNotify();
  const periods = useQuery(publishedPeriodsQuery());
  const [periodId, setPeriodId] = useState('');
  const activePeriod = periodId || periods.data?.[0]?.id || '';
  const options = useQuery(swapOptionsQuery(activePeriod));
  const [kind, setKind] = useState<'swap' | 'offer'>('swap');
  const [myDate, setMyDate] = useState('');
  const [colleague, setColleague] = useState('');
  const [theirDate, setTheirDate] = useState('');
  const [note, setNote] = useState('');
  const [preview, setPreview] = useState<SwapPreviewDto | null>(null);

  const body: ProposeSwapDto = {
    kind,
    rosterPeriodId: activePeriod,
    myDate,
    colleagueStaffMemberId: colleague,
    ...(kind === 'swap' ? { theirDate } : {}),
    ...(note.trim() ? { note: note.trim() } : {}),
  };
  const complete = !!activePeriod && !!myDate && !!colleague && (kind === 'offer' || !!theirDate);
  const reset = () => setPreview(null);

  const check = useMutation({ mutationFn: () => previewSwap(body), onSuccess: setPreview });
  const send = useMutation({
    mutationFn: () => proposeSwap(body),
    onSuccess: () => {
      notify(
        kind === 'swap' ? 'Swap proposed: your colleague has been e-mailed' : 'Shift offered',
        'success',
      );
      setPreview(null);
      setMyDate('');
      setTheirDate('');
      setNote('');
      void queryClient.invalidateQueries({ queryKey: swapKeys.all });
    },
  });

  const handleSubmit = (e: FormEvent) => {
    e.preventDefault();
    if (preview && !preview.blocked) send.mutate();
    else check.mutate();
  };

  if (periods.error) return <ErrorBanner error={periods.error} />;
  if (periods.data && periods.data.length === 0) {
    return (
      <MessageBar intent="info">
        <MessageBarBody>No roster of your unit is published yet.</MessageBarBody>
      </MessageBar>
    );
  }
  const them = options.data?.colleagues.find((c) => c.staffMemberId === colleague);

  return (
    <form className={styles.form} onSubmit={handleSubmit} aria-label="Propose a swap">
      {(periods.data?.length ?? 0) > 1 ? (
        <Field label="Roster period">
          <Select
            value={activePeriod}
            onChange={(_, d) => {
              setPeriodId(d.value);
              setMyDate('');
              reset();
            }}
          >
            {periods.data?.map((p) => (
              <option key={p.id} value={p.id}>
                From {dayLabel(p.startDate)} ({p.days} days)
              </option>
            ))}
          </Select>
        </Field>
      ) : null}
      <RadioGroup
        layout="horizontal"
        value={kind}
        onChange={(_, d) => {
          setKind(d.value as 'swap' | 'offer');
          reset();
        }}
        aria-label="Kind of request"
      >
        <Radio value="swap" label="Swap shifts" />
        <Radio value="offer" label="Offer my shift" />
      </RadioGroup>
      <div className={styles.row}>
        <Field label="My shift" required>
          <Select
            value={myDate}
            onChange={(_, d) => {
              setMyDate(d.value);
              reset();
            }}
          >
            <option value="">Choose…</option>
            {options.data?.myShifts.map((s) => (
              <option key={s.date} value={s.date}>
                {dayLabel(s.date)}: {s.shiftCode}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Colleague" required>
          <Select
            value={colleague}
            onChange={(_, d) => {
              setColleague(d.value);
              setTheirDate('');
              reset();
            }}
          >
            <option value="">Choose…</option>
            {options.data?.colleagues.map((c) => (
              <option key={c.staffMemberId} value={c.staffMemberId}>
                {c.name}
              </option>
            ))}
          </Select>
        </Field>
        {kind === 'swap' ? (
          <Field label="Their shift I take" required>
            <Select
              value={theirDate}
              disabled={!them}
              onChange={(_, d) => {
                setTheirDate(d.value);
                reset();
              }}
            >
              <option value="">Choose…</option>
              {them?.shifts.map((s) => (
                <option key={s.date} value={s.date}>
                  {dayLabel(s.date)}: {s.shiftCode}
                </option>
              ))}
            </Select>
          </Field>
        ) : null}
      </div>
      <Field label="Note to your colleague (optional)">
        <Textarea value={note} maxLength={500} onChange={(_, d) => setNote(d.value)} />
      </Field>
      {check.error ? <ErrorBanner error={check.error} title="Could not check the swap" /> : null}
      {send.error ? <ErrorBanner error={send.error} title="The request was not sent" /> : null}
      {preview ? (
        <MessageBar
          intent={
            preview.blocked
              ? 'error'
              : preview.coverUnderMinAfter > preview.coverUnderMinBefore
                ? 'warning'
                : 'success'
          }
          layout="multiline"
          role="status"
        >
          <MessageBarBody>
            <MessageBarTitle>
              {preview.blocked ? 'This change breaks a rule' : 'The rules check found no problem'}
            </MessageBarTitle>
            After the change: {changeSummary(preview.changes)}.
            {preview.violations.length ? (
              <ul className={styles.findings}>
                {preview.violations.map((v, i) => (
                  <li key={i}>
                    {v.message}
                    {v.isNew ? '' : ' (already so before this change)'}
                    {v.warning ? ` ${v.warning}` : ''}
                  </li>
                ))}
              </ul>
            ) : null}
            {preview.coverUnderMinAfter > preview.coverUnderMinBefore
              ? ' Cover would fall further below its minimum; the manager sees this when approving.'
              : ''}
          </MessageBarBody>
        </MessageBar>
      ) : null}
      <div className={styles.row}>
        <Button
          type="submit"
          appearance="primary"
          disabled={!complete || check.isPending || send.isPending || !!preview?.blocked}
        >
          {preview && !preview.blocked
            ? kind === 'swap'
              ? 'Send swap request'
              : 'Send offer'
            : 'Check the rules'}
        </Button>
      </div>
    </form>
  );
}
