import { makeStyles, Subtitle1, tokens } from '@fluentui/react-components';
import { useCan } from '@/features/auth/hooks/useCurrentUser';
import { PagedSwapList } from '@/features/swaps/components/PagedSwapList';
import { ProposeSwapForm } from '@/features/swaps/components/ProposeSwapForm';
import { EmptyState } from '@/ui/EmptyState';
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
        <PagedSwapList
          filter={{ waitingForMe: true }}
          label="Requests waiting for you"
          empty={<EmptyState title="Nothing waits for you" headingLevel="h3" />}
        />
      </section>
      <section className={styles.section} aria-labelledby="all-title">
        <Subtitle1 as="h2" id="all-title">
          All requests
        </Subtitle1>
        <PagedSwapList
          filter={{}}
          label="All swap requests"
          empty={<EmptyState title="No swap requests yet" headingLevel="h3" />}
        />
      </section>
    </>
  );
}

/** Managers: swaps and open-shift claims waiting for approval, and every request of their units. */
export function SwapApprovalsPage() {
  const styles = useStyles();
  return (
    <>
      <PageHeader
        title="Swap approvals"
        description="Swaps colleagues have agreed and open-shift claims. Approving re-checks the rules and refuses the change if the roster changed since it was asked."
      />
      <section className={styles.section} aria-labelledby="approve-title">
        <Subtitle1 as="h2" id="approve-title">
          Waiting for approval
        </Subtitle1>
        <PagedSwapList
          filter={{ waitingForMe: true }}
          label="Waiting for approval"
          empty={<EmptyState title="Nothing to approve" headingLevel="h3" />}
        />
      </section>
      <section className={styles.section} aria-labelledby="history-title">
        <Subtitle1 as="h2" id="history-title">
          All requests
        </Subtitle1>
        <PagedSwapList filter={{}} label="All swap requests" empty={null} />
      </section>
    </>
  );
}
