import { useState } from 'react';
import { makeStyles, Tab, TabList, tokens } from '@fluentui/react-components';
import { CalendarPersonRegular } from '@fluentui/react-icons';
import { useQuery } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import { MyRosterAgenda } from '@/features/my-roster/components/MyRosterAgenda';
import { MyRosterCalendar } from '@/features/my-roster/components/MyRosterCalendar';
import { CalendarFeedPanel } from '@/features/my-roster/components/CalendarFeedPanel';
import { myShiftsQuery } from '@/features/my-roster/api/myRoster.queries';
import { nextShifts } from '@/features/my-roster/utils/agenda';
import { todayIn } from '@/features/my-roster/utils/rosterEvents';
import { addDays } from '@/features/planning/utils/periodDates';
import { useMediaQuery } from '@/hooks/useMediaQuery';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { LoadingState } from '@/ui/LoadingState';
import { PageHeader } from '@/ui/PageHeader';

const useStyles = makeStyles({
  stack: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXL },
});

/** Days ahead the list shows: with yesterday, the 100 days (MY_ROSTER_MAX_DAYS) one read may ask for. */
const AHEAD = 98;

/**
 * My roster: my next shift and my upcoming shifts as a list (the default on a phone), my published
 * shifts and my unit's in a calendar (the default on a wider screen, opened at my next shift), and my
 * calendar feed.
 */
export function MyRosterPage() {
  const styles = useStyles();
  const narrow = useMediaQuery('(max-width: 720px)');
  const today = todayIn('UTC');
  const ahead = useQuery(myShiftsQuery(addDays(today, -1), addDays(today, AHEAD)));
  // ?date=YYYY-MM-DD opens the calendar on that day (links from e-mails and elsewhere).
  const [params] = useSearchParams();
  const date = params.get('date') ?? '';
  const asked = /^\d{4}-\d{2}-\d{2}$/.test(date) && !Number.isNaN(Date.parse(date)) ? date : undefined;
  const [chosen, setChosen] = useState<'list' | 'calendar' | null>(null);
  const view = chosen ?? (narrow && !asked ? 'list' : 'calendar');
  const next = ahead.data ? nextShifts(ahead.data.shifts, new Date())[0] : undefined;
  return (
    <>
      <PageHeader
        title="My roster"
        description="Your published shifts and your team's, in your unit's time zone."
      />
      {ahead.isError ? (
        <ErrorBanner error={ahead.error} onRetry={() => void ahead.refetch()} />
      ) : !ahead.data ? (
        <LoadingState label="Opening your roster…" />
      ) : ahead.data.units.length === 0 ? (
        <EmptyState icon={<CalendarPersonRegular />} title="You are not on a roster">
          Your account is not linked to a staff record of any unit, so there are no shifts to show. A manager
          links people to accounts on the Staff page.
        </EmptyState>
      ) : (
        <div className={styles.stack}>
          <TabList
            aria-label="Roster view"
            selectedValue={view}
            onTabSelect={(_, d) => setChosen(d.value === 'list' ? 'list' : 'calendar')}
          >
            <Tab value="list">My shifts</Tab>
            <Tab value="calendar">Calendar</Tab>
          </TabList>
          {view === 'list' ? (
            <MyRosterAgenda shifts={ahead.data.shifts} now={new Date()} />
          ) : (
            <MyRosterCalendar units={ahead.data.units} initialDate={asked ?? next?.date} />
          )}
          <CalendarFeedPanel />
        </div>
      )}
    </>
  );
}
