import { useState } from 'react';
import {
  Badge,
  Button,
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
} from '@fluentui/react-components';
import { AddRegular, DeleteRegular, DocumentBulletListRegular, EditRegular } from '@fluentui/react-icons';
import { type ContractDto, type ContractPresetDto, contractCautions } from '@rotaplex/contracts';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useCurrentUser } from '@/features/auth/hooks/useCurrentUser';
import {
  contractPresetsQuery,
  contractsQuery,
  deleteContract,
  planningKeys,
} from '@/features/planning/api/planning.queries';
import { ContractFormDialog } from '@/features/planning/components/ContractFormDialog';
import { usePlanningStyles } from '@/features/planning/components/planningStyles';
import { RowActions } from '@/features/planning/components/RowActions';
import { WorkingTimeCaution } from '@/features/planning/components/WorkingTimeCaution';
import { describeRules } from '@/features/planning/utils/contractRules';
import { unitsQuery } from '@/features/units/api/units.queries';
import { ConfirmDialog } from '@/ui/ConfirmDialog';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { TableSkeleton } from '@/ui/LoadingState';
import { useNotify } from '@/ui/notify';
import { PageHeader } from '@/ui/PageHeader';

type Editing = { contract?: ContractDto; preset?: ContractPresetDto } | null;

export function ContractsPage() {
  const styles = usePlanningStyles();
  const me = useCurrentUser();
  const isAdmin = me.role === 'admin';
  const contracts = useQuery(contractsQuery());
  const presets = useQuery(contractPresetsQuery());
  const units = useQuery(unitsQuery());
  const [editing, setEditing] = useState<Editing>(null);
  const [removing, setRemoving] = useState<ContractDto | null>(null);
  const notify = useNotify();
  const queryClient = useQueryClient();
  const removal = useMutation({
    mutationFn: (c: ContractDto) => deleteContract(c.id),
    onSuccess: async (_, c) => {
      await queryClient.invalidateQueries({ queryKey: planningKeys.contracts });
      notify(`Removed contract ${c.name}`);
      setRemoving(null);
    },
  });
  const unitName = new Map((units.data ?? []).map((u) => [u.id, u.name]));
  const list = contracts.data;

  return (
    <>
      <PageHeader
        title="Contracts"
        description="Work rules for the people on a roster: hours a week, rest between shifts, runs of days and nights, weekends."
        actions={
          <>
            <Menu>
              <MenuTrigger disableButtonEnhancement>
                <Button icon={<DocumentBulletListRegular />} disabled={!presets.data}>
                  New from a preset
                </Button>
              </MenuTrigger>
              <MenuPopover>
                <MenuList>
                  {(presets.data ?? []).map((p) => (
                    <MenuItem key={p.key} onClick={() => setEditing({ preset: p })}>
                      {p.name}
                    </MenuItem>
                  ))}
                </MenuList>
              </MenuPopover>
            </Menu>
            <Button appearance="primary" icon={<AddRegular />} onClick={() => setEditing({})}>
              New contract
            </Button>
          </>
        }
      />
      <div className={styles.stack}>
        <WorkingTimeCaution />
        <section className={styles.panel} aria-label="Contracts">
          {contracts.isError && (
            <ErrorBanner error={contracts.error} onRetry={() => void contracts.refetch()} />
          )}
          {presets.isError && <ErrorBanner error={presets.error} title="The presets could not be loaded" />}
          {contracts.isPending && <TableSkeleton label="Loading contracts" />}
          {list && list.length === 0 && (
            <EmptyState icon={<DocumentBulletListRegular />} title="No contracts yet">
              Start from a preset of common working-time limits, or set the rules by hand.
            </EmptyState>
          )}
          {list && list.length > 0 && (
            <Table aria-label="Contracts">
              <TableHeader>
                <TableRow>
                  <TableHeaderCell>Name</TableHeaderCell>
                  <TableHeaderCell>Applies to</TableHeaderCell>
                  <TableHeaderCell>Main rules</TableHeaderCell>
                  <TableHeaderCell className={styles.actionsCol}>
                    <span className="visually-hidden">Actions</span>
                  </TableHeaderCell>
                </TableRow>
              </TableHeader>
              <TableBody>
                {list.map((c) => {
                  const mayWrite = c.unitId !== null || isAdmin;
                  const cautions = contractCautions(c);
                  return (
                    <TableRow key={c.id}>
                      <TableCell>
                        {c.name}
                        {cautions.length > 0 && (
                          <>
                            {' '}
                            <Badge appearance="tint" color="warning" title={cautions.join(' ')}>
                              Outside the presets
                            </Badge>
                          </>
                        )}
                      </TableCell>
                      <TableCell>
                        {c.unitId === null ? 'Whole organisation' : (unitName.get(c.unitId) ?? 'A unit')}
                      </TableCell>
                      <TableCell className={styles.muted}>
                        {describeRules(c)}
                        {cautions.length > 0 && ` ${cautions.join(' ')}`}
                      </TableCell>
                      <TableCell>
                        <RowActions
                          name={c.name}
                          actions={[
                            {
                              label: mayWrite ? 'Edit' : 'Edit (administrators only)',
                              icon: <EditRegular />,
                              disabled: !mayWrite,
                              onClick: () => setEditing({ contract: c }),
                            },
                            {
                              label: 'Remove',
                              icon: <DeleteRegular />,
                              disabled: !mayWrite,
                              onClick: () => {
                                removal.reset();
                                setRemoving(c);
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
      </div>
      {editing && (
        <ContractFormDialog
          key={editing.contract?.id ?? editing.preset?.key ?? 'new'}
          contract={editing.contract}
          preset={editing.preset}
          units={units.data ?? []}
          mayWriteOrganisation={isAdmin}
          onClose={() => setEditing(null)}
        />
      )}
      {removing && (
        <ConfirmDialog
          open
          title={`Remove contract ${removing.name}?`}
          confirmLabel="Remove"
          pending={removal.isPending}
          error={removal.error}
          onConfirm={() => removal.mutate(removing)}
          onCancel={() => setRemoving(null)}
        >
          A contract that staff members still hold cannot be removed; give them another contract first.
        </ConfirmDialog>
      )}
    </>
  );
}
