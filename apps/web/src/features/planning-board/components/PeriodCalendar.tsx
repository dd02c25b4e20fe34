import { useEffect, useMemo, useRef, useState } from 'react';
import {
  Button,
  Field,
  makeStyles,
  Select,
  Subtitle2,
  Tab,
  TabList,
  tokens,
} from '@fluentui/react-components';
import { ChevronLeftRegular, ChevronRightRegular, PinFilled, WarningFilled } from '@fluentui/react-icons';
import type { DatesSetArg, EventClickArg, EventContentArg, EventMountArg } from '@fullcalendar/core';
import enGbLocale from '@fullcalendar/core/locales/en-gb';
import dayGridPlugin from '@fullcalendar/daygrid';
import interactionPlugin, { type DateClickArg } from '@fullcalendar/interaction';
import FullCalendar from '@fullcalendar/react';
import timeGridPlugin from '@fullcalendar/timegrid';
import type { AssignmentGridDto, RosterPeriodDto, ShiftTypeDto } from '@rotaplex/contracts';
import { SHIFT_COLOUR_TOKENS } from '@/features/planning/utils/shiftColours';
import { addDays, assignmentEvents, wallClock, type AssignmentEventProps } from '../utils/calendarEvents';
import { marksText, type CellMarks } from '../utils/requestMarks';
import { formatDay } from '../utils/days';

export type CalendarLayout = 'week' | 'month';

const VIEW_OF: Record<CalendarLayout, string> = { week: 'timeGridWeek', month: 'dayGridMonth' };
const TIME_FORMAT = { hour: '2-digit', minute: '2-digit', hour12: false } as const;

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  toolbar: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'flex-end',
    justifyContent: 'space-between',
    gap: tokens.spacingHorizontalM,
  },
  nav: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalS },
  title: { minWidth: '14rem', textAlign: 'center' },
  person: { minWidth: '14rem' },
  zone: { color: tokens.colorNeutralForeground3, fontSize: tokens.fontSizeBase200 },
  // FullCalendar 6 injects its own stylesheet and reads these custom properties: point them at the theme.
  calendar: {
    '--fc-border-color': tokens.colorNeutralStroke2,
    '--fc-page-bg-color': tokens.colorNeutralBackground1,
    '--fc-neutral-bg-color': tokens.colorNeutralBackground3,
    '--fc-neutral-text-color': tokens.colorNeutralForeground3,
    '--fc-today-bg-color': tokens.colorBrandBackground2,
    '--fc-highlight-color': tokens.colorBrandBackground2,
    '--fc-non-business-color': tokens.colorNeutralBackgroundDisabled,
    '--fc-now-indicator-color': tokens.colorPaletteRedBorder2,
    '--fc-event-bg-color': tokens.colorBrandBackground,
    '--fc-event-border-color': tokens.colorBrandStroke1,
    '--fc-event-text-color': tokens.colorNeutralForegroundOnBrand,
    '--fc-small-font-size': tokens.fontSizeBase200,
    fontFamily: tokens.fontFamilyBase,
    fontSize: tokens.fontSizeBase200,
    color: tokens.colorNeutralForeground1,
    '& .fc-event': { cursor: 'pointer', borderLeftWidth: tokens.strokeWidthThicker },
    '& .fc-event:focus-visible': { outline: `${tokens.strokeWidthThick} solid ${tokens.colorStrokeFocus2}` },
    '& .fc-col-header-cell-cushion, & .fc-daygrid-day-number': {
      color: tokens.colorNeutralForeground1,
      textDecorationLine: 'none',
    },
    '& .fc-popover': { backgroundColor: tokens.colorNeutralBackground1, boxShadow: tokens.shadow16 },
  },
  event: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: tokens.spacingHorizontalXXS,
    overflow: 'hidden',
    paddingLeft: tokens.spacingHorizontalXXS,
  },
  time: { fontWeight: tokens.fontWeightSemibold },
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
    if (api.view.type !== VIEW_OF[layout] || gotoDate) {
      api.changeView(VIEW_OF[layout], gotoDate ?? undefined);
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
    const label = [
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
    arg.el.setAttribute('role', 'button');
    arg.el.setAttribute('aria-label', label);
    arg.el.setAttribute('title', label);
    arg.el.dataset.cell = `${p.staffMemberId}|${p.date}`;
  };
  const renderEvent = (arg: EventContentArg) => {
    if (arg.event.display === 'background') return <span className={styles.leave}>{arg.event.title}</span>;
    const p = arg.event.extendedProps as AssignmentEventProps;
    return (
      <div className={styles.event}>
        {arg.timeText && <span className={styles.time}>{arg.timeText}</span>}
        <span>{arg.event.title}</span>
        {p.pinned && <PinFilled aria-hidden />}
        {p.flagged && <WarningFilled aria-hidden />}
      </div>
    );
  };

  const people = grid.rows.map((r) => ({ id: r.staffMemberId, name: r.name }));
  const step = (direction: 'prev' | 'next') => {
    const api = ref.current?.getApi();
    if (direction === 'prev') api?.prev();
    else api?.next();
  };

  return (
    <div className={styles.root}>
      <div className={styles.toolbar}>
        <div className={styles.nav}>
          <Button
            icon={<ChevronLeftRegular />}
            aria-label={layout === 'week' ? 'Previous week' : 'Previous month'}
            disabled={!shown || shown.start <= validStartMs}
            onClick={() => step('prev')}
          />
          <Subtitle2 as="h3" className={styles.title} aria-live="polite">
            {shown?.title ?? ''}
          </Subtitle2>
          <Button
            icon={<ChevronRightRegular />}
            aria-label={layout === 'week' ? 'Next week' : 'Next month'}
            disabled={!shown || shown.end >= validEndMs}
            onClick={() => step('next')}
          />
        </div>
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
        <TabList
          size="small"
          aria-label="Calendar layout"
          selectedValue={layout}
          onTabSelect={(_, d) => onLayoutChange(d.value as CalendarLayout)}
        >
          <Tab value="week">Week</Tab>
          <Tab value="month">Month</Tab>
        </TabList>
      </div>
      <span className={styles.zone}>Times are the unit&apos;s local time ({timeZone}).</span>
      <div className={styles.calendar} data-testid="period-calendar">
        <FullCalendar
          ref={ref}
          plugins={[timeGridPlugin, dayGridPlugin, interactionPlugin]}
          locale={enGbLocale}
          timeZone="UTC"
          // "Today" is the unit's today, given in its wall-clock time like every event.
          now={() => wallClock(Date.now(), timeZone)}
          initialView={VIEW_OF[layout]}
          initialDate={period.startDate}
          validRange={{ start: period.startDate, end: validEnd }}
          firstDay={new Date(validStartMs).getUTCDay()}
          headerToolbar={false}
          height="auto"
          allDaySlot={false}
          scrollTime="06:00:00"
          nowIndicator={false}
          eventTimeFormat={TIME_FORMAT}
          slotLabelFormat={TIME_FORMAT}
          displayEventEnd
          fixedWeekCount={false}
          dayMaxEvents={4}
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
      </div>
    </div>
  );
}
