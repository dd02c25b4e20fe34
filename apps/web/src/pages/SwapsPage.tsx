import { makeStyles, Subtitle1, tokens } from '@fluentui/react-components';
import { useQuery } from '@tanstack/react-query';
import { useCan } from '@/features/auth/hooks/useCurrentUser';
import { swapsQuery } from '@/features/swaps/api/swaps.queries';
import { ProposeSwapForm } from '@/features/swaps/components/ProposeSwapForm';
import { SwapList } from '@/features/swaps/components/SwapList';
import { waitingForMe } from '@/features/swaps/utils/swapText';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { TableSkeleton } from '@/ui/LoadingState';
import { PageHeader } from '@/ui/PageHeader';

const useStyles = makeStyles({
  section: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalM,
    marginBottom: tokens.spacingVerticalXXL,
  },
});

/** Staff: propose swaps and offers, answer colleagues, follow every request to its end. */
export function SwapsPage() {
  const styles = useStyles();
  const canPropose = useCan('requests:own');
  const swaps = useQuery(swapsQuery());
  const waiting = swaps.data ? waitingForMe(swaps.data) : [];
  return (
    <>
      <PageHeader
        title="Swaps"
        description="Swap a published shift with a colleague or offer it to them. Rotaplex checks both rosters against the rules first; your colleague accepts, then a manager approves."
      />
      {canPropose ? (
        <section className={styles.section} aria-labelledby="propose-title">
          <Subtitle1 as="h2" id="propose-title">
            Propose a swap
          </Subtitle1>
          <ProposeSwapForm />
        </section>
      ) : null}
      <section className={styles.section} aria-labelledby="waiting-title">
        <Subtitle1 as="h2" id="waiting-title">
          Waiting for you
        </Subtitle1>
        {waiting.length ? (
          <SwapList swaps={waiting} label="Requests waiting for you" />
        ) : (
          <EmptyState title="Nothing waits for you" headingLevel="h3" />
        )}
      </section>
      <section className={styles.section} aria-labelledby="all-title">
        <Subtitle1 as="h2" id="all-title">
          All requests
        </Subtitle1>
        {swaps.error ? <ErrorBanner error={swaps.error} onRetry={() => void swaps.refetch()} /> : null}
        {swaps.isPending ? (
          <TableSkeleton />
        ) : swaps.data?.length ? (
          <SwapList swaps={swaps.data} label="All swap requests" />
        ) : (
          <EmptyState title="No swap requests yet" headingLevel="h3" />
        )}
      </section>
    </>
  );
}

/** Managers: swaps and open-shift claims waiting for approval, and every request of their units. */
export function SwapApprovalsPage() {
  const styles = useStyles();
  const swaps = useQuery(swapsQuery());
  const waiting = swaps.data?.filter((s) => s.status === 'accepted') ?? [];
  return (
    <>
      <PageHeader
        title="Swap approvals"
        description="Swaps colleagues have agreed and open-shift claims. Approving re-checks the rules and refuses the change if the roster changed since it was asked."
      />
      {swaps.error ? <ErrorBanner error={swaps.error} onRetry={() => void swaps.refetch()} /> : null}
      <section className={styles.section} aria-labelledby="approve-title">
        <Subtitle1 as="h2" id="approve-title">
          Waiting for approval
        </Subtitle1>
        {swaps.isPending ? (
          <TableSkeleton />
        ) : waiting.length ? (
          <SwapList swaps={waiting} label="Waiting for approval" />
        ) : (
          <EmptyState title="Nothing to approve" headingLevel="h3" />
        )}
      </section>
      <section className={styles.section} aria-labelledby="history-title">
        <Subtitle1 as="h2" id="history-title">
          All requests
        </Subtitle1>
        {swaps.data?.length ? <SwapList swaps={swaps.data} label="All swap requests" /> : null}
      </section>
    </>
  );
}
