import { Badge, Button, Caption1, makeStyles, TableCell, TableRow, tokens } from '@fluentui/react-components';
import type { SwapAction, SwapRequestDto } from '@rotaplex/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import { DataTable } from '@/ui/DataTable';
import { cancelSwap, decideSwap, swapKeys } from '../api/swaps.queries';
import { changeSummary, KIND_LABELS, STATUS_LABELS, statusColour } from '../utils/swapText';

const useStyles = makeStyles({
  actions: { display: 'flex', gap: tokens.spacingHorizontalS, flexWrap: 'wrap' },
  outcome: { color: tokens.colorNeutralForeground3, display: 'block' },
});

const ACTION_LABELS: Record<SwapAction, string> = {
  accept: 'Accept',
  decline: 'Decline',
  cancel: 'Cancel request',
  approve: 'Approve',
  refuse: 'Decline',
};

export interface SwapListProps {
  swaps: readonly SwapRequestDto[];
  /** Accessible name of the table. */
  label: string;
}

/** Swap requests with their state and the decisions the caller may make on each. */
export function SwapList({ swaps, label }: SwapListProps) {
  const styles = useStyles();
  const queryClient = useQueryClient();
  const notify = useNotify();
  const act = useMutation({
    mutationFn: ({ swap, action }: { swap: SwapRequestDto; action: SwapAction }) =>
      action === 'cancel' ? cancelSwap(swap.id) : decideSwap(swap.id, { decision: action }),
    onSuccess: (swap) =>
      notify(`${KIND_LABELS[swap.kind]}: ${STATUS_LABELS[swap.status].toLowerCase()}`, 'success'),
    onSettled: () => queryClient.invalidateQueries({ queryKey: swapKeys.all }),
  });

  return (
    <>
      {act.error ? <ErrorBanner error={act.error} title="The decision was not made" /> : null}
      <DataTable label={label} columns={['Request', 'Change', 'State', 'Actions']} size="small">
        {swaps.map((s) => (
          <TableRow key={s.id} data-swap-id={s.id}>
            <TableCell>
              {KIND_LABELS[s.kind]}: {s.proposerName}
              {s.colleagueName ? ` with ${s.colleagueName}` : ''}
            </TableCell>
            <TableCell>
              {changeSummary(s.changes)}
              {s.note ? <Caption1 className={styles.outcome}>Note: {s.note}</Caption1> : null}
            </TableCell>
            <TableCell>
              <Badge appearance="tint" color={statusColour(s.status)}>
                {STATUS_LABELS[s.status]}
              </Badge>
              {s.outcome ? <Caption1 className={styles.outcome}>{s.outcome}</Caption1> : null}
            </TableCell>
            <TableCell>
              <div className={styles.actions}>
                {s.actions.map((action) => (
                  <Button
                    key={action}
                    size="small"
                    appearance={action === 'accept' || action === 'approve' ? 'primary' : 'secondary'}
                    disabled={act.isPending}
                    onClick={() => act.mutate({ swap: s, action })}
                  >
                    {ACTION_LABELS[action]}
                  </Button>
                ))}
              </div>
            </TableCell>
          </TableRow>
        ))}
      </DataTable>
    </>
  );
}
