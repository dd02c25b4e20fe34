import {
  Badge,
  makeStyles,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import { DeleteRegular, EditRegular } from '@fluentui/react-icons';
import type { ContractDto, StaffMemberDto, StaffSortField } from '@rotaplex/contracts';
import type { StaffListParams } from '@/features/planning/utils/staffListParams';
import { RowActions } from './RowActions';

const useStyles = makeStyles({
  table: { minWidth: '52rem' },
  muted: { color: tokens.colorNeutralForeground3 },
  skills: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalXS },
  actionsCol: { width: '3.5rem' },
  breakAnywhere: { overflowWrap: 'anywhere' },
});

const COLUMNS: { key: StaffSortField | 'skills' | 'contract'; label: string; sortable: boolean }[] = [
  { key: 'name', label: 'Name', sortable: true },
  { key: 'email', label: 'E-mail', sortable: true },
  { key: 'skills', label: 'Skills', sortable: false },
  { key: 'contract', label: 'Contract', sortable: false },
  { key: 'hourlyCost', label: 'Hourly cost', sortable: true },
  { key: 'active', label: 'Status', sortable: true },
];

const money = new Intl.NumberFormat('en-GB', { minimumFractionDigits: 2, maximumFractionDigits: 2 });

export interface StaffTableProps {
  members: readonly StaffMemberDto[];
  contracts: readonly ContractDto[];
  params: StaffListParams;
  onSort: (field: StaffSortField) => void;
  onEdit: (member: StaffMemberDto) => void;
  onRemove: (member: StaffMemberDto) => void;
}

export function StaffTable({ members, contracts, params, onSort, onEdit, onRemove }: StaffTableProps) {
  const styles = useStyles();
  const contractName = new Map(contracts.map((c) => [c.id, c.name]));
  return (
    <Table sortable aria-label="Staff on the roster" className={styles.table}>
      <TableHeader>
        <TableRow>
          {COLUMNS.map((c) =>
            c.sortable ? (
              <TableHeaderCell
                key={c.key}
                sortDirection={
                  params.sort === c.key ? (params.order === 'asc' ? 'ascending' : 'descending') : undefined
                }
                onClick={() => onSort(c.key as StaffSortField)}
              >
                {c.label}
              </TableHeaderCell>
            ) : (
              <TableHeaderCell key={c.key}>{c.label}</TableHeaderCell>
            ),
          )}
          <TableHeaderCell className={styles.actionsCol}>
            <span className="visually-hidden">Actions</span>
          </TableHeaderCell>
        </TableRow>
      </TableHeader>
      <TableBody>
        {members.map((m) => (
          <TableRow key={m.id}>
            <TableCell>{m.name}</TableCell>
            <TableCell className={styles.breakAnywhere}>
              {m.email ?? <span className={styles.muted}>—</span>}
            </TableCell>
            <TableCell>
              <span className={styles.skills}>
                {m.skills.length === 0 && <span className={styles.muted}>—</span>}
                {m.skills.map((s) => (
                  <Badge key={s} appearance="tint" color="brand" shape="rounded">
                    {s}
                  </Badge>
                ))}
              </span>
            </TableCell>
            <TableCell>
              {m.contractId ? (
                (contractName.get(m.contractId) ?? 'Unknown')
              ) : (
                <span className={styles.muted}>None</span>
              )}
            </TableCell>
            <TableCell>
              {m.hourlyCost === null ? <span className={styles.muted}>—</span> : money.format(m.hourlyCost)}
            </TableCell>
            <TableCell>
              <Badge appearance="tint" color={m.active ? 'success' : 'informative'} shape="rounded">
                {m.active ? 'Active' : 'Inactive'}
              </Badge>
            </TableCell>
            <TableCell>
              <RowActions
                name={m.name}
                actions={[
                  { label: 'Edit', icon: <EditRegular />, onClick: () => onEdit(m) },
                  { label: 'Remove', icon: <DeleteRegular />, onClick: () => onRemove(m) },
                ]}
              />
            </TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}
