import { MessageBar, MessageBarBody, MessageBarTitle } from '@fluentui/react-components';
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { useCan } from '@/features/auth/hooks/useCurrentUser';
import { OPEN_SHIFTS_PAGE_SIZE, openShiftsQuery } from '@/features/swaps/api/swaps.queries';
import { OpenShiftManagerActions } from '@/features/open-shifts/components/OpenShiftManagerActions';
import { OutsideOfferBadge } from '@/features/open-shifts/components/OutsideOfferBadge';
import { OpenShiftList } from '@/features/swaps/components/OpenShiftList';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { TableSkeleton } from '@/ui/LoadingState';
import { PageHeader } from '@/ui/PageHeader';
import { Pagination } from '@/ui/Pagination';

const shifts = (n: number) => `${n} ${n === 1 ? 'shift' : 'shifts'}`;

/**
 * Cover still short on published rosters. Staff see every open shift of their units: those they may
 * take first (with Claim), the others with why not in words; both see which are offered outside the
 * roster. Managers see them all, can e-mail the staff who may take one, see what it would take (which
 * rule for whom) and offer it to bank or agency staff outside the roster.
 */
export function OpenShiftsPage() {
  const canClaim = useCan('requests:own');
  const canNotify = useCan('rosters:plan');
  const [page, setPage] = useState(1);
  const open = useQuery(openShiftsQuery(page, canClaim));
  // Staff: how many of the open shifts this person may take (the total of the plain list).
  const mayTake = useQuery({ ...openShiftsQuery(1, false, 1), enabled: canClaim });
  const total = open.data?.total ?? 0;
  const mine = mayTake.data?.total;
  return (
    <>
      <PageHeader
        title="Open shifts"
        description={
          canClaim
            ? 'Shifts of your units still short of people after publishing. You can claim those you have the skill for and can take without breaking a rule; a manager approves each claim.'
            : 'Shifts of your units still short of people after publishing. Those below the minimum are a safety shortfall: e-mail the staff who may take them; where nobody may, see what it would take and offer the shift to bank or agency staff as local policy says.'
        }
      />
      {open.error ? <ErrorBanner error={open.error} onRetry={() => void open.refetch()} /> : null}
      {canClaim && total > 0 && mine !== undefined && (
        <MessageBar intent={mine > 0 ? 'info' : 'warning'} data-testid="open-shift-summary">
          <MessageBarBody>
            <MessageBarTitle>
              {total === 1 ? '1 shift is open' : `${total} shifts are open`};{' '}
              {mine === 0 ? 'none you may take' : `you may take ${shifts(mine)}`}
            </MessageBarTitle>
            {mine === 0
              ? 'Each shift shows why: a shortfall left on a published roster usually breaks someone’s rule, which is why it was left.'
              : 'The shifts you may take are listed first.'}
          </MessageBarBody>
        </MessageBar>
      )}
      {open.isPending ? (
        <TableSkeleton />
      ) : open.data?.items.length ? (
        <>
          <OpenShiftList
            openShifts={open.data.items}
            canClaim={canClaim}
            canNotify={canNotify}
            renderStatus={(o) => <OutsideOfferBadge offer={o.outsideOffer} />}
            renderActions={
              canNotify && !canClaim ? (o) => <OpenShiftManagerActions openShift={o} /> : undefined
            }
          />
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
        <EmptyState title="No open shifts">
          Every shift on your units’ published rosters is covered.
        </EmptyState>
      )}
    </>
  );
}
