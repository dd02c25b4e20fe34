import {
  Badge,
  Body1,
  Button,
  Caption1,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  tokens,
} from '@fluentui/react-components';
import type { CandidateDto, OpenShiftDto } from '@rotaplex/contracts';
import { useQuery } from '@tanstack/react-query';
import { PATHS } from '@/app/paths';
import { dayLabel } from '@/features/swaps/utils/swapText';
import { AppLink } from '@/ui/AppLink';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { TableSkeleton } from '@/ui/LoadingState';
import { whatItWouldTakeQuery } from '../api/openShifts.queries';

const useStyles = makeStyles({
  content: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalM,
    '& > *': { flexShrink: 0 },
  },
  people: { listStyleType: 'none', margin: 0, padding: 0, display: 'grid', gap: tokens.spacingVerticalS },
  person: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalXXS,
    paddingBottom: tokens.spacingVerticalS,
    borderBottom: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
  },
  head: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS, alignItems: 'center' },
  breaks: { margin: 0, paddingLeft: tokens.spacingHorizontalL, color: tokens.colorNeutralForeground2 },
  cautions: { margin: 0, paddingLeft: tokens.spacingHorizontalL },
  links: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalL },
});

export interface WhatItWouldTakeDialogProps {
  openShift: OpenShiftDto;
  onClose: () => void;
  /** Opens the form that records an offer outside the roster (absent when one is current). */
  onOfferOutside?: () => void;
}

const people = (n: number) => `${n} ${n === 1 ? 'person' : 'people'}`;

function verdict(c: CandidateDto): { label: string; colour: 'success' | 'danger' | 'warning' } {
  if (c.breaks.length === 0 && !c.alreadyWorks) return { label: 'May take it', colour: 'success' };
  const serious = c.breaks.filter((b) => b.serious).length;
  const n = c.breaks.length;
  const rules = n === 0 ? '' : `${n} ${n === 1 ? 'rule' : 'rules'}`;
  return {
    label: c.alreadyWorks && n === 0 ? 'Works another shift' : `Would break ${rules}`,
    colour: serious > 0 ? 'danger' : 'warning',
  };
}

/**
 * For an open shift, each person of the unit who has the skill and is not away that day, with the
 * rules taking it would break in words (nearest first), the fatigue and working-time cautions, and
 * where the product changes a roster. From here the manager may offer the shift outside the roster.
 */
export function WhatItWouldTakeDialog({ openShift: o, onClose, onOfferOutside }: WhatItWouldTakeDialogProps) {
  const styles = useStyles();
  const answer = useQuery(whatItWouldTakeQuery(o));
  const data = answer.data;
  const free = data?.candidates.filter((c) => c.breaks.length === 0 && !c.alreadyWorks).length ?? 0;
  const blocked = data?.candidates.filter((c) => c.breaks.length > 0 || c.alreadyWorks) ?? [];
  return (
    <Dialog open onOpenChange={(_, d) => !d.open && onClose()}>
      <DialogSurface aria-describedby={undefined}>
        <DialogBody>
          <DialogTitle>
            What it would take: {o.shiftName} ({o.shiftCode}) on {dayLabel(o.date)}
            {o.skillCode ? `, ${o.skillCode}` : ''}
          </DialogTitle>
          <DialogContent className={styles.content}>
            {answer.error ? <ErrorBanner error={answer.error} onRetry={() => void answer.refetch()} /> : null}
            {answer.isPending ? <TableSkeleton /> : null}
            {data ? (
              <>
                <Body1 data-testid="what-it-would-take-summary">
                  {data.candidates.length === 0
                    ? `Nobody on the unit has ${o.skillCode ?? 'what it needs'} and is free of leave that day.`
                    : free > 0
                      ? `${people(free)} may take it now (e-mail them from the list); ${people(blocked.length)} could take it only by breaking a rule (nearest first).`
                      : `Nobody on the roster may take it. ${people(data.candidates.length)} with ${o.skillCode ?? 'the skill'} could, each against a rule; the nearest come first.`}
                  {data.absent > 0
                    ? ` ${people(data.absent)} with the skill ${data.absent === 1 ? 'is' : 'are'} away that day.`
                    : ''}
                </Body1>
                {free > 0 ? (
                  <Body1>
                    <strong>May take it now:</strong>{' '}
                    {data.candidates
                      .filter((c) => c.breaks.length === 0 && !c.alreadyWorks)
                      .map((c) => c.name)
                      .join(', ')}
                  </Body1>
                ) : null}
                {blocked.length ? (
                  <ul className={styles.people} aria-label="Who could take it">
                    {blocked.map((c) => {
                      const v = verdict(c);
                      return (
                        <li key={c.staffMemberId} className={styles.person}>
                          <span className={styles.head}>
                            <strong>{c.name}</strong>
                            <Badge appearance="tint" color={v.colour}>
                              {v.label}
                            </Badge>
                          </span>
                          <ul className={styles.breaks}>
                            {c.alreadyWorks ? (
                              <li>
                                Already works the {c.alreadyWorks} that day; moving them would leave that
                                shift short.
                              </li>
                            ) : null}
                            {c.breaks.map((b) => (
                              <li key={b.words}>{b.words}</li>
                            ))}
                          </ul>
                        </li>
                      );
                    })}
                  </ul>
                ) : null}
                <MessageBar intent="warning">
                  <MessageBarBody>
                    <MessageBarTitle>Before you ask anyone beyond their contract</MessageBarTitle>
                    <ul className={styles.cautions}>
                      {data.cautions.map((c) => (
                        <li key={c}>{c}</li>
                      ))}
                    </ul>
                  </MessageBarBody>
                </MessageBar>
                <Caption1>{data.howToChange}</Caption1>
                <span className={styles.links}>
                  <AppLink to={PATHS.planningBoard(o.rosterPeriodId)}>Open the planning board</AppLink>
                  <AppLink to={PATHS.periodAudit(o.rosterPeriodId)}>See the audit trail</AppLink>
                </span>
              </>
            ) : null}
          </DialogContent>
          <DialogActions>
            <Button appearance="secondary" onClick={onClose}>
              Close
            </Button>
            {onOfferOutside ? (
              <Button appearance="primary" onClick={onOfferOutside}>
                Offer outside the roster
              </Button>
            ) : null}
          </DialogActions>
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}
