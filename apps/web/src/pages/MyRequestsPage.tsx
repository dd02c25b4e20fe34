import { useQuery } from '@tanstack/react-query';
import { myRequestsQuery } from '@/features/requests/api/requests.queries';
import { MyRequestsView } from '@/features/requests/components/MyRequestsView';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { TableSkeleton } from '@/ui/LoadingState';
import { PageHeader } from '@/ui/PageHeader';

/** Staff: date requests (shift on, shift off, day off) and leave, with their status. */
export function MyRequestsPage() {
  const mine = useQuery(myRequestsQuery());
  return (
    <>
      <PageHeader
        title="My requests"
        description="Ask for a shift, a shift off or a day off in the next roster, and request leave. Approved leave keeps you off the roster on those days."
      />
      {mine.error ? <ErrorBanner error={mine.error} onRetry={() => void mine.refetch()} /> : null}
      {mine.isPending ? <TableSkeleton label="Loading your requests" /> : null}
      {mine.data && mine.data.staffMembers.length === 0 ? (
        <EmptyState title="You are not on a roster yet">
          Ask your manager to add you to a unit's staff.
        </EmptyState>
      ) : null}
      {mine.data && mine.data.staffMembers.length > 0 ? <MyRequestsView data={mine.data} /> : null}
    </>
  );
}
