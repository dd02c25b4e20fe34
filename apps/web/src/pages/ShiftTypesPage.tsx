import { useState } from 'react';
import {
  Button,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
} from '@fluentui/react-components';
import { AddRegular, ClockRegular, DeleteRegular, EditRegular } from '@fluentui/react-icons';
import { isNightByTimes, SHIFT_COLOURS, shiftLengthMinutes, type ShiftTypeDto } from '@rotaplex/contracts';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { deleteShiftType, planningKeys, shiftTypesQuery } from '@/features/planning/api/planning.queries';
import { usePlanningStyles } from '@/features/planning/components/planningStyles';
import { RowActions } from '@/features/planning/components/RowActions';
import { ShiftChip } from '@/features/planning/components/ShiftChip';
import { ShiftTypeFormDialog } from '@/features/planning/components/ShiftTypeFormDialog';
import { UnitPicker } from '@/features/planning/components/UnitPicker';
import { UnitScope } from '@/features/planning/components/UnitScope';
import { useSelectedUnit } from '@/features/planning/hooks/useSelectedUnit';
import { formatMinutes } from '@/features/planning/utils/shiftTimes';
import { ConfirmDialog } from '@/ui/ConfirmDialog';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { TableSkeleton } from '@/ui/LoadingState';
import { useNotify } from '@/ui/notify';
import { PageHeader } from '@/ui/PageHeader';

export function ShiftTypesPage() {
  const styles = usePlanningStyles();
  const selected = useSelectedUnit();
  const [editing, setEditing] = useState<ShiftTypeDto | 'new' | null>(null);
  const [removing, setRemoving] = useState<ShiftTypeDto | null>(null);
  const notify = useNotify();
  const queryClient = useQueryClient();
  const shiftTypes = useQuery(shiftTypesQuery(selected.unitId));

  const removal = useMutation({
    mutationFn: (s: ShiftTypeDto) => deleteShiftType(s.unitId, s.id),
    onSuccess: async (_, s) => {
      await queryClient.invalidateQueries({ queryKey: planningKeys.shiftTypes(s.unitId) });
      notify(`Removed shift type ${s.code}`);
      setRemoving(null);
    },
  });

  const list = shiftTypes.data;
  const used = new Set(list?.map((s) => s.colour));
  const suggestedColour = SHIFT_COLOURS.find((c) => !used.has(c)) ?? SHIFT_COLOURS[0];

  return (
    <>
      <PageHeader
        title="Shift types"
        description="The shifts a unit works: their times in the unit's time zone, paid minutes and colour on the roster."
        actions={
          selected.unit && (
            <Button appearance="primary" icon={<AddRegular />} onClick={() => setEditing('new')}>
              New shift type
            </Button>
          )
        }
      />
      <UnitScope selected={selected}>
        {(unit) => (
          <section className={styles.panel} aria-label="Shift types">
            <div className={styles.toolbar}>
              <UnitPicker units={selected.units} value={unit.id} onChange={selected.setUnitId} />
            </div>
            {shiftTypes.isError && (
              <ErrorBanner error={shiftTypes.error} onRetry={() => void shiftTypes.refetch()} />
            )}
            {shiftTypes.isPending && <TableSkeleton label="Loading shift types" />}
            {list && list.length === 0 && (
              <EmptyState icon={<ClockRegular />} title={`${unit.name} has no shift types yet`}>
                Add the shifts people work, for example an early, a late and a night shift.
              </EmptyState>
            )}
            {list && list.length > 0 && (
              <Table aria-label={`Shift types of ${unit.name}`}>
                <TableHeader>
                  <TableRow>
                    <TableHeaderCell>Code</TableHeaderCell>
                    <TableHeaderCell>Name</TableHeaderCell>
                    <TableHeaderCell>Times</TableHeaderCell>
                    <TableHeaderCell>Length</TableHeaderCell>
                    <TableHeaderCell>Paid</TableHeaderCell>
                    <TableHeaderCell>Night</TableHeaderCell>
                    <TableHeaderCell className={styles.actionsCol}>
                      <span className="visually-hidden">Actions</span>
                    </TableHeaderCell>
                  </TableRow>
                </TableHeader>
                <TableBody>
                  {list.map((s) => {
                    const length = shiftLengthMinutes(s.start, s.end);
                    const night = s.night ?? isNightByTimes(s.start, s.end);
                    return (
                      <TableRow key={s.id}>
                        <TableCell>
                          <ShiftChip code={s.code} colour={s.colour} title={s.name} />
                        </TableCell>
                        <TableCell>{s.name}</TableCell>
                        <TableCell className={styles.nowrap}>
                          {s.start}–{s.end}
                          {s.end <= s.start && <span className={styles.muted}> (next day)</span>}
                        </TableCell>
                        <TableCell>{formatMinutes(length)}</TableCell>
                        <TableCell>{formatMinutes(s.paidMinutes)}</TableCell>
                        <TableCell>
                          {night ? 'Yes' : 'No'}
                          {s.night === null && <span className={styles.muted}> (by times)</span>}
                        </TableCell>
                        <TableCell>
                          <RowActions
                            name={`${s.code} ${s.name}`}
                            actions={[
                              { label: 'Edit', icon: <EditRegular />, onClick: () => setEditing(s) },
                              {
                                label: 'Remove',
                                icon: <DeleteRegular />,
                                onClick: () => {
                                  removal.reset();
                                  setRemoving(s);
                                },
                              },
                            ]}
                          />
                        </TableCell>
                      </TableRow>
                    );
                  })}
                </TableBody>
              </Table>
            )}
          </section>
        )}
      </UnitScope>
      {editing && selected.unit && (
        <ShiftTypeFormDialog
          unitId={selected.unit.id}
          unitName={selected.unit.name}
          shiftType={editing === 'new' ? undefined : editing}
          suggestedColour={suggestedColour}
          onClose={() => setEditing(null)}
        />
      )}
      {removing && (
        <ConfirmDialog
          open
          title={`Remove shift type ${removing.code}?`}
          confirmLabel="Remove"
          pending={removal.isPending}
          error={removal.error}
          onConfirm={() => removal.mutate(removing)}
          onCancel={() => setRemoving(null)}
        >
          {`${removing.name} (${removing.start}–${removing.end}) will no longer be offered. A shift type that cover needs still use cannot be removed.`}
        </ConfirmDialog>
      )}
    </>
  );
}
