import { Button, TableCell, TableRow } from '@fluentui/react-components';
import type { OpenShiftDto } from '@rotaplex/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { DataTable } from '@/ui/DataTable';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import { claimOpenShift, swapKeys } from '../api/swaps.queries';
import { dayLabel } from '../utils/swapText';

export interface OpenShiftListProps {
  openShifts: readonly OpenShiftDto[];
  /** Staff can claim; managers only see. */
  canClaim: boolean;
}

/** Cover still short on published rosters, with a Claim button for staff. */
export function OpenShiftList({ openShifts, canClaim }: OpenShiftListProps) {
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
  return (
    <>
      {claim.error ? <ErrorBanner error={claim.error} title="The shift was not claimed" /> : null}
      <DataTable
        label="Open shifts"
        columns={['Day', 'Shift', 'Skill', 'Still wanted', 'Claims waiting', ...(canClaim ? ['Action'] : [])]}
        size="small"
      >
        {openShifts.map((o) => (
          <TableRow key={`${o.rosterPeriodId}|${o.date}|${o.shiftTypeId}|${o.skillId ?? ''}`}>
            <TableCell>{dayLabel(o.date)}</TableCell>
            <TableCell>
              {o.shiftName} ({o.shiftCode}) {o.start}–{o.end}
            </TableCell>
            <TableCell>{o.skillCode ?? 'Any'}</TableCell>
            <TableCell>{o.short}</TableCell>
            <TableCell>{o.pendingClaims}</TableCell>
            {canClaim ? (
              <TableCell>
                <Button
                  size="small"
                  appearance="primary"
                  disabled={claim.isPending}
                  onClick={() => claim.mutate(o)}
                >
                  Claim
                </Button>
              </TableCell>
            ) : null}
          </TableRow>
        ))}
      </DataTable>
    </>
  );
}
