import type { ReactNode } from 'react';
import { Body1, makeStyles, Subtitle1, tokens } from '@fluentui/react-components';
import {
  CalendarPersonRegular,
  CheckmarkCircleRegular,
  DismissCircleRegular,
  HandOpenHeartRegular,
} from '@fluentui/react-icons';
import { LEAVE_TYPE_LABELS } from '@rotaplex/contracts';
import { useQuery } from '@tanstack/react-query';
import { PATHS } from '@/app/paths';
import { myShiftsQuery } from '@/features/my-roster/api/myRoster.queries';
import { todayIn } from '@/features/my-roster/utils/rosterEvents';
import { nextShifts, shiftWhen } from '@/features/my-roster/utils/agenda';
import { addDays } from '@/features/planning/utils/periodDates';
import { myRequestsQuery } from '@/features/requests/api/requests.queries';
import { openShiftsQuery } from '@/features/swaps/api/swaps.queries';
import { dayLabel } from '@/features/swaps/utils/swapText';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { TableSkeleton } from '@/ui/LoadingState';
import { useSurfaceStyles } from '@/ui/surfaceStyles';
import { WaitingItem } from './WaitingForYou';

const useStyles = makeStyles({
  list: { listStyleType: 'none', margin: 0, padding: 0, display: 'grid', gap: tokens.spacingVerticalS },
});

/** Days ahead the home page looks for the next shifts. */
const AHEAD = 60;

/**
 * What waits for a staff member: their next shifts, answers to their leave requests, and open shifts
 * they may take.
 */
export function YourNextShifts() {
  const styles = useStyles();
  const surface = useSurfaceStyles();
  const today = todayIn('UTC');
  const shifts = useQuery(myShiftsQuery(addDays(today, -1), addDays(today, AHEAD)));
  const requests = useQuery(myRequestsQuery());
  const open = useQuery(openShiftsQuery(1, false, 1));
  const failed = [shifts, requests, open].find((q) => q.isError);
  const next = shifts.data ? nextShifts(shifts.data.shifts, new Date()).slice(0, 3) : [];

  const items: ReactNode[] = next.map((s, i) => (
    <WaitingItem
      key={`${s.date}-${s.start}`}
      to={`${PATHS.myRoster}?date=${s.date}`}
      icon={<CalendarPersonRegular />}
      title={`${i === 0 ? 'Next shift: ' : ''}${shiftWhen(s)}`}
      detail={`${s.shiftName} (${s.shiftCode}), ${s.unitName}`}
    />
  ));
  const decided = (requests.data?.leave ?? [])
    .filter((l) => (l.status === 'approved' || l.status === 'declined') && l.endDate >= today)
    .slice(0, 3);
  for (const l of decided) {
    items.push(
      <WaitingItem
        key={l.id}
        to={PATHS.myRequests}
        icon={l.status === 'approved' ? <CheckmarkCircleRegular /> : <DismissCircleRegular />}
        title={`${LEAVE_TYPE_LABELS[l.type]} ${dayLabel(l.startDate)} to ${dayLabel(l.endDate)}: ${l.status}`}
        detail={l.decisionNote ?? undefined}
      />,
    );
  }
  const pending = (requests.data?.leave ?? []).filter((l) => l.status === 'pending').length;
  if (pending > 0) {
    items.push(
      <WaitingItem
        key="pending"
        to={PATHS.myRequests}
        icon={<CalendarPersonRegular />}
        title={`${pending} leave ${pending === 1 ? 'request waits' : 'requests wait'} for a manager`}
      />,
    );
  }
  const mayTake = open.data?.total ?? 0;
  if (mayTake > 0) {
    items.push(
      <WaitingItem
        key="open"
        to={PATHS.openShifts}
        icon={<HandOpenHeartRegular />}
        title={`${mayTake} open ${mayTake === 1 ? 'shift' : 'shifts'} you may take`}
      />,
    );
  }
  return (
    <section className={surface.panel} aria-labelledby="home-mine">
      <Subtitle1 as="h2" id="home-mine">
        Your shifts and requests
      </Subtitle1>
      {failed?.error ? <ErrorBanner error={failed.error} onRetry={() => void failed.refetch()} /> : null}
      {shifts.isPending ? (
        <TableSkeleton rows={3} label="Reading your next shifts" />
      ) : (
        <>
          {next.length === 0 && <Body1>No published shifts for you in the next {AHEAD} days.</Body1>}
          {items.length > 0 && (
            <ul className={styles.list} aria-label="Your shifts and requests">
              {items}
            </ul>
          )}
        </>
      )}
    </section>
  );
}
