import { useState } from 'react';
import {
  Body1,
  Button,
  Field,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Textarea,
  tokens,
} from '@fluentui/react-components';
import type { SwapDecisionDto, SwapRequestDto } from '@rotaplex/contracts';
import { useMutation, useQuery } from '@tanstack/react-query';
import { errorText } from '@/api/errors';
import { LoadingState } from '@/ui/LoadingState';
import { decideByLink, swapLinkQuery } from '../api/swaps.queries';
import { changeSummary, KIND_LABELS, STATUS_LABELS } from '../utils/swapText';

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
  actions: { display: 'flex', gap: tokens.spacingHorizontalS, flexWrap: 'wrap' },
});

const LABELS: Record<SwapDecisionDto['decision'], string> = {
  accept: 'Accept the swap',
  decline: 'Decline',
  approve: 'Approve the change',
  refuse: 'Decline the change',
};

export interface SwapDecisionViewProps {
  token: string;
}

/**
 * What an e-mailed decision link is about, and the buttons that decide. Opening the page decides
 * nothing (a mail scanner may fetch it); only pressing a button does, once.
 */
export function SwapDecisionView({ token }: SwapDecisionViewProps) {
  const styles = useStyles();
  const view = useQuery(swapLinkQuery(token));
  const [reason, setReason] = useState('');
  const decide = useMutation({
    mutationFn: (decision: SwapDecisionDto['decision']) =>
      decideByLink(token, { decision, ...(reason.trim() ? { reason: reason.trim() } : {}) }),
  });

  if (view.isPending) return <LoadingState label="Reading the link…" />;
  if (view.error) {
    return (
      <MessageBar intent="error" layout="multiline" role="alert">
        <MessageBarBody>
          <MessageBarTitle>This link cannot be used</MessageBarTitle>
          {errorText(view.error)}
        </MessageBarBody>
      </MessageBar>
    );
  }
  const done: SwapRequestDto | undefined = decide.data;
  const swap = done ?? view.data.swap;
  return (
    <div className={styles.root}>
      <Body1>
        {KIND_LABELS[swap.kind]} asked by {swap.proposerName}
        {swap.colleagueName ? ` with ${swap.colleagueName}` : ''} in {view.data.unitName}:{' '}
        {changeSummary(swap.changes)}. Times are in {view.data.timeZone}.
      </Body1>
      {done ? (
        <MessageBar
          intent={done.status === 'approved' || done.status === 'accepted' ? 'success' : 'info'}
          role="status"
        >
          <MessageBarBody>
            <MessageBarTitle>Done: {STATUS_LABELS[done.status].toLowerCase()}</MessageBarTitle>
            {done.outcome ?? 'Everyone involved has been e-mailed.'}
          </MessageBarBody>
        </MessageBar>
      ) : (
        <>
          {decide.error ? (
            <MessageBar intent="error" layout="multiline" role="alert">
              <MessageBarBody>
                <MessageBarTitle>The decision was not made</MessageBarTitle>
                {errorText(decide.error)}
              </MessageBarBody>
            </MessageBar>
          ) : null}
          <Field label="Reason (optional, sent with a decline)">
            <Textarea value={reason} maxLength={500} onChange={(_, d) => setReason(d.value)} />
          </Field>
          <div className={styles.actions}>
            {view.data.decisions.map((d) => (
              <Button
                key={d}
                appearance={d === 'accept' || d === 'approve' ? 'primary' : 'secondary'}
                disabled={decide.isPending || decide.isError}
                onClick={() => decide.mutate(d)}
              >
                {LABELS[d]}
              </Button>
            ))}
          </div>
        </>
      )}
    </div>
  );
}
