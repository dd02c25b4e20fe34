import { useId, useState, type FormEvent } from 'react';
import {
  Body1,
  Button,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  Spinner,
  Subtitle1,
  Switch,
  Textarea,
  tokens,
} from '@fluentui/react-components';
import {
  NOTICE_WINDOW_CAUTION,
  NOTICE_WINDOW_DAYS_DEFAULT,
  NOTICE_WINDOW_DAYS_MAX,
  NOTICE_WINDOW_DAYS_MIN,
  type NoticeWindowSettingsDto,
  PREDICTABILITY_PAY_HOURS_MAX,
  PREDICTABILITY_PAY_RULE_MAX_LENGTH,
} from '@rotaplex/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { formErrors } from '@/api/errors';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import { noticeWindowKeys, updateNoticeWindow } from '../api/organisation.queries';

const useStyles = makeStyles({
  panel: {
    maxWidth: '36rem',
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalL,
    backgroundColor: tokens.colorNeutralBackground1,
    borderRadius: tokens.borderRadiusLarge,
    boxShadow: tokens.shadow2,
    padding: tokens.spacingHorizontalXL,
  },
  heading: { margin: 0 },
  number: { maxWidth: '10rem' },
  actions: { display: 'flex', justifyContent: 'flex-end' },
});

const FIELDS = [
  'noticeWindowDays',
  'recordPredictabilityPay',
  'predictabilityPayHours',
  'predictabilityPayRule',
] as const;

/** The form's own checks, in words; the server checks the same and answers 400. */
export function noticeWindowErrors(days: string, hours: string, rule: string) {
  const d = Number(days);
  const h = Number(hours);
  return {
    days:
      days.trim() === '' || !Number.isInteger(d) || d < NOTICE_WINDOW_DAYS_MIN || d > NOTICE_WINDOW_DAYS_MAX
        ? `Enter whole days from ${NOTICE_WINDOW_DAYS_MIN} to ${NOTICE_WINDOW_DAYS_MAX}.`
        : undefined,
    hours:
      hours.trim() === '' || !Number.isFinite(h) || h < 0 || h > PREDICTABILITY_PAY_HOURS_MAX
        ? `Enter hours from 0 to ${PREDICTABILITY_PAY_HOURS_MAX}.`
        : !Number.isInteger(h * 4)
          ? 'Enter hours in quarter hours, for example 1 or 1.25.'
          : undefined,
    rule:
      rule.trim().length > PREDICTABILITY_PAY_RULE_MAX_LENGTH
        ? `Keep the rule to ${PREDICTABILITY_PAY_RULE_MAX_LENGTH} characters.`
        : undefined,
  };
}

/** The organisation's notice window for changes after publishing, and optional predictability pay. */
export function NoticeWindowForm({ settings }: { settings: NoticeWindowSettingsDto }) {
  const styles = useStyles();
  const headingId = useId();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const [days, setDays] = useState(String(settings.noticeWindowDays));
  const [record, setRecord] = useState(settings.recordPredictabilityPay);
  const [hours, setHours] = useState(String(settings.predictabilityPayHours));
  const [rule, setRule] = useState(settings.predictabilityPayRule);
  const [touched, setTouched] = useState(false);
  const mutation = useMutation({
    mutationFn: () =>
      updateNoticeWindow({
        noticeWindowDays: Number(days),
        recordPredictabilityPay: record,
        predictabilityPayHours: Number(hours),
        predictabilityPayRule: rule.trim(),
      }),
    onSuccess: (saved) => {
      queryClient.setQueryData(noticeWindowKeys.all, saved);
      notify('Notice window saved');
    },
  });
  const errors = formErrors(mutation.error, FIELDS);
  const local = noticeWindowErrors(days, hours, rule);
  const daysError = (touched ? local.days : undefined) ?? errors.fields.noticeWindowDays;
  const hoursError = (touched ? local.hours : undefined) ?? errors.fields.predictabilityPayHours;
  const ruleError = (touched ? local.rule : undefined) ?? errors.fields.predictabilityPayRule;

  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    setTouched(true);
    if (local.days || local.hours || local.rule) return;
    mutation.mutate();
  };

  return (
    <form className={styles.panel} onSubmit={handleSubmit} noValidate aria-labelledby={headingId}>
      <Subtitle1 as="h2" id={headingId} className={styles.heading}>
        Changes after publishing
      </Subtitle1>
      <Body1>
        A change to a published roster made with less notice than this is marked as a late change in the
        period’s reports, its audit trail and the e-mail to the person. Fair-workweek laws in some US cities
        and states ask for {NOTICE_WINDOW_DAYS_DEFAULT} days (for example Seattle SMC 14.22 and Oregon SB
        828). Changes people ask for themselves (their own swaps, open shifts they claim, their own leave) are
        marked as theirs.
      </Body1>
      <ErrorBanner messages={errors.general} />
      <Field
        label="Notice window (days before the shift)"
        required
        hint={`0 turns the marking off; at most ${NOTICE_WINDOW_DAYS_MAX} days.`}
        validationMessage={daysError}
        validationState={daysError ? 'error' : 'none'}
      >
        <Input
          className={styles.number}
          type="number"
          inputMode="numeric"
          min={NOTICE_WINDOW_DAYS_MIN}
          max={NOTICE_WINDOW_DAYS_MAX}
          value={days}
          onChange={(_, d) => setDays(d.value)}
        />
      </Field>
      <Switch
        checked={record}
        onChange={(_, d) => setRecord(d.checked)}
        label="Record predictability pay for late changes the employer makes"
      />
      <Field
        label="Hours of pay recorded per late change"
        required
        hint="In quarter hours. Recorded only while the switch above is on."
        validationMessage={hoursError}
        validationState={hoursError ? 'error' : 'none'}
      >
        <Input
          className={styles.number}
          type="number"
          inputMode="decimal"
          step={0.25}
          min={0}
          max={PREDICTABILITY_PAY_HOURS_MAX}
          value={hours}
          onChange={(_, d) => setHours(d.value)}
        />
      </Field>
      <Field
        label="Your rule in words (optional)"
        hint="Kept with each entry: the law or agreement you follow and how pay is worked out."
        validationMessage={ruleError}
        validationState={ruleError ? 'error' : 'none'}
      >
        <Textarea value={rule} onChange={(_, d) => setRule(d.value)} />
      </Field>
      <MessageBar intent="warning" layout="multiline">
        <MessageBarBody>{NOTICE_WINDOW_CAUTION}</MessageBarBody>
      </MessageBar>
      <div className={styles.actions}>
        <Button
          type="submit"
          appearance="primary"
          disabled={mutation.isPending}
          icon={mutation.isPending ? <Spinner size="tiny" /> : undefined}
        >
          Save the notice window
        </Button>
      </div>
    </form>
  );
}
