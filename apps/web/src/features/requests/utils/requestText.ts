import {
  type AvailabilityCellDto,
  type AvailabilityStatus,
  DATE_REQUEST_KIND_LABELS,
  type DateRequestKind,
  DAY_PARTS,
  type DayPart,
  LEAVE_TYPE_LABELS,
  type LeaveType,
  type RequestRowStatus,
} from '@rotaplex/contracts';

/** Weekdays in the order the grid shows them (Monday first), as JavaScript weekday numbers. */
export const GRID_WEEKDAYS = [1, 2, 3, 4, 5, 6, 0] as const;
export const WEEKDAY_LABELS = ['Sunday', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday'];

export const AVAILABILITY_LABELS: Record<AvailabilityStatus, string> = {
  available: 'Available',
  'prefer-not': 'Prefer not',
  unavailable: 'Unavailable',
};

export type AvailabilityGridState = Record<string, AvailabilityStatus>;
export const cellKey = (weekday: number, part: DayPart) => `${weekday}|${part}`;

/** The stored cells as a full grid (missing cells are available). */
export function gridFromCells(cells: AvailabilityCellDto[]): AvailabilityGridState {
  const grid: AvailabilityGridState = {};
  for (const weekday of GRID_WEEKDAYS)
    for (const part of DAY_PARTS) grid[cellKey(weekday, part)] = 'available';
  for (const c of cells) grid[cellKey(c.weekday, c.part)] = c.status;
  return grid;
}

/** The grid as the cells to send: only those that are not available, Sunday first. */
export function cellsFromGrid(grid: AvailabilityGridState): AvailabilityCellDto[] {
  const cells: AvailabilityCellDto[] = [];
  for (let weekday = 0; weekday < 7; weekday++) {
    for (const part of DAY_PARTS) {
      const status = grid[cellKey(weekday, part)] ?? 'available';
      if (status !== 'available') cells.push({ weekday, part, status });
    }
  }
  return cells;
}

const SHORT_DAYS = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];
const SHORT_MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** "Mon 4 Jan 2027" for a "YYYY-MM-DD" calendar date (the same in every browser and zone). */
export function dateLabel(date: string): string {
  const d = new Date(`${date}T12:00:00Z`);
  return `${SHORT_DAYS[d.getUTCDay()]} ${d.getUTCDate()} ${SHORT_MONTHS[d.getUTCMonth()]} ${d.getUTCFullYear()}`;
}

export function rangeLabel(start: string, end: string): string {
  return start === end ? dateLabel(start) : `${dateLabel(start)} to ${dateLabel(end)}`;
}

/** The dates of a period, in order. */
export function periodDates(startDate: string, days: number): string[] {
  return Array.from({ length: days }, (_, d) => {
    const x = new Date(`${startDate}T00:00:00Z`);
    x.setUTCDate(x.getUTCDate() + d);
    return x.toISOString().slice(0, 10);
  });
}

export function kindLabel(kind: DateRequestKind | LeaveType): string {
  return kind in DATE_REQUEST_KIND_LABELS
    ? DATE_REQUEST_KIND_LABELS[kind as DateRequestKind]
    : LEAVE_TYPE_LABELS[kind as LeaveType];
}

export const STATUS_LABELS: Record<RequestRowStatus, string> = {
  submitted: 'Submitted',
  pending: 'Pending',
  approved: 'Approved',
  declined: 'Declined',
  cancelled: 'Cancelled',
};

export const STATUS_COLOURS: Record<
  RequestRowStatus,
  'informative' | 'warning' | 'success' | 'danger' | 'subtle'
> = {
  submitted: 'informative',
  pending: 'warning',
  approved: 'success',
  declined: 'danger',
  cancelled: 'subtle',
};
