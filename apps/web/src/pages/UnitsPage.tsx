import { useState } from 'react';
import {
  Button,
  Caption1,
  makeStyles,
  Menu,
  MenuItem,
  MenuList,
  MenuPopover,
  MenuTrigger,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import {
  AddRegular,
  DeleteRegular,
  EditRegular,
  GridRegular,
  MoreHorizontalRegular,
} from '@fluentui/react-icons';
import type { UnitDto } from '@rotaplex/contracts';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { deleteUnit, unitKeys, unitsQuery } from '@/features/units/api/units.queries';
import { UnitFormDialog } from '@/features/units/components/UnitFormDialog';
import { localTime, utcOffset } from '@/features/units/timeZones';
import { ConfirmDialog } from '@/ui/ConfirmDialog';
import { TablePanel } from '@/ui/DataTable';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { TableSkeleton } from '@/ui/LoadingState';
import { useNotify } from '@/ui/notify';
import { PageHeader } from '@/ui/PageHeader';

const useStyles = makeStyles({
  muted: { color: tokens.colorNeutralForeground3 },
  actionsCol: { width: '3.5rem' },
});

const dateFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });

export function UnitsPage() {
  const styles = useStyles();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const units = useQuery(unitsQuery());
  const [editing, setEditing] = useState<UnitDto | 'new' | null>(null);
  const [removing, setRemoving] = useState<UnitDto | null>(null);

  const removal = useMutation({
    mutationFn: (unit: UnitDto) => deleteUnit(unit.id),
    onSuccess: async (_, unit) => {
      await queryClient.invalidateQueries({ queryKey: unitKeys.all });
      notify(`Deleted ${unit.name}`);
      setRemoving(null);
    },
  });

  const sorted = [...(units.data ?? [])].sort((a, b) => a.name.localeCompare(b.name));
  return (
    <>
      <PageHeader
        title="Units"
        description="Wards, teams and stores. Each unit plans its own rosters in its own time zone."
        actions={
          <Button appearance="primary" icon={<AddRegular />} onClick={() => setEditing('new')}>
            New unit
          </Button>
        }
      />
      <TablePanel label="Unit list">
        {units.isError && <ErrorBanner error={units.error} onRetry={() => void units.refetch()} />}
        {units.isPending && <TableSkeleton rows={3} label="Loading units" />}
        {units.data && sorted.length === 0 && (
          <EmptyState
            icon={<GridRegular />}
            title="No units yet"
            action={
              <Button appearance="primary" onClick={() => setEditing('new')}>
                Create the first unit
              </Button>
            }
          >
            A unit is a place people work together on one roster: a ward, a store, a team.
          </EmptyState>
        )}
        {sorted.length > 0 && (
          <Table aria-label="Units">
            <TableHeader>
              <TableRow>
                <TableHeaderCell>Name</TableHeaderCell>
                <TableHeaderCell>Time zone</TableHeaderCell>
                <TableHeaderCell>Local time now</TableHeaderCell>
                <TableHeaderCell>Created</TableHeaderCell>
                <TableHeaderCell className={styles.actionsCol}>
                  <span className="visually-hidden">Actions</span>
                </TableHeaderCell>
              </TableRow>
            </TableHeader>
            <TableBody>
              {sorted.map((unit) => (
                <TableRow key={unit.id}>
                  <TableCell>{unit.name}</TableCell>
                  <TableCell>
                    {unit.timeZone} <Caption1 className={styles.muted}>({utcOffset(unit.timeZone)})</Caption1>
                  </TableCell>
                  <TableCell>{localTime(unit.timeZone)}</TableCell>
                  <TableCell>{dateFormat.format(new Date(unit.createdAt))}</TableCell>
                  <TableCell>
                    <Menu positioning="below-end">
                      <MenuTrigger disableButtonEnhancement>
                        <Button
                          appearance="subtle"
                          icon={<MoreHorizontalRegular />}
                          aria-label={`Actions for ${unit.name}`}
                        />
                      </MenuTrigger>
                      <MenuPopover>
                        <MenuList>
                          <MenuItem icon={<EditRegular />} onClick={() => setEditing(unit)}>
                            Edit name and time zone
                          </MenuItem>
                          <MenuItem
                            icon={<DeleteRegular />}
                            onClick={() => {
                              removal.reset();
                              setRemoving(unit);
                            }}
                          >
                            Delete
                          </MenuItem>
                        </MenuList>
                      </MenuPopover>
                    </Menu>
                  </TableCell>
                </TableRow>
              ))}
            </TableBody>
          </Table>
        )}
      </TablePanel>
      {editing && (
        <UnitFormDialog
          key={editing === 'new' ? 'new' : editing.id}
          open
          unit={editing === 'new' ? undefined : editing}
          onClose={() => setEditing(null)}
        />
      )}
      {removing && (
        <ConfirmDialog
          open
          title={`Delete ${removing.name}?`}
          confirmLabel="Delete unit"
          pending={removal.isPending}
          error={removal.error}
          onConfirm={() => removal.mutate(removing)}
          onCancel={() => setRemoving(null)}
        >
          Only a unit with no people in it can be deleted. Move its people to another unit first.
        </ConfirmDialog>
      )}
    </>
  );
}
