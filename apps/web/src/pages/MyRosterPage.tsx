import { makeStyles, tokens } from '@fluentui/react-components';
import { CalendarPersonRegular } from '@fluentui/react-icons';
import { useQuery } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import { MyRosterCalendar } from '@/features/my-roster/components/MyRosterCalendar';
import { CalendarFeedPanel } from '@/features/my-roster/components/CalendarFeedPanel';
import { myShiftsQuery } from '@/features/my-roster/api/myRoster.queries';
import { todayIn } from '@/features/my-roster/utils/rosterEvents';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { LoadingState } from '@/ui/LoadingState';
import { PageHeader } from '@/ui/PageHeader';

const useStyles = makeStyles({
  stack: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXL },
});

/** My roster: my published shifts and my unit's in a calendar, and my calendar feed. */
export function MyRosterPage() {
  const styles = useStyles();
  // Today's row tells which units I am on the roster of (the calendar then asks for its own range).
  const today = todayIn('UTC');
  const probe = useQuery(myShiftsQuery(today, today));
  // ?date=YYYY-MM-DD opens the calendar on that day (links from e-mails and elsewhere).
  const [params] = useSearchParams();
  const date = params.get('date') ?? '';
  const initialDate = /^\d{4}-\d{2}-\d{2}$/.test(date) && !Number.isNaN(Date.parse(date)) ? date : undefined;
  return (
    <>
      <PageHeader
        title="My roster"
        description="Your published shifts and your team's, in your unit's time zone."
      />
      {probe.isError ? (
        <ErrorBanner error={probe.error} onRetry={() => void probe.refetch()} />
      ) : !probe.data ? (
        <LoadingState label="Opening your roster…" />
      ) : probe.data.units.length === 0 ? (
        <EmptyState icon={<CalendarPersonRegular />} title="You are not on a roster">
          Your account is not linked to a staff record of any unit, so there are no shifts to show. A manager
          links people to accounts on the Staff page.
        </EmptyState>
      ) : (
        <div className={styles.stack}>
          <MyRosterCalendar units={probe.data.units} initialDate={initialDate} />
          <CalendarFeedPanel />
        </div>
      )}
    </>
  );
}
