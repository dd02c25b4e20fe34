import type { ReactNode } from 'react';
import {
  Badge,
  Body1,
  Button,
  Caption1,
  makeStyles,
  TableCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import type { OpenShiftDto } from '@rotaplex/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useMediaQuery } from '@/hooks/useMediaQuery';
import { DataTable } from '@/ui/DataTable';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import { claimOpenShift, notifyOpenShift, swapKeys } from '../api/swaps.queries';
import { dayLabel } from '../utils/swapText';

const useStyles = makeStyles({
  reasons: { margin: 0, paddingLeft: tokens.spacingHorizontalL, color: tokens.colorNeutralForeground2 },
  need: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalXS, alignItems: 'center' },
  cards: { listStyleType: 'none', margin: 0, padding: 0, display: 'grid', gap: tokens.spacingVerticalS },
  card: {
    display: 'flex',
    flexDirection: 'column',
    alignItems: 'flex-start',
    gap: tokens.spacingVerticalXS,
    padding: tokens.spacingHorizontalM,
    borderRadius: tokens.borderRadiusMedium,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    backgroundColor: tokens.colorNeutralBackground1,
  },
  muted: { color: tokens.colorNeutralForeground3 },
  actions: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalXS },
});

export interface OpenShiftListProps {
  openShifts: readonly OpenShiftDto[];
  /** Staff can claim; managers only see. */
  canClaim: boolean;
  /** Managers who plan can e-mail the staff who may take a shift. */
  canNotify?: boolean;
  /** Shown under the shift's need (an offer outside the roster). */
  renderStatus?: (o: OpenShiftDto) => ReactNode;
  /** Managers' further actions beside the e-mail. */
  renderActions?: (o: OpenShiftDto) => ReactNode;
}

const key = (o: OpenShiftDto) => `${o.rosterPeriodId}|${o.date}|${o.shiftTypeId}|${o.skillId ?? ''}`;

/**
 * Cover still short on published rosters. Staff get a Claim button on what they may take and, on the
 * rest, the reasons they may not; managers see which are below the minimum and can e-mail the staff
 * who may take one.
 */
export function OpenShiftList({
  openShifts,
  canClaim,
  canNotify = false,
  renderStatus,
  renderActions,
}: OpenShiftListProps) {
  const styles = useStyles();
  const queryClient = useQueryClient();
  const notify = useNotify();
  const claim = useMutation({
    mutationFn: (o: OpenShiftDto) =>
      claimOpenShift({
        rosterPeriodId: o.rosterPeriodId,
        date: o.date,
        shiftTypeId: o.shiftTypeId,
        skillId: o.skillId,
      }),
    onSuccess: () => notify('Claim sent: a manager will approve or decline it', 'success'),
    onSettled: () => queryClient.invalidateQueries({ queryKey: swapKeys.all }),
  });
  const mail = useMutation({
    mutationFn: (o: OpenShiftDto) =>
      notifyOpenShift({
        rosterPeriodId: o.rosterPeriodId,
        date: o.date,
        shiftTypeId: o.shiftTypeId,
        skillId: o.skillId,
      }),
    onSuccess: (r) =>
      notify(
        r.notified === 0
          ? 'Nobody on the roster may take this shift: see what it would take, or offer it to bank or agency staff as local policy says'
          : `E-mailed ${r.notified} ${r.notified === 1 ? 'person' : 'people'} who may take it`,
        r.notified === 0 ? 'warning' : 'success',
      ),
  });
  const action = canClaim ? ['Can you take it?'] : canNotify ? ['Action'] : [];
  // On a phone each open shift is a card; a table of six columns does not fit 390 px.
  const narrow = useMediaQuery('(max-width: 720px)');
  const actionOf = (o: OpenShiftDto): ReactNode =>
    canClaim ? (
      o.mayTake === false ? (
        <ul className={styles.reasons} aria-label="Why you may not take it">
          {(o.whyNot ?? []).map((r) => (
            <li key={r}>{r}</li>
          ))}
        </ul>
      ) : (
        <Button size="small" appearance="primary" disabled={claim.isPending} onClick={() => claim.mutate(o)}>
          Claim
        </Button>
      )
    ) : canNotify ? (
      <span className={styles.actions}>
        <Button size="small" disabled={mail.isPending} onClick={() => mail.mutate(o)}>
          E-mail who may take it
        </Button>
        {renderActions?.(o)}
      </span>
    ) : null;
  const wanted = (o: OpenShiftDto) => (
    <span className={styles.need}>
      {o.short}
      {o.belowMinimum > 0 && (
        <Badge appearance="filled" color="danger">
          {o.belowMinimum} below minimum
        </Badge>
      )}
    </span>
  );
  const errors = (
    <>
      {claim.error ? <ErrorBanner error={claim.error} title="The shift was not claimed" /> : null}
      {mail.error ? <ErrorBanner error={mail.error} title="No e-mail was sent" /> : null}
    </>
  );
  if (narrow) {
    return (
      <>
        {errors}
        <ul className={styles.cards} aria-label="Open shifts">
          {openShifts.map((o) => (
            <li key={key(o)} className={styles.card}>
              <Body1>
                <strong>
                  {dayLabel(o.date)}, {o.shiftName} ({o.shiftCode}) {o.start}–{o.end}
                </strong>
              </Body1>
              <Caption1 className={styles.muted}>
                {o.skillCode ? `Needs ${o.skillCode}` : 'Anyone'} · still wanted {o.short}
                {o.pendingClaims > 0 ? ` · ${o.pendingClaims} claims waiting` : ''}
              </Caption1>
              {o.belowMinimum > 0 && (
                <Badge appearance="filled" color="danger">
                  {o.belowMinimum} below minimum
                </Badge>
              )}
              {renderStatus?.(o)}
              {actionOf(o)}
            </li>
          ))}
        </ul>
      </>
    );
  }
  return (
    <>
      {errors}
      <DataTable
        label="Open shifts"
        columns={['Day', 'Shift', 'Skill', 'Still wanted', 'Claims waiting', ...action]}
        size="small"
      >
        {openShifts.map((o) => (
          <TableRow key={key(o)}>
            <TableCell>{dayLabel(o.date)}</TableCell>
            <TableCell>
              {o.shiftName} ({o.shiftCode}) {o.start}–{o.end}
              {renderStatus ? <div>{renderStatus(o)}</div> : null}
            </TableCell>
            <TableCell>{o.skillCode ?? 'Any'}</TableCell>
            <TableCell>{wanted(o)}</TableCell>
            <TableCell>{o.pendingClaims}</TableCell>
            {canClaim || canNotify ? <TableCell>{actionOf(o)}</TableCell> : null}
          </TableRow>
        ))}
      </DataTable>
    </>
  );
}
