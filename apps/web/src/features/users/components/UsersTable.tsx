import {
  Avatar,
  Caption1,
  makeStyles,
  Table,
  TableBody,
  TableCell,
  TableCellLayout,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import type { UnitDto, UserDto } from '@rotaplex/contracts';
import { ROLE_LABELS } from '@/features/auth/roleText';
import type { UserSortField, UsersListParams } from '@/features/users/usersListParams';
import { UserActionsMenu, type UserAction } from './UserActionsMenu';
import { UserStatusBadge } from './UserStatusBadge';

const useStyles = makeStyles({
  wrap: { overflowX: 'auto' },
  table: { minWidth: '48rem' },
  muted: { color: tokens.colorNeutralForeground3 },
  actionsCol: { width: '3.5rem' },
  displayName: { width: '24%' },
  email: { width: '30%' },
  role: { width: '11%' },
  units: { width: '22%' },
  active: { width: '13%' },
  breakAnywhere: { overflowWrap: 'anywhere' },
});

const COLUMNS: { key: Exclude<UserSortField, 'createdAt'> | 'units'; label: string; sortable: boolean }[] = [
  { key: 'displayName', label: 'Name', sortable: true },
  { key: 'email', label: 'E-mail', sortable: true },
  { key: 'role', label: 'Role', sortable: true },
  { key: 'units', label: 'Units', sortable: false },
  { key: 'active', label: 'Status', sortable: true },
];

export interface UsersTableProps {
  users: readonly UserDto[];
  units: readonly UnitDto[];
  params: UsersListParams;
  currentUserId: string;
  canWrite: boolean;
  onSort: (field: UserSortField) => void;
  onAction: (action: UserAction, user: UserDto) => void;
}

export function UsersTable({
  users,
  units,
  params,
  currentUserId,
  canWrite,
  onSort,
  onAction,
}: UsersTableProps) {
  const styles = useStyles();
  const unitName = new Map(units.map((u) => [u.id, u.name]));
  return (
    <div className={styles.wrap}>
      <Table sortable aria-label="People" className={styles.table}>
        <TableHeader>
          <TableRow>
            {COLUMNS.map((column) =>
              column.sortable ? (
                <TableHeaderCell
                  key={column.key}
                  className={styles[column.key]}
                  sortDirection={
                    params.sort === column.key
                      ? params.order === 'asc'
                        ? 'ascending'
                        : 'descending'
                      : undefined
                  }
                  onClick={() => onSort(column.key as UserSortField)}
                >
                  {column.label}
                </TableHeaderCell>
              ) : (
                <TableHeaderCell key={column.key} className={styles[column.key]}>
                  {column.label}
                </TableHeaderCell>
              ),
            )}
            {canWrite && (
              <TableHeaderCell className={styles.actionsCol}>
                <span className="visually-hidden">Actions</span>
              </TableHeaderCell>
            )}
          </TableRow>
        </TableHeader>
        <TableBody>
          {users.map((user) => (
            <TableRow key={user.id}>
              <TableCell>
                <TableCellLayout
                  media={<Avatar name={user.displayName} size={28} color="colorful" aria-hidden />}
                >
                  {user.displayName}
                  {user.id === currentUserId && <Caption1 className={styles.muted}> (you)</Caption1>}
                </TableCellLayout>
              </TableCell>
              <TableCell className={styles.breakAnywhere}>{user.email}</TableCell>
              <TableCell>{ROLE_LABELS[user.role]}</TableCell>
              <TableCell>
                {user.unitIds.length === 0 ? (
                  <span className={styles.muted}>—</span>
                ) : (
                  user.unitIds.map((id) => unitName.get(id) ?? 'Unknown unit').join(', ')
                )}
              </TableCell>
              <TableCell>
                <UserStatusBadge user={user} />
              </TableCell>
              {canWrite && (
                <TableCell>
                  <UserActionsMenu user={user} isSelf={user.id === currentUserId} onAction={onAction} />
                </TableCell>
              )}
            </TableRow>
          ))}
        </TableBody>
      </Table>
    </div>
  );
}
