import { type ShiftColour } from './planning';

/**
 * My roster: a person's published shifts and their unit's published shifts, and the personal
 * iCalendar feed (RFC 5545). Plain types, route paths and limits shared by the API and the web app.
 */

/** One published shift. Colleagues' shifts carry only their name and the shift, nothing else. */
export interface MyRosterShiftDto {
  /** Whether the shift is the caller's own. */
  mine: boolean;
  /** The person working it (the caller's own name for their shifts). */
  name: string;
  unitId: string;
  unitName: string;
  /** The unit's IANA time zone; start and end are instants, shown in this zone. */
  timeZone: string;
  /** Day of the roster the shift belongs to, "YYYY-MM-DD" in the unit's zone. */
  date: string;
  shiftCode: string;
  shiftName: string;
  colour: ShiftColour;
  /** ISO 8601 UTC instants. */
  start: string;
  end: string;
}

export interface MyRosterUnitDto {
  unitId: string;
  unitName: string;
  timeZone: string;
}

export interface MyRosterDto {
  /** First and last day asked for, "YYYY-MM-DD". */
  from: string;
  to: string;
  /** Units the caller is on the roster of (empty: the caller has no staff record). */
  units: MyRosterUnitDto[];
  /** Shifts whose day lies in [from, to], ordered by start. */
  shifts: MyRosterShiftDto[];
}

export interface MyRosterQuery {
  from: string;
  to: string;
}

/** Longest range one GET /me/shifts may ask for, in days. */
export const MY_ROSTER_MAX_DAYS = 100;

export interface CalendarFeedDto {
  /** The secret feed URL: works without sign-in, stops working once regenerated. */
  url: string;
}

const e = encodeURIComponent;

/** Paths of the my-roster resources, relative to API_PREFIX. */
export const MY_ROSTER_ROUTES = {
  myShifts: '/me/shifts',
  myCalendarFeed: '/me/calendar-feed',
  myCalendarFeedRegenerate: '/me/calendar-feed/regenerate',
  /** The public feed itself (token from the URL that GET myCalendarFeed returns). */
  calendarFeed: (token: string) => `/calendar-feeds/${e(token)}.ics`,
} as const;
