import { useEffect, useMemo, useRef, useState } from 'react';
import { Button, Field, makeStyles, Select, Spinner, tokens } from '@fluentui/react-components';
import type { DatesSetArg, EventClickArg, EventContentArg, EventMountArg } from '@fullcalendar/core';
import type FullCalendar from '@fullcalendar/react';
import type { MyRosterShiftDto, MyRosterUnitDto } from '@rotaplex/contracts';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { SHIFT_COLOUR_TOKENS } from '@/features/planning/utils/shiftColours';
import { ErrorBanner } from '@/ui/ErrorBanner';
import {
  CALENDAR_VIEW,
  CalendarColumn,
  CalendarEventFace,
  CalendarToolbar,
  labelEvent,
  ShiftCalendar,
  type CalendarLayout,
} from '@/ui/ShiftCalendar';
import { myShiftsQuery } from '../api/myRoster.queries';
import { rangeDays, rosterEvents, type RosterEventProps, todayIn } from '../utils/rosterEvents';
import { ShiftDetailsDialog } from './ShiftDetailsDialog';

const useStyles = makeStyles({
  zone: {
    display: 'flex',
    alignItems: 'center',
    gap: tokens.spacingHorizontalS,
    color: tokens.colorNeutralForeground3,
    fontSize: tokens.fontSizeBase200,
  },
  // Mine: a strong edge and bold text; colleagues': faded, so my own shifts stand out.
  mine: {
    borderLeftWidth: tokens.strokeWidthThickest,
    fontWeight: tokens.fontWeightSemibold,
    boxShadow: tokens.shadow4,
  },
  other: { opacity: 0.7 },
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
  const [layout, setLayout] = useState<CalendarLayout>('week');
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
    if (api && api.view.type !== CALENDAR_VIEW[layout]) api.changeView(CALENDAR_VIEW[layout]);
  }, [layout]);

  const handleDatesSet = (arg: DatesSetArg) =>
    setRange({ ...rangeDays(arg.view.activeStart, arg.view.activeEnd), title: arg.view.title });
  const handleEventClick = (arg: EventClickArg) => {
    arg.jsEvent.preventDefault();
    setOpen((arg.event.extendedProps as RosterEventProps).shift);
  };
  const handleEventMount = (arg: EventMountArg) => {
    const s = (arg.event.extendedProps as RosterEventProps).shift;
    // The name starts with the words the event shows (WCAG 2.5.3, label in name; axe-core's
    // label-content-name-mismatch), then says whose shift it is and when.
    const label = [
      `${arg.timeText} ${arg.event.title}`.trim(),
      s.mine ? 'Your shift' : s.name,
      `${s.shiftName} (${s.shiftCode})`,
      `${arg.event.startStr.slice(0, 10)} ${arg.event.startStr.slice(11, 16)} to ${arg.event.endStr.slice(11, 16)}`,
    ].join(', ');
    labelEvent(arg.el, label);
    arg.el.dataset.mine = String(s.mine);
  };
  const renderEvent = (arg: EventContentArg) => (
    <CalendarEventFace timeText={arg.timeText} title={arg.event.title} />
  );
  const step = (action: 'prev' | 'next' | 'today') => {
    const api = ref.current?.getApi();
    if (!api) return;
    if (action === 'today') api.gotoDate(todayIn(timeZone));
    else if (action === 'prev') api.prev();
    else api.next();
  };

  return (
    <CalendarColumn>
      <CalendarToolbar
        layout={layout}
        onLayoutChange={setLayout}
        title={range?.title ?? ''}
        titleAs="h2"
        onStep={step}
        navExtra={<Button onClick={() => step('today')}>Today</Button>}
      >
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
      </CalendarToolbar>
      <span className={styles.zone}>
        Times are {unit ? `${unit.unitName}'s` : 'the unit’s'} local time ({timeZone}). Your shifts are
        highlighted; only published rosters show.
        {shifts.isFetching && <Spinner size="extra-tiny" aria-label="Loading shifts" />}
      </span>
      <ErrorBanner error={shifts.error} onRetry={() => void shifts.refetch()} />
      <ShiftCalendar
        key={timeZone}
        calendarRef={ref}
        testId="my-roster-calendar"
        initialView={CALENDAR_VIEW[layout]}
        initialDate={initialDate ?? todayIn(timeZone)}
        eventDisplay="block"
        eventMaxStack={4}
        eventOrder="order,start,-duration,title"
        events={events}
        eventContent={renderEvent}
        eventDidMount={handleEventMount}
        eventClick={handleEventClick}
        datesSet={handleDatesSet}
      />
      {open && <ShiftDetailsDialog shift={open} onClose={() => setOpen(null)} />}
    </CalendarColumn>
  );
}
