import {
  Button,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
} from '@fluentui/react-components';
import type { OpenShiftDto } from '@rotaplex/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
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
      <Table aria-label="Open shifts" size="small">
        <TableHeader>
          <TableRow>
            <TableHeaderCell>Day</TableHeaderCell>
            <TableHeaderCell>Shift</TableHeaderCell>
            <TableHeaderCell>Skill</TableHeaderCell>
            <TableHeaderCell>Still wanted</TableHeaderCell>
            <TableHeaderCell>Claims waiting</TableHeaderCell>
            {canClaim ? <TableHeaderCell>Action</TableHeaderCell> : null}
          </TableRow>
        </TableHeader>
        <TableBody>
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
        </TableBody>
      </Table>
    </>
  );
}
