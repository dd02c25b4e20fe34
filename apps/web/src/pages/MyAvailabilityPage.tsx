import { useState } from 'react';
import { Field, makeStyles, Select, tokens } from '@fluentui/react-components';
import { DAY_PART_LABELS, DAY_PARTS } from '@rotaplex/contracts';
import { useQuery } from '@tanstack/react-query';
import { myRequestsQuery } from '@/features/requests/api/requests.queries';
import { AvailabilityGrid } from '@/features/requests/components/AvailabilityGrid';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { TableSkeleton } from '@/ui/LoadingState';
import { PageHeader } from '@/ui/PageHeader';

const useStyles = makeStyles({
  stack: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
  parts: { margin: 0, paddingLeft: tokens.spacingHorizontalL },
});

/** Staff: the recurring weekly availability the roster is built around. */
export function MyAvailabilityPage() {
  const styles = useStyles();
  const mine = useQuery(myRequestsQuery());
  const [chosen, setChosen] = useState('');
  const members = mine.data?.staffMembers ?? [];
  const member = members.find((m) => m.id === chosen) ?? members[0];
  return (
    <>
      <PageHeader
        title="My availability"
        description="Your usual week. Unavailable means no shift of that part of the day is given to you; prefer not is a wish the roster tries to honour."
      />
      <div className={styles.stack}>
        <ul className={styles.parts} aria-label="Parts of the day">
          {DAY_PARTS.map((p) => (
            <li key={p}>{DAY_PART_LABELS[p]}: a shift belongs to the part of the day in which it starts.</li>
          ))}
        </ul>
        {mine.error ? <ErrorBanner error={mine.error} onRetry={() => void mine.refetch()} /> : null}
        {mine.isPending ? <TableSkeleton label="Loading" /> : null}
        {mine.data && !member ? (
          <EmptyState title="You are not on a roster yet">
            Ask your manager to add you to a unit's staff.
          </EmptyState>
        ) : null}
        {members.length > 1 && member ? (
          <Field label="Unit">
            <Select value={member.id} onChange={(_, d) => setChosen(d.value)}>
              {members.map((m) => (
                <option key={m.id} value={m.id}>
                  {m.unitName}
                </option>
              ))}
            </Select>
          </Field>
        ) : null}
        {member ? <AvailabilityGrid key={member.id} staffMemberId={member.id} /> : null}
      </div>
    </>
  );
}
