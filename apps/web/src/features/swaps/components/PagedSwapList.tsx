import { type ReactNode, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { TableSkeleton } from '@/ui/LoadingState';
import { Pagination } from '@/ui/Pagination';
import { SWAPS_PAGE_SIZE, type SwapListFilter, swapsQuery } from '../api/swaps.queries';
import { SwapList } from './SwapList';

export interface PagedSwapListProps {
  filter: SwapListFilter;
  /** Accessible name of the table and its pager. */
  label: string;
  /** Shown when nothing matches. */
  empty: ReactNode;
}

/** One filtered list of swap requests, a server page at a time, newest first. */
export function PagedSwapList({ filter, label, empty }: PagedSwapListProps) {
  const [page, setPage] = useState(1);
  const swaps = useQuery(swapsQuery(filter, page));
  if (swaps.error) return <ErrorBanner error={swaps.error} onRetry={() => void swaps.refetch()} />;
  if (swaps.isPending) return <TableSkeleton />;
  const { items, total } = swaps.data;
  if (total === 0) return <>{empty}</>;
  return (
    <>
      {items.length ? <SwapList swaps={items} label={label} /> : null}
      <Pagination label={label} page={page} pageSize={SWAPS_PAGE_SIZE} total={total} onPageChange={setPage} />
    </>
  );
}
