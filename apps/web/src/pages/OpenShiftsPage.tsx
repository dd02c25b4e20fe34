import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { useCan } from '@/features/auth/hooks/useCurrentUser';
import { OPEN_SHIFTS_PAGE_SIZE, openShiftsQuery } from '@/features/swaps/api/swaps.queries';
import { OpenShiftList } from '@/features/swaps/components/OpenShiftList';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { TableSkeleton } from '@/ui/LoadingState';
import { PageHeader } from '@/ui/PageHeader';
import { Pagination } from '@/ui/Pagination';

/** Cover still short on published rosters: staff claim what they can take, managers see it all. */
export function OpenShiftsPage() {
  const canClaim = useCan('requests:own');
  const [page, setPage] = useState(1);
  const open = useQuery(openShiftsQuery(page));
  return (
    <>
      <PageHeader
        title="Open shifts"
        description={
          canClaim
            ? 'Shifts still short of people that you have the skill for and can take without breaking a rule. A manager approves each claim.'
            : 'Shifts of your units still short of people after publishing.'
        }
      />
      {open.error ? <ErrorBanner error={open.error} onRetry={() => void open.refetch()} /> : null}
      {open.isPending ? (
        <TableSkeleton />
      ) : open.data?.items.length ? (
        <>
          <OpenShiftList openShifts={open.data.items} canClaim={canClaim} />
          <Pagination
            label="Open shifts"
            page={page}
            pageSize={OPEN_SHIFTS_PAGE_SIZE}
            total={open.data.total}
            onPageChange={setPage}
          />
        </>
      ) : page > 1 ? (
        <Pagination
          label="Open shifts"
          page={page}
          pageSize={OPEN_SHIFTS_PAGE_SIZE}
          total={open.data?.total ?? 0}
          onPageChange={setPage}
        />
      ) : (
        <EmptyState title="No open shifts">Every published shift you could take is covered.</EmptyState>
      )}
    </>
  );
}
