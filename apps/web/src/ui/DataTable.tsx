import type { ReactNode } from 'react';
import {
  makeStyles,
  Table,
  TableBody,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
  type TableProps,
} from '@fluentui/react-components';
import { TableSkeleton } from './LoadingState';
import { Pagination } from './Pagination';

const useStyles = makeStyles({
  panel: {
    backgroundColor: tokens.colorNeutralBackground1,
    borderRadius: tokens.borderRadiusLarge,
    boxShadow: tokens.shadow2,
    padding: tokens.spacingHorizontalL,
    overflowX: 'auto',
  },
});

/** A white card holding a list page's table (it scrolls sideways on a narrow screen). */
export function TablePanel({ label, children }: { label: string; children: ReactNode }) {
  const styles = useStyles();
  return (
    <section className={styles.panel} aria-label={label}>
      {children}
    </section>
  );
}

export interface DataTableProps {
  /** The table's accessible name. */
  label: string;
  /** Column headings, in order. */
  columns: readonly string[];
  /** Adds a last column for row buttons, whose heading only screen readers hear. */
  actionsColumn?: boolean;
  size?: TableProps['size'];
  /** The rows (`TableRow`s). */
  children: ReactNode;
}

/** A labelled table with a heading row of plain column names and the given rows. */
export function DataTable({ label, columns, actionsColumn = false, size, children }: DataTableProps) {
  return (
    <Table aria-label={label} size={size}>
      <TableHeader>
        <TableRow>
          {columns.map((column) => (
            <TableHeaderCell key={column}>{column}</TableHeaderCell>
          ))}
          {actionsColumn && (
            <TableHeaderCell>
              <span className="visually-hidden">Actions</span>
            </TableHeaderCell>
          )}
        </TableRow>
      </TableHeader>
      <TableBody>{children}</TableBody>
    </Table>
  );
}

/** The part of a TanStack query result a paged table reads. */
export interface PagedResult<T> {
  isPending: boolean;
  data?: { items: T[]; total: number };
}

export interface PagedTableProps<T> extends Omit<DataTableProps, 'children'> {
  result: PagedResult<T>;
  /** Accessible name of the placeholder rows shown while the first page loads. */
  loadingLabel: string;
  /** Shown instead of the table when the list is empty (usually an `EmptyState`). */
  empty: ReactNode;
  page: number;
  pageSize: number;
  onPageChange: (page: number) => void;
  /** Name of the pager (default: the table's label). */
  pagerLabel?: string;
  row: (item: T) => ReactNode;
}

/**
 * A server-paged list: placeholder rows while loading, the empty state when there is nothing, else the
 * table and its pager. Errors are the caller's to show (they usually sit above, with a retry).
 */
export function PagedTable<T>({
  result,
  loadingLabel,
  empty,
  page,
  pageSize,
  onPageChange,
  pagerLabel,
  row,
  ...table
}: PagedTableProps<T>) {
  if (result.isPending) return <TableSkeleton label={loadingLabel} />;
  if (!result.data) return null;
  if (result.data.items.length === 0) return <>{empty}</>;
  return (
    <>
      <DataTable {...table}>{result.data.items.map(row)}</DataTable>
      <Pagination
        label={pagerLabel ?? table.label}
        page={page}
        pageSize={pageSize}
        total={result.data.total}
        onPageChange={onPageChange}
      />
    </>
  );
}
