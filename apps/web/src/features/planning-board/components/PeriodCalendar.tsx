import { useEffect, useMemo, useRef, useState } from 'react';
import { Field, makeStyles, Select, tokens } from '@fluentui/react-components';
import { PinFilled, WarningFilled } from '@fluentui/react-icons';
import type { DatesSetArg, EventClickArg, EventContentArg, EventMountArg } from '@fullcalendar/core';
import interactionPlugin, { type DateClickArg } from '@fullcalendar/interaction';
import type FullCalendar from '@fullcalendar/react';
import type { AssignmentGridDto, RosterPeriodDto, ShiftTypeDto } from '@rotaplex/contracts';
import { SHIFT_COLOUR_TOKENS } from '@/features/planning/utils/shiftColours';
import {
  CALENDAR_VIEW,
  CalendarColumn,
  CalendarEventFace,
  CalendarToolbar,
  labelEvent,
  ShiftCalendar,
  type CalendarLayout,
} from '@/ui/ShiftCalendar';
import { addDays, assignmentEvents, wallClock, type AssignmentEventProps } from '../utils/calendarEvents';
import { marksText, type CellMarks } from '../utils/requestMarks';
import { formatDay } from '../utils/days';

export type { CalendarLayout };

const useStyles = makeStyles({
  person: { minWidth: '14rem' },
  zone: { color: tokens.colorNeutralForeground3, fontSize: tokens.fontSizeBase200 },
  calendar: { '& .fc-event': { borderLeftWidth: tokens.strokeWidthThicker } },
  leave: { color: tokens.colorNeutralForeground2, padding: tokens.spacingHorizontalXS },
  flagged: { outline: `${tokens.strokeWidthThick} solid ${tokens.colorPaletteRedBorder2}` },
});

export interface PeriodCalendarProps {
  period: RosterPeriodDto;
  grid: AssignmentGridDto;
  shiftTypes: Map<string, ShiftTypeDto>;
  /** "staffMemberId|date" of cells with a rule finding. */
  flagged: Set<string>;
  /** The unit's IANA time zone: every time shown is the unit's wall-clock time. */
  timeZone: string;
  layout: CalendarLayout;
  onLayoutChange: (layout: CalendarLayout) => void;
  /** Only this person's shifts, or everyone's when null. */
  staffMemberId: string | null;
  onStaffMemberChange: (staffMemberId: string | null) => void;
  onOpenCell: (staffMemberId: string, date: string) => void;
  /** Date requests and leave per "staffMemberId|date": leave shades the selected person's days. */
  marks?: Map<string, CellMarks>;
}

/**
 * The roster period as a calendar (FullCalendar: a week with hours, or a month), one event per
 * assignment in the shift type's colour. FullCalendar runs in UTC and is fed the unit's wall-clock
 * times, so it shows the unit's local times whatever the browser's zone (see calendarEvents.ts).
 */
export function PeriodCalendar({
  period,
  grid,
  shiftTypes,
  flagged,
  timeZone,
  layout,
  onLayoutChange,
  staffMemberId,
  onStaffMemberChange,
  onOpenCell,
  marks,
}: PeriodCalendarProps) {
  const styles = useStyles();
  const ref = useRef<FullCalendar>(null);
  const [shown, setShown] = useState<{ title: string; start: number; end: number } | null>(null);
  const [gotoDate, setGotoDate] = useState<string | null>(null);
  const validEnd = addDays(period.startDate, period.days);
  const validStartMs = Date.parse(`${period.startDate}T00:00:00Z`);
  const validEndMs = Date.parse(`${validEnd}T00:00:00Z`);

  const shiftCodes = useMemo(
    () => new Map([...shiftTypes.values()].map((s) => [s.id, s.code])),
    [shiftTypes],
  );
  const events = useMemo(() => {
    const all = assignmentEvents(grid, shiftTypes, timeZone, SHIFT_COLOUR_TOKENS, flagged);
    if (!staffMemberId) return all;
    // One person's shifts, with their leave days shaded behind them.
    const leaveDays = grid.dates.flatMap((date) => {
      const leave = marks?.get(`${staffMemberId}|${date}`)?.leave;
      return leave
        ? [
            {
              id: `leave|${date}`,
              start: `${date}T00:00:00`,
              end: `${addDays(date, 1)}T00:00:00`,
              display: 'background',
              title: marksText({ leave, requests: [] }, shiftCodes)[0],
              backgroundColor: tokens.colorNeutralBackground5,
            },
          ]
        : [];
    });
    return [...all.filter((e) => e.extendedProps.staffMemberId === staffMemberId), ...leaveDays];
  }, [grid, shiftTypes, timeZone, flagged, staffMemberId, marks, shiftCodes]);

  // FullCalendar reads `initialView` once; later layout changes go through its API.
  useEffect(() => {
    const api = ref.current?.getApi();
    if (!api) return;
    if (api.view.type !== CALENDAR_VIEW[layout] || gotoDate) {
      api.changeView(CALENDAR_VIEW[layout], gotoDate ?? undefined);
      setGotoDate(null);
    }
  }, [layout, gotoDate]);

  const handleDatesSet = (arg: DatesSetArg) =>
    setShown({
      title: arg.view.title,
      start: arg.view.currentStart.getTime(),
      end: arg.view.currentEnd.getTime(),
    });
  const handleEventClick = (arg: EventClickArg) => {
    arg.jsEvent.preventDefault();
    const props = arg.event.extendedProps as AssignmentEventProps;
    onOpenCell(props.staffMemberId, props.date);
  };
  // A day of the month opens that day's week with hours.
  const handleDateClick = (arg: DateClickArg) => {
    if (layout !== 'month') return;
    setGotoDate(arg.dateStr.slice(0, 10));
    onLayoutChange('week');
  };
  const handleEventMount = (arg: EventMountArg) => {
    if (arg.event.display === 'background') return;
    const p = arg.event.extendedProps as AssignmentEventProps;
    const start = arg.event.startStr.slice(11, 16);
    const end = arg.event.endStr.slice(11, 16);
    // The name starts with the words the event shows (WCAG 2.5.3, label in name), then says whose
    // shift it is and when.
    const label = [
      `${shownTime(arg.event)} ${arg.event.title}`.trim(),
      p.name,
      formatDay(p.date),
      `${p.code} ${p.shiftName}`,
      `${start} to ${end}`,
      p.pinned ? 'pinned' : '',
      p.flagged ? 'has a rule finding' : '',
      ...marksText(marks?.get(`${p.staffMemberId}|${p.date}`), shiftCodes),
    ]
      .filter(Boolean)
      .join(', ');
    labelEvent(arg.el, label);
    arg.el.dataset.cell = `${p.staffMemberId}|${p.date}`;
  };
  const renderEvent = (arg: EventContentArg) => {
    if (arg.event.display === 'background') return <span className={styles.leave}>{arg.event.title}</span>;
    const p = arg.event.extendedProps as AssignmentEventProps;
    return (
      <CalendarEventFace timeText={shownTime(arg.event)} title={arg.event.title}>
        {p.pinned && <PinFilled aria-hidden />}
        {p.flagged && <WarningFilled aria-hidden />}
      </CalendarEventFace>
    );
  };

  const people = grid.rows.map((r) => ({ id: r.staffMemberId, name: r.name }));
  const step = (direction: 'prev' | 'next') => {
    const api = ref.current?.getApi();
    if (direction === 'prev') api?.prev();
    else api?.next();
  };

  return (
    <CalendarColumn>
      <CalendarToolbar
        layout={layout}
        onLayoutChange={onLayoutChange}
        title={shown?.title ?? ''}
        titleAs="h3"
        onStep={step}
        prevDisabled={!shown || shown.start <= validStartMs}
        nextDisabled={!shown || shown.end >= validEndMs}
      >
        <Field label="Person">
          <Select
            className={styles.person}
            value={staffMemberId ?? ''}
            onChange={(_, d) => onStaffMemberChange(d.value || null)}
          >
            <option value="">Everyone</option>
            {people.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name}
              </option>
            ))}
          </Select>
        </Field>
      </CalendarToolbar>
      <span className={styles.zone}>Times are the unit&apos;s local time ({timeZone}).</span>
      <ShiftCalendar
        calendarRef={ref}
        testId="period-calendar"
        className={styles.calendar}
        extraPlugins={[interactionPlugin]}
        // "Today" is the unit's today, given in its wall-clock time like every event.
        now={() => wallClock(Date.now(), timeZone)}
        initialView={CALENDAR_VIEW[layout]}
        initialDate={period.startDate}
        validRange={{ start: period.startDate, end: validEnd }}
        firstDay={new Date(validStartMs).getUTCDay()}
        fixedWeekCount={false}
        eventMaxStack={6}
        events={events}
        eventContent={renderEvent}
        eventClassNames={(arg) =>
          (arg.event.extendedProps as AssignmentEventProps).flagged ? [styles.flagged] : []
        }
        eventDidMount={handleEventMount}
        eventClick={handleEventClick}
        dateClick={handleDateClick}
        datesSet={handleDatesSet}
      />
    </CalendarColumn>
  );
}

/**
 * The whole shift's times on its face, also on each piece of a night drawn on two days (the week
 * view cuts an event at midnight and would show "22:00 - 00:00").
 */
function shownTime(event: { startStr: string; endStr: string }): string {
  const start = event.startStr.slice(11, 16);
  const end = event.endStr.slice(11, 16);
  return start && end ? `${start} - ${end}` : start;
}
