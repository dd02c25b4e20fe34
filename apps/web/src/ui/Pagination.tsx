import { Button, Caption1, Label, makeStyles, Select, tokens, useId } from '@fluentui/react-components';
import { ChevronLeftRegular, ChevronRightRegular } from '@fluentui/react-icons';
import { pageRange } from './paging';

const useStyles = makeStyles({
  root: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: tokens.spacingHorizontalL,
    paddingTop: tokens.spacingVerticalM,
  },
  group: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalS },
  muted: { color: tokens.colorNeutralForeground3 },
  sizeLabel: { whiteSpace: 'nowrap' },
});

export interface PaginationProps {
  label: string;
  page: number;
  pageSize: number;
  total: number;
  pageSizes?: readonly number[];
  onPageChange: (page: number) => void;
  onPageSizeChange?: (pageSize: number) => void;
}

/** "21–40 of 57" with previous/next and an optional page-size choice. */
export function Pagination({
  label,
  page,
  pageSize,
  total,
  pageSizes,
  onPageChange,
  onPageSizeChange,
}: PaginationProps) {
  const styles = useStyles();
  const sizeId = useId('page-size');
  const { first, last, pages } = pageRange(page, pageSize, total);
  return (
    <nav className={styles.root} aria-label={`${label} pages`}>
      <Caption1 className={styles.muted} aria-live="polite">
        {total === 0 ? 'No results' : `Showing ${first}–${last} of ${total}`}
      </Caption1>
      <div className={styles.group}>
        {pageSizes && onPageSizeChange && (
          <span className={styles.group}>
            <Label htmlFor={sizeId} size="small" className={styles.sizeLabel}>
              Rows per page
            </Label>
            <Select
              id={sizeId}
              size="small"
              value={String(pageSize)}
              onChange={(_, d) => onPageSizeChange(Number(d.value))}
            >
              {pageSizes.map((size) => (
                <option key={size} value={size}>
                  {size}
                </option>
              ))}
            </Select>
          </span>
        )}
        <Button
          size="small"
          icon={<ChevronLeftRegular />}
          disabled={page <= 1}
          onClick={() => onPageChange(page - 1)}
        >
          Previous
        </Button>
        <Caption1>
          Page {Math.min(page, pages)} of {pages}
        </Caption1>
        <Button
          size="small"
          icon={<ChevronRightRegular />}
          iconPosition="after"
          disabled={page >= pages}
          onClick={() => onPageChange(page + 1)}
        >
          Next
        </Button>
      </div>
    </nav>
  );
}
