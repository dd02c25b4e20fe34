import { TZDate } from '@date-fns/tz';
import type { AssignmentGridDto, ShiftColour, ShiftTypeDto } from '@rotaplex/contracts';

/**
 * The period's assignments as calendar events, with times in the UNIT's IANA time zone (never the
 * browser's). Shift start and end are wall-clock times in the unit's zone; they are turned into
 * real instants with @date-fns/tz (so a night across a daylight-saving change has its true
 * length), and those instants are written back as the unit's wall-clock time for a calendar that
 * runs in UTC, which has no daylight-saving changes of its own: what the calendar draws at 20:00
 * is 20:00 on the unit's clocks.
 */

const HM = /^([01]\d|2[0-3]):([0-5]\d)$/;
const DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

function parseHm(hm: string): [number, number] {
  const m = HM.exec(hm);
  if (!m) throw new Error(`Time "${hm}" is not in HH:mm 24-hour form`);
  return [Number(m[1]), Number(m[2])];
}

function parseDate(date: string): [number, number, number] {
  const m = DATE.exec(date);
  if (!m) throw new Error(`Date "${date}" is not in YYYY-MM-DD form`);
  return [Number(m[1]), Number(m[2]), Number(m[3])];
}

/** Real start and end (epoch ms) of a shift worked on `date`; an end not after the start is the next day. */
export function shiftInstants(
  date: string,
  shift: Pick<ShiftTypeDto, 'start' | 'end'>,
  timeZone: string,
): { start: number; end: number } {
  const [year, month, day] = parseDate(date);
  const [sh, sm] = parseHm(shift.start);
  const [eh, em] = parseHm(shift.end);
  const endDay = eh * 60 + em <= sh * 60 + sm ? day + 1 : day;
  return {
    start: new TZDate(year, month - 1, day, sh, sm, timeZone).getTime(),
    end: new TZDate(year, month - 1, endDay, eh, em, timeZone).getTime(),
  };
}

const pad = (n: number) => String(n).padStart(2, '0');

/** The wall-clock time "YYYY-MM-DDTHH:mm:ss" (no offset) that clocks in `timeZone` show at `instant`. */
export function wallClock(instant: number, timeZone: string): string {
  const d = new TZDate(instant, timeZone);
  return (
    `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}` +
    `T${pad(d.getHours())}:${pad(d.getMinutes())}:${pad(d.getSeconds())}`
  );
}

/** The day after a "YYYY-MM-DD" date, `days` later. */
export function addDays(date: string, days: number): string {
  const [year, month, day] = parseDate(date);
  return new Date(Date.UTC(year, month - 1, day + days)).toISOString().slice(0, 10);
}

export interface ShiftColours {
  background: string;
  foreground: string;
  border: string;
}

export interface AssignmentEventProps {
  staffMemberId: string;
  name: string;
  /** The roster day the shift belongs to (a night started on it may end the next day). */
  date: string;
  shiftTypeId: string;
  code: string;
  shiftName: string;
  pinned: boolean;
  flagged: boolean;
  /** Real instants, ISO 8601 in UTC. */
  startUtc: string;
  endUtc: string;
  /** Real length in minutes (differs from the wall-clock length across a daylight-saving change). */
  minutes: number;
}

/** An event in a shift's colours, in the shape FullCalendar's `EventInput` accepts (kept free of its types). */
export interface ColouredEvent<Props> {
  id: string;
  title: string;
  /** Unit wall-clock "YYYY-MM-DDTHH:mm:ss", read by a calendar in the UTC time zone. */
  start: string;
  end: string;
  backgroundColor: string;
  borderColor: string;
  textColor: string;
  extendedProps: Props;
}

/** One assignment's event. */
export type AssignmentEvent = ColouredEvent<AssignmentEventProps>;

/** Id of the event of one cell: "staffMemberId|date". */
export const eventId = (staffMemberId: string, date: string) => `${staffMemberId}|${date}`;

/**
 * One event per worked cell of the grid: "person · code" in the shift type's palette colour, from
 * the shift's start to its end in the unit's time zone. Days off and cells whose shift type is
 * unknown make no event.
 */
export function assignmentEvents(
  grid: AssignmentGridDto,
  shiftTypes: Map<string, ShiftTypeDto>,
  timeZone: string,
  colours: Record<ShiftColour, ShiftColours>,
  flagged: Set<string> = new Set(),
): AssignmentEvent[] {
  const events: AssignmentEvent[] = [];
  for (const row of grid.rows) {
    row.cells.forEach((cell, i) => {
      const shift = cell.shiftTypeId ? shiftTypes.get(cell.shiftTypeId) : undefined;
      const date = grid.dates[i];
      if (!shift || date === undefined) return;
      const { start, end } = shiftInstants(date, shift, timeZone);
      const colour = colours[shift.colour];
      const id = eventId(row.staffMemberId, date);
      events.push({
        id,
        title: `${row.name} · ${shift.code}`,
        start: wallClock(start, timeZone),
        end: wallClock(end, timeZone),
        backgroundColor: colour.background,
        borderColor: colour.border,
        textColor: colour.foreground,
        extendedProps: {
          staffMemberId: row.staffMemberId,
          name: row.name,
          date,
          shiftTypeId: shift.id,
          code: shift.code,
          shiftName: shift.name,
          pinned: cell.pinned,
          flagged: flagged.has(id),
          startUtc: new Date(start).toISOString(),
          endUtc: new Date(end).toISOString(),
          minutes: Math.round((end - start) / 60_000),
        },
      });
    });
  }
  return events;
}
