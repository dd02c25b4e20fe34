import { useState } from 'react';
import {
  Badge,
  Body1,
  Button,
  Checkbox,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  Field,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Spinner,
  Subtitle2,
  Textarea,
  tokens,
} from '@fluentui/react-components';
import { useQuery } from '@tanstack/react-query';
import {
  type BelowMinimumShiftDto,
  GUARD_RAIL_DEFERRAL,
  PUBLISH_REASON_MAX_LENGTH,
  type PublishCheckDto,
  RED_FLAG_CAUTION,
  RED_FLAG_SOURCE,
  type RosterPeriodDto,
} from '@rotaplex/contracts';
import { formatDay } from '@/features/planning-board/utils/days';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { publishCheckQuery } from '../api/publishing.queries';

const useStyles = makeStyles({
  content: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  section: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXS },
  list: {
    margin: 0,
    paddingLeft: tokens.spacingHorizontalXL,
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalXS,
  },
  reasons: {
    color: tokens.colorNeutralForeground2,
    fontSize: tokens.fontSizeBase200,
    lineHeight: tokens.lineHeightBase200,
    margin: 0,
  },
  note: { color: tokens.colorNeutralForeground2 },
  // Messages keep their full height in the scrolling column (a flex item would shrink).
  bar: { flexShrink: 0 },
});

/** Shifts shown before "Show all". */
const SHOWN = 8;

export interface PublishDialogProps {
  period: RosterPeriodDto;
  pending: boolean;
  error: unknown;
  /** Publishes; `reason` is set when the manager acknowledged shifts below minimum cover. */
  onPublish: (acknowledgement: { reason: string } | null) => void;
  onCancel: () => void;
}

function shortfallText(s: BelowMinimumShiftDto): string {
  const who = s.skillCode ? `${s.skillCode} ` : '';
  const people = s.min === 1 ? 'person' : 'people';
  return `${formatDay(s.date)}, ${s.shiftName} (${s.shiftCode}): ${s.onShift} of ${s.min} ${who}${s.skillCode ? '' : people}`.trim();
}

/**
 * Publishing with eyes open: before the roster goes out, the server's publish check lists shifts
 * below minimum cover (worst first), rule findings, approved leave the roster does not honour and
 * cautions on the settings it uses. Publishing below minimum needs an explicit acknowledgement and a
 * written reason (kept in the audit trail); an empty roster cannot be published.
 */
export function PublishDialog({ period, pending, error, onPublish, onCancel }: PublishDialogProps) {
  const styles = useStyles();
  const check = useQuery(publishCheckQuery(period.id, period.version));
  const [acknowledged, setAcknowledged] = useState(false);
  const [reason, setReason] = useState('');
  const [all, setAll] = useState(false);
  const c: PublishCheckDto | undefined = check.data;
  const blocked = !c || c.blockers.length > 0;
  const needsAck = c?.needsAcknowledgement ?? false;
  const ready = !blocked && (!needsAck || (acknowledged && reason.trim() !== ''));
  const flags = c?.redFlags ?? [];
  const clean =
    c &&
    flags.length === 0 &&
    c.belowMinimum.length === 0 &&
    c.ruleFindings.length === 0 &&
    c.unhonouredLeave.length === 0 &&
    c.lateNotice === null &&
    c.cautions.length === 0;
  const shown = c ? (all ? c.belowMinimum : c.belowMinimum.slice(0, SHOWN)) : [];

  return (
    <Dialog open modalType="alert" onOpenChange={(_, data) => !data.open && onCancel()}>
      <DialogSurface>
        <DialogBody>
          <DialogTitle>Publish this roster?</DialogTitle>
          <DialogContent className={styles.content}>
            {check.isPending && <Spinner size="small" label="Checking the roster…" />}
            <ErrorBanner error={check.error} title="The roster could not be checked" />
            {c && c.blockers.length > 0 && (
              <MessageBar intent="error" layout="multiline" className={styles.bar}>
                <MessageBarBody>
                  <MessageBarTitle>This roster cannot be published</MessageBarTitle>
                  {c.blockers.join(' ')}
                </MessageBarBody>
              </MessageBar>
            )}
            {c && c.blockers.length === 0 && (
              <Body1>
                {c.shifts} {c.shifts === 1 ? 'shift' : 'shifts'} for {c.people}{' '}
                {c.people === 1 ? 'person' : 'people'}. Everyone on the roster who has an e-mail address gets
                their own shifts by e-mail. After publishing, the board is read-only: changes go through
                repair or a swap.
              </Body1>
            )}
            {flags.length > 0 && (
              // Red flags of safe staffing come first: the most serious shortfalls, named as the trade names them.
              <MessageBar
                intent="error"
                layout="multiline"
                className={styles.bar}
                data-testid="publish-red-flags"
              >
                <MessageBarBody>
                  <MessageBarTitle>
                    {flags.length === 1 ? '1 red flag' : `${flags.length} red flags`} of safe staffing (
                    {RED_FLAG_SOURCE})
                  </MessageBarTitle>
                  <ul className={styles.list} aria-label="Red flags">
                    {(all ? flags : flags.slice(0, SHOWN)).map((f) => (
                      <li key={`${f.date}-${f.shiftTypeId}-${f.skillId}`}>{f.text}</li>
                    ))}
                    {!all && flags.length > SHOWN && (
                      <li>and {flags.length - SHOWN} more (Show all below).</li>
                    )}
                  </ul>
                  <p className={styles.reasons}>{RED_FLAG_CAUTION}</p>
                </MessageBarBody>
              </MessageBar>
            )}
            {c && c.lateNotice && (
              <MessageBar
                intent="warning"
                layout="multiline"
                className={styles.bar}
                data-testid="publish-late-notice"
              >
                <MessageBarBody>
                  <MessageBarTitle>Late notice</MessageBarTitle>
                  {c.lateNotice}
                </MessageBarBody>
              </MessageBar>
            )}
            {clean && c.blockers.length === 0 && (
              <MessageBar intent="success">
                <MessageBarBody>
                  Every shift has its minimum cover, no rule is broken and all approved leave is honoured.
                </MessageBarBody>
              </MessageBar>
            )}
            {c && c.belowMinimum.length > 0 && (
              <section className={styles.section} aria-label="Shifts below minimum cover">
                <Subtitle2 as="h3">
                  {c.belowMinimum.length} {c.belowMinimum.length === 1 ? 'shift is' : 'shifts are'} below
                  minimum cover
                </Subtitle2>
                <Body1 className={styles.note}>
                  Worst first. Before you publish, ask for bank or agency staff, or escalate as your local
                  policy says.
                </Body1>
                <ul className={styles.list}>
                  {shown.map((s) => (
                    <li key={`${s.date}-${s.shiftTypeId}-${s.skillId ?? ''}`}>
                      {s.none && (
                        <Badge appearance="filled" color="danger" size="small">
                          {s.skillCode ? `No ${s.skillCode}` : 'Nobody'}
                        </Badge>
                      )}{' '}
                      {shortfallText(s)}
                      {s.reasons.length > 0 && <p className={styles.reasons}>{s.reasons[0]}</p>}
                    </li>
                  ))}
                </ul>
                {(c.belowMinimum.length > SHOWN || flags.length > SHOWN) && (
                  <div>
                    <Button size="small" onClick={() => setAll(!all)}>
                      {all ? 'Show fewer' : `Show all ${c.belowMinimum.length}`}
                    </Button>
                  </div>
                )}
              </section>
            )}
            {c && c.ruleFindings.length > 0 && (
              <section className={styles.section} aria-label="Rule findings">
                <Subtitle2 as="h3">
                  {c.ruleFindings.length} rule {c.ruleFindings.length === 1 ? 'finding' : 'findings'}
                </Subtitle2>
                <ul className={styles.list}>
                  {c.ruleFindings.slice(0, SHOWN).map((f, i) => (
                    <li key={`${f.rule}-${f.staffMemberId}-${f.dates.join()}-${i}`}>
                      {f.message}
                      {f.warning && <p className={styles.reasons}>{f.warning}</p>}
                    </li>
                  ))}
                  {c.ruleFindings.length > SHOWN && (
                    <li>and {c.ruleFindings.length - SHOWN} more, listed under the board.</li>
                  )}
                </ul>
              </section>
            )}
            {c && c.unhonouredLeave.length > 0 && (
              <section className={styles.section} aria-label="Approved leave not honoured">
                <Subtitle2 as="h3">Approved leave not honoured</Subtitle2>
                <ul className={styles.list}>
                  {c.unhonouredLeave.map((l) => (
                    <li key={`${l.staffMemberId}-${l.date}`}>
                      {l.name} works {l.shiftCode} on {formatDay(l.date)}, a day of approved leave.
                    </li>
                  ))}
                </ul>
              </section>
            )}
            {c && c.cautions.length > 0 && (
              <section className={styles.section} aria-label="Cautions">
                <Subtitle2 as="h3">Cautions</Subtitle2>
                <ul className={styles.list}>
                  {c.cautions.map((text) => (
                    <li key={text}>{text}</li>
                  ))}
                </ul>
              </section>
            )}
            {c && !blocked && (needsAck || !clean) && (
              <Body1 className={styles.note}>{GUARD_RAIL_DEFERRAL}</Body1>
            )}
            {c && !blocked && needsAck && (
              <>
                <Checkbox
                  checked={acknowledged}
                  onChange={(_, d) => setAcknowledged(d.checked === true)}
                  label={
                    flags.length > 0
                      ? 'I have read the shifts below minimum cover, red flags among them, and publish the roster as it is'
                      : 'I have read the shifts below minimum cover and publish the roster as it is'
                  }
                  disabled={pending}
                />
                <Field
                  label="Reason (kept in the audit trail)"
                  required
                  hint="For example: bank staff booked for the empty nights; escalated to the senior nurse on call."
                >
                  <Textarea
                    value={reason}
                    maxLength={PUBLISH_REASON_MAX_LENGTH}
                    onChange={(_, d) => setReason(d.value)}
                    disabled={pending}
                  />
                </Field>
              </>
            )}
            <ErrorBanner error={error} />
          </DialogContent>
          <DialogActions>
            <Button appearance="secondary" onClick={onCancel} disabled={pending}>
              Cancel
            </Button>
            <Button
              appearance="primary"
              disabled={pending || !ready}
              icon={pending ? <Spinner size="tiny" /> : undefined}
              onClick={() => onPublish(needsAck ? { reason: reason.trim() } : null)}
            >
              {needsAck ? 'Publish below minimum' : 'Publish'}
            </Button>
          </DialogActions>
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}
