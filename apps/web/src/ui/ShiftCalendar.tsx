// FullCalendar is large: import this file only from lazily loaded pages and panels, never from the
// sign-in page or the app shell, so it stays out of the first download.
import type { ReactNode, Ref } from 'react';
import {
  Button,
  makeStyles,
  mergeClasses,
  Subtitle2,
  Tab,
  TabList,
  tokens,
} from '@fluentui/react-components';
import { ChevronLeftRegular, ChevronRightRegular } from '@fluentui/react-icons';
import type { CalendarOptions, PluginDef } from '@fullcalendar/core';
import enGbLocale from '@fullcalendar/core/locales/en-gb';
import dayGridPlugin from '@fullcalendar/daygrid';
import FullCalendar from '@fullcalendar/react';
import timeGridPlugin from '@fullcalendar/timegrid';

export type CalendarLayout = 'week' | 'month';

/** The FullCalendar view of each layout: a week with hours, or a month grid. */
export const CALENDAR_VIEW: Record<CalendarLayout, string> = { week: 'timeGridWeek', month: 'dayGridMonth' };

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
  nav: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', gap: tokens.spacingHorizontalS },
  title: { minWidth: '10rem', textAlign: 'center' },
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
    '& .fc-event': { cursor: 'pointer' },
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
});

/** The column a calendar, its toolbar and its notes stand in. */
export function CalendarColumn({ children }: { children: ReactNode }) {
  return <div className={useStyles().root}>{children}</div>;
}

export interface CalendarToolbarProps {
  layout: CalendarLayout;
  onLayoutChange: (layout: CalendarLayout) => void;
  /** The dates shown, as FullCalendar words them. */
  title: string;
  titleAs: 'h2' | 'h3';
  onStep: (direction: 'prev' | 'next') => void;
  prevDisabled?: boolean;
  nextDisabled?: boolean;
  /** Extra buttons after "next" (such as "Today"). */
  navExtra?: ReactNode;
  /** Filters between the navigation and the layout tabs. */
  children?: ReactNode;
}

/** Previous/next with the dates shown between them, the caller's filters, and the week/month tabs. */
export function CalendarToolbar({
  layout,
  onLayoutChange,
  title,
  titleAs,
  onStep,
  prevDisabled,
  nextDisabled,
  navExtra,
  children,
}: CalendarToolbarProps) {
  const styles = useStyles();
  return (
    <div className={styles.toolbar}>
      <div className={styles.nav}>
        <Button
          icon={<ChevronLeftRegular />}
          aria-label={layout === 'week' ? 'Previous week' : 'Previous month'}
          disabled={prevDisabled}
          onClick={() => onStep('prev')}
        />
        <Subtitle2 as={titleAs} className={styles.title} aria-live="polite">
          {title}
        </Subtitle2>
        <Button
          icon={<ChevronRightRegular />}
          aria-label={layout === 'week' ? 'Next week' : 'Next month'}
          disabled={nextDisabled}
          onClick={() => onStep('next')}
        />
        {navExtra}
      </div>
      {children}
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
  );
}

/** An event's face: its times in bold, its title, then any marks. */
export function CalendarEventFace({
  timeText,
  title,
  children,
}: {
  timeText: string;
  title: string;
  children?: ReactNode;
}) {
  const styles = useStyles();
  return (
    <div className={styles.event}>
      {timeText && <span className={styles.time}>{timeText}</span>} <span>{title}</span>
      {children}
    </div>
  );
}

/** Makes a mounted event a named button for screen readers, with the same words as its tooltip. */
export function labelEvent(el: HTMLElement, label: string): void {
  el.setAttribute('role', 'button');
  el.setAttribute('aria-label', label);
  el.setAttribute('title', label);
}

export interface ShiftCalendarProps extends Omit<CalendarOptions, 'plugins'> {
  calendarRef: Ref<FullCalendar>;
  /** `data-testid` of the calendar's frame. */
  testId: string;
  /** Extra class of the frame. */
  className?: string;
  /** Plugins beyond the week and month grids. */
  extraPlugins?: PluginDef[];
}

/**
 * FullCalendar in the theme, with the settings every Rotaplex calendar shares: British English,
 * no built-in header (see CalendarToolbar), 24-hour times from 06:00, start and end times on events.
 * It runs in UTC: callers feed it the unit's wall-clock times, so it shows them whatever the browser's zone.
 */
export function ShiftCalendar({
  calendarRef,
  testId,
  className,
  extraPlugins = [],
  ...options
}: ShiftCalendarProps) {
  const styles = useStyles();
  return (
    <div className={mergeClasses(styles.calendar, className)} data-testid={testId}>
      <FullCalendar
        ref={calendarRef}
        plugins={[timeGridPlugin, dayGridPlugin, ...extraPlugins]}
        locale={enGbLocale}
        timeZone="UTC"
        headerToolbar={false}
        height="auto"
        allDaySlot={false}
        scrollTime="06:00:00"
        nowIndicator={false}
        eventTimeFormat={TIME_FORMAT}
        slotLabelFormat={TIME_FORMAT}
        displayEventEnd
        dayMaxEvents={4}
        // "+3 more" is a link without an address: as a button it may carry aria-expanded (axe-core
        // aria-allowed-attr, WCAG 4.1.2).
        moreLinkDidMount={(arg) => arg.el.setAttribute('role', 'button')}
        {...options}
      />
    </div>
  );
}
