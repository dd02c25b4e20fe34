import { useQuery } from '@tanstack/react-query';
import { useCan } from '@/features/auth/hooks/useCurrentUser';
import { openShiftsQuery } from '@/features/swaps/api/swaps.queries';
import { OpenShiftList } from '@/features/swaps/components/OpenShiftList';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { TableSkeleton } from '@/ui/LoadingState';
import { PageHeader } from '@/ui/PageHeader';

/** Cover still short on published rosters: staff claim what they can take, managers see it all. */
export function OpenShiftsPage() {
  const canClaim = useCan('requests:own');
  const open = useQuery(openShiftsQuery());
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
      ) : open.data?.length ? (
        <OpenShiftList openShifts={open.data} canClaim={canClaim} />
      ) : (
        <EmptyState title="No open shifts">Every published shift you could take is covered.</EmptyState>
      )}
    </>
  );
}
