import type { MyRosterShiftDto, ShiftColour } from '@rotaplex/contracts';
import {
  wallClock as wallClockAt,
  type ColouredEvent,
  type ShiftColours,
} from '@/features/planning-board/utils/calendarEvents';

/**
 * The wall-clock time of an instant (ISO 8601) in an IANA zone as "YYYY-MM-DDTHH:mm:ss" (no offset). The
 * calendar runs in UTC and is fed these, so it shows the unit's local times whatever the browser's zone.
 */
export const wallClock = (iso: string, timeZone: string): string => wallClockAt(Date.parse(iso), timeZone);

/** Today's date "YYYY-MM-DD" in a zone. */
export function todayIn(timeZone: string, now: Date = new Date()): string {
  return wallClock(now.toISOString(), timeZone).slice(0, 10);
}

export interface RosterEventProps {
  shift: MyRosterShiftDto;
  /** 0 for my shifts, 1 for colleagues': the calendar's first sort key (`eventOrder`). */
  order: number;
}

export interface RosterEvent extends ColouredEvent<RosterEventProps> {
  classNames: string[];
}

export type ColourTokens = Record<ShiftColour, ShiftColours>;

/**
 * Calendar events of the shifts in one unit's zone: mine first in each slot and marked, colleagues'
 * with their name. `mineClass` and `otherClass` are the style classes for the two kinds.
 */
export function rosterEvents(
  shifts: readonly MyRosterShiftDto[],
  timeZone: string,
  colours: ColourTokens,
  classes: { mine: string; other: string },
): RosterEvent[] {
  return shifts
    .filter((s) => s.timeZone === timeZone)
    .map((s, i) => {
      const c = colours[s.colour];
      return {
        id: `${s.date}-${i}`,
        title: s.mine ? `${s.shiftName} (you)` : `${s.name}: ${s.shiftName}`,
        start: wallClock(s.start, timeZone),
        end: wallClock(s.end, timeZone),
        backgroundColor: c.background,
        borderColor: c.border,
        textColor: c.foreground,
        classNames: [s.mine ? classes.mine : classes.other],
        // `order` puts my shifts first in a day, so "+N more" hides colleagues', never mine.
        extendedProps: { shift: s, order: s.mine ? 0 : 1 },
      };
    })
    .sort((a, b) => Number(b.extendedProps.shift.mine) - Number(a.extendedProps.shift.mine));
}

/** First and last day of a visible range [start, end) given as the calendar's UTC dates. */
export function rangeDays(start: Date, end: Date): { from: string; to: string } {
  const last = new Date(end.getTime() - 86_400_000);
  return { from: start.toISOString().slice(0, 10), to: last.toISOString().slice(0, 10) };
}
