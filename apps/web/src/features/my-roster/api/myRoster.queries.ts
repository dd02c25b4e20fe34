import { queryOptions } from '@tanstack/react-query';
import { type CalendarFeedDto, MY_ROSTER_ROUTES, type MyRosterDto } from '@rotaplex/contracts';
import { api } from '@/api/client';

export const myRosterKeys = {
  all: ['my-roster'] as const,
  shifts: (from: string, to: string) => [...myRosterKeys.all, 'shifts', from, to] as const,
  feed: () => [...myRosterKeys.all, 'feed'] as const,
};

/** My published shifts and my units' published shifts, for the days from..to. */
export const myShiftsQuery = (from: string, to: string) =>
  queryOptions({
    queryKey: myRosterKeys.shifts(from, to),
    queryFn: ({ signal }) => api.get<MyRosterDto>(MY_ROSTER_ROUTES.myShifts, { from, to }, signal),
    enabled: from !== '' && to !== '',
  });

/** The secret URL of my calendar feed. */
export const calendarFeedQuery = () =>
  queryOptions({
    queryKey: myRosterKeys.feed(),
    queryFn: ({ signal }) => api.get<CalendarFeedDto>(MY_ROSTER_ROUTES.myCalendarFeed, undefined, signal),
  });

export const regenerateCalendarFeed = () =>
  api.post<CalendarFeedDto>(MY_ROSTER_ROUTES.myCalendarFeedRegenerate, undefined);
