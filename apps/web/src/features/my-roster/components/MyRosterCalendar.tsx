import { useEffect, useMemo, useRef, useState } from 'react';
import {
  Button,
  Field,
  makeStyles,
  Select,
  Spinner,
  Subtitle2,
  Tab,
  TabList,
  tokens,
} from '@fluentui/react-components';
import { ChevronLeftRegular, ChevronRightRegular } from '@fluentui/react-icons';
import type { DatesSetArg, EventClickArg, EventContentArg, EventMountArg } from '@fullcalendar/core';
import enGbLocale from '@fullcalendar/core/locales/en-gb';
import dayGridPlugin from '@fullcalendar/daygrid';
import FullCalendar from '@fullcalendar/react';
import timeGridPlugin from '@fullcalendar/timegrid';
import type { MyRosterShiftDto, MyRosterUnitDto } from '@rotaplex/contracts';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { SHIFT_COLOUR_TOKENS } from '@/features/planning/utils/shiftColours';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { myShiftsQuery } from '../api/myRoster.queries';
import { rangeDays, rosterEvents, type RosterEventProps, todayIn } from '../utils/rosterEvents';
import { ShiftDetailsDialog } from './ShiftDetailsDialog';

export type RosterLayout = 'week' | 'month';

const VIEW_OF: Record<RosterLayout, string> = { week: 'timeGridWeek', month: 'dayGridMonth' };
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
  zone: {
    display: 'flex',
    alignItems: 'center',
    gap: tokens.spacingHorizontalS,
    color: tokens.colorNeutralForeground3,
    fontSize: tokens.fontSizeBase200,
  },
  // FullCalendar 6 injects its own stylesheet and reads these custom properties: point them at the theme.
  calendar: {
    '--fc-border-color': tokens.colorNeutralStroke2,
    '--fc-page-bg-color': tokens.colorNeutralBackground1,
    '--fc-neutral-bg-color': tokens.colorNeutralBackground3,
    '--fc-neutral-text-color': tokens.colorNeutralForeground3,
    '--fc-today-bg-color': tokens.colorBrandBackground2,
    '--fc-event-bg-color': tokens.colorBrandBackground,
    '--fc-event-border-color': tokens.colorBrandStroke1,
    '--fc-event-text-color': tokens.colorNeutralForegroundOnBrand,
    '--fc-small-font-size': tokens.fontSizeBase200,
    fontFamily: tokens.fontFamilyBase,
    fontSize: tokens.fontSizeBase200,
    color: tokens.colorNeutralForeground1,
    '& .fc-event': { cursor: 'pointer' },
    '& .fc-event:focus-visible': { outline: `${tokens.strokeWidthThick} solid ${tokens.colorStrokeFocus2}` },
    '& .fc-col-header-cell-cushion, & .fc-daygrid-day-number': {
      color: tokens.colorNeutralForeground1,
      textDecorationLine: 'none',
    },
    '& .fc-popover': { backgroundColor: tokens.colorNeutralBackground1, boxShadow: tokens.shadow16 },
  },
  // Mine: a strong edge and bold text; colleagues': faded, so my own shifts stand out.
  mine: {
    borderLeftWidth: tokens.strokeWidthThickest,
    fontWeight: tokens.fontWeightSemibold,
    boxShadow: tokens.shadow4,
  },
  other: { opacity: 0.7 },
  event: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: tokens.spacingHorizontalXXS,
    overflow: 'hidden',
    paddingLeft: tokens.spacingHorizontalXXS,
  },
  time: { fontWeight: tokens.fontWeightSemibold },
});

export interface MyRosterCalendarProps {
  /** Units the caller is on the roster of; the calendar shows one unit's zone at a time. */
  units: MyRosterUnitDto[];
  /** Day to open on, "YYYY-MM-DD" (default: today in the unit's zone). */
  initialDate?: string;
}

/**
 * My shifts and my unit's published shifts in a FullCalendar week (with hours) or month, in the
 * unit's time zone whatever the browser's: FullCalendar runs in UTC and gets the unit's wall-clock
 * times. My shifts are highlighted; a click opens the shift's details.
 */
export function MyRosterCalendar({ units, initialDate }: MyRosterCalendarProps) {
  const styles = useStyles();
  const ref = useRef<FullCalendar>(null);
  const [layout, setLayout] = useState<RosterLayout>('week');
  const [unitId, setUnitId] = useState(units[0]?.unitId ?? '');
  const unit = units.find((u) => u.unitId === unitId) ?? units[0];
  const timeZone = unit?.timeZone ?? 'UTC';
  const [range, setRange] = useState<{ from: string; to: string; title: string } | null>(null);
  const [open, setOpen] = useState<MyRosterShiftDto | null>(null);
  const shifts = useQuery({
    ...myShiftsQuery(range?.from ?? '', range?.to ?? ''),
    placeholderData: keepPreviousData,
  });

  const events = useMemo(
    () =>
      rosterEvents(
        (shifts.data?.shifts ?? []).filter((s) => s.unitId === unit?.unitId),
        timeZone,
        SHIFT_COLOUR_TOKENS,
        { mine: styles.mine, other: styles.other },
      ),
    [shifts.data, unit?.unitId, timeZone, styles.mine, styles.other],
  );

  // FullCalendar reads `initialView` once; later layout changes go through its API.
  useEffect(() => {
    const api = ref.current?.getApi();
    if (api && api.view.type !== VIEW_OF[layout]) api.changeView(VIEW_OF[layout]);
  }, [layout]);

  const handleDatesSet = (arg: DatesSetArg) =>
    setRange({ ...rangeDays(arg.view.activeStart, arg.view.activeEnd), title: arg.view.title });
  const handleEventClick = (arg: EventClickArg) => {
    arg.jsEvent.preventDefault();
    setOpen((arg.event.extendedProps as RosterEventProps).shift);
  };
  const handleEventMount = (arg: EventMountArg) => {
    const s = (arg.event.extendedProps as RosterEventProps).shift;
    const label = [
      s.mine ? 'Your shift' : s.name,
      `${s.shiftName} (${s.shiftCode})`,
      `${arg.event.startStr.slice(0, 10)} ${arg.event.startStr.slice(11, 16)} to ${arg.event.endStr.slice(11, 16)}`,
    ].join(', ');
    arg.el.setAttribute('role', 'button');
    arg.el.setAttribute('aria-label', label);
    arg.el.setAttribute('title', label);
    arg.el.dataset.mine = String(s.mine);
  };
  const renderEvent = (arg: EventContentArg) => (
    <div className={styles.event}>
      {arg.timeText && <span className={styles.time}>{arg.timeText}</span>}
      <span>{arg.event.title}</span>
    </div>
  );
  const step = (action: 'prev' | 'next' | 'today') => {
    const api = ref.current?.getApi();
    if (!api) return;
    if (action === 'today') api.gotoDate(todayIn(timeZone));
    else if (action === 'prev') api.prev();
    else api.next();
  };

  return (
    <div className={styles.root}>
      <div className={styles.toolbar}>
        <div className={styles.nav}>
          <Button
            icon={<ChevronLeftRegular />}
            aria-label={layout === 'week' ? 'Previous week' : 'Previous month'}
            onClick={() => step('prev')}
          />
          <Subtitle2 as="h2" className={styles.title} aria-live="polite">
            {range?.title ?? ''}
          </Subtitle2>
          <Button
            icon={<ChevronRightRegular />}
            aria-label={layout === 'week' ? 'Next week' : 'Next month'}
            onClick={() => step('next')}
          />
          <Button onClick={() => step('today')}>Today</Button>
        </div>
        {units.length > 1 && (
          <Field label="Unit">
            <Select value={unit?.unitId ?? ''} onChange={(_, d) => setUnitId(d.value)}>
              {units.map((u) => (
                <option key={u.unitId} value={u.unitId}>
                  {u.unitName}
                </option>
              ))}
            </Select>
          </Field>
        )}
        <TabList
          size="small"
          aria-label="Calendar layout"
          selectedValue={layout}
          onTabSelect={(_, d) => setLayout(d.value as RosterLayout)}
        >
          <Tab value="week">Week</Tab>
          <Tab value="month">Month</Tab>
        </TabList>
      </div>
      <span className={styles.zone}>
        Times are {unit ? `${unit.unitName}'s` : 'the unit’s'} local time ({timeZone}). Your shifts are
        highlighted; only published rosters show.
        {shifts.isFetching && <Spinner size="extra-tiny" aria-label="Loading shifts" />}
      </span>
      <ErrorBanner error={shifts.error} onRetry={() => void shifts.refetch()} />
      <div className={styles.calendar} data-testid="my-roster-calendar">
        <FullCalendar
          key={timeZone}
          ref={ref}
          plugins={[timeGridPlugin, dayGridPlugin]}
          locale={enGbLocale}
          timeZone="UTC"
          initialView={VIEW_OF[layout]}
          initialDate={initialDate ?? todayIn(timeZone)}
          headerToolbar={false}
          height="auto"
          allDaySlot={false}
          scrollTime="06:00:00"
          nowIndicator={false}
          eventTimeFormat={TIME_FORMAT}
          slotLabelFormat={TIME_FORMAT}
          displayEventEnd
          eventDisplay="block"
          dayMaxEvents={4}
          eventMaxStack={4}
          events={events}
          eventContent={renderEvent}
          eventDidMount={handleEventMount}
          eventClick={handleEventClick}
          datesSet={handleDatesSet}
        />
      </div>
      {open && <ShiftDetailsDialog shift={open} onClose={() => setOpen(null)} />}
    </div>
  );
}
