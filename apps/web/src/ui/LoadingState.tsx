import { makeStyles, Skeleton, SkeletonItem, Spinner, tokens } from '@fluentui/react-components';

const useStyles = makeStyles({
  centre: {
    display: 'flex',
    alignItems: 'center',
    justifyContent: 'center',
    padding: tokens.spacingVerticalXXXL,
  },
  full: { minHeight: '100vh' },
  rows: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  row: { display: 'grid', gridTemplateColumns: '2fr 3fr 1fr 1fr', gap: tokens.spacingHorizontalL },
});

export interface LoadingStateProps {
  label?: string;
  fullPage?: boolean;
}

/** A labelled spinner for a page or panel that is loading. */
export function LoadingState({ label = 'Loading…', fullPage = false }: LoadingStateProps) {
  const styles = useStyles();
  return (
    <div className={fullPage ? `${styles.centre} ${styles.full}` : styles.centre}>
      <Spinner label={label} labelPosition="below" />
    </div>
  );
}

/** Placeholder rows while a table loads, so the layout does not jump. */
export function TableSkeleton({ rows = 6, label = 'Loading' }: { rows?: number; label?: string }) {
  const styles = useStyles();
  return (
    <Skeleton aria-label={label} className={styles.rows}>
      {Array.from({ length: rows }, (_, i) => (
        <div key={i} className={styles.row}>
          <SkeletonItem size={16} />
          <SkeletonItem size={16} />
          <SkeletonItem size={16} />
          <SkeletonItem size={16} />
        </div>
      ))}
    </Skeleton>
  );
}
