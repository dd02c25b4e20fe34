import {
  type AvailabilityStatus,
  DATE_REQUEST_WEIGHT,
  type DateRequestKind,
  type DayPart,
  dayPartOf,
  PREFER_NOT_WEIGHT,
} from '@rotaplex/contracts';
import { type Absence, type ShiftRequest } from '@rotaplex/roster-model';

/** Requests and absences of a period's people, in the roster model's terms. */
export interface RequestsAndAbsences {
  requests: ShiftRequest[];
  absences: Absence[];
}

/** What the mapping reads: plain rows, so it can be tested without a database. */
export interface StaffInputRows {
  /** dates[d] is day d of the problem ("YYYY-MM-DD"). */
  dates: string[];
  shiftTypes: { id: string; start: string }[];
  /** Person ids of the problem; rows of anyone else are ignored. */
  personIds: string[];
  availability: { staffMemberId: string; weekday: number; part: DayPart; status: AvailabilityStatus }[];
  dateRequests: { staffMemberId: string; date: string; kind: DateRequestKind; shiftTypeId: string | null }[];
  /** APPROVED leave only (the caller filters by status). */
  leave: { staffMemberId: string; startDate: string; endDate: string }[];
}

/**
 * Maps staff input onto the roster model:
 * - approved leave: an absence of kind "leave" for the whole day, on each day of the period inside
 *   its range; on a leave day nothing else of that person counts (availability and date requests
 *   of that day are dropped: leave wins);
 * - availability "unavailable": an absence of kind "unavailable" for the shift types whose start time
 *   lies in that part of the day (see dayPartOf), on each date of that weekday; when it blocks every
 *   shift type of the unit, the absence is for the whole day;
 * - availability "prefer-not": a shift-off request (weight PREFER_NOT_WEIGHT) for each such shift type,
 *   unless the person made a date request for that date (the specific wish replaces the weekly one);
 * - date requests: shift-on, shift-off or day-off requests with weight DATE_REQUEST_WEIGHT.
 * A shift belongs to the day it starts on, so Monday's "night" is the night shift starting on Monday.
 */
export function mapRequestsAndAbsences(rows: StaffInputRows): RequestsAndAbsences {
  const people = new Set(rows.personIds);
  const dayOf = new Map(rows.dates.map((date, d) => [date, d]));
  const absences: Absence[] = [];
  const requests: ShiftRequest[] = [];

  const onLeave = new Set<string>(); // `${personId}|${day}`
  for (const l of rows.leave) {
    if (!people.has(l.staffMemberId)) continue;
    rows.dates.forEach((date, day) => {
      const key = `${l.staffMemberId}|${day}`;
      if (date >= l.startDate && date <= l.endDate && !onLeave.has(key)) {
        onLeave.add(key);
        absences.push({ personId: l.staffMemberId, day, kind: 'leave' });
      }
    });
  }

  const dateRequestDays = new Set<string>();
  for (const r of rows.dateRequests) {
    const day = dayOf.get(r.date);
    if (!people.has(r.staffMemberId) || day === undefined) continue;
    dateRequestDays.add(`${r.staffMemberId}|${day}`);
    if (onLeave.has(`${r.staffMemberId}|${day}`)) continue;
    if (r.kind === 'dayOff') {
      requests.push({ personId: r.staffMemberId, day, kind: 'dayOff', weight: DATE_REQUEST_WEIGHT });
    } else if (r.shiftTypeId) {
      requests.push({
        personId: r.staffMemberId,
        day,
        kind: r.kind,
        shiftTypeId: r.shiftTypeId,
        weight: DATE_REQUEST_WEIGHT,
      });
    }
  }

  const shiftsOfPart = new Map<DayPart, string[]>();
  for (const s of rows.shiftTypes) {
    const part = dayPartOf(s.start);
    shiftsOfPart.set(part, [...(shiftsOfPart.get(part) ?? []), s.id]);
  }
  const byPerson = new Map<string, StaffInputRows['availability']>();
  for (const a of rows.availability) {
    if (!people.has(a.staffMemberId) || a.status === 'available') continue;
    byPerson.set(a.staffMemberId, [...(byPerson.get(a.staffMemberId) ?? []), a]);
  }
  for (const [personId, cells] of byPerson) {
    rows.dates.forEach((date, day) => {
      if (onLeave.has(`${personId}|${day}`)) return;
      const weekday = new Date(`${date}T00:00:00Z`).getUTCDay();
      const today = cells.filter((c) => c.weekday === weekday);
      const blocked = today
        .filter((c) => c.status === 'unavailable')
        .flatMap((c) => shiftsOfPart.get(c.part) ?? []);
      if (blocked.length) {
        absences.push(
          blocked.length === rows.shiftTypes.length
            ? { personId, day, kind: 'unavailable' }
            : { personId, day, kind: 'unavailable', shiftTypeIds: [...blocked].sort() },
        );
      }
      if (dateRequestDays.has(`${personId}|${day}`)) return;
      for (const c of today.filter((x) => x.status === 'prefer-not')) {
        for (const shiftTypeId of shiftsOfPart.get(c.part) ?? []) {
          requests.push({ personId, day, kind: 'shiftOff', shiftTypeId, weight: PREFER_NOT_WEIGHT });
        }
      }
    });
  }
  return { requests, absences };
}
