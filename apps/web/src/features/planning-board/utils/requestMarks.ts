import {
  DATE_REQUEST_KIND_LABELS,
  LEAVE_TYPE_LABELS,
  type AssignmentGridDto,
  type DateRequestDto,
  type LeaveDto,
  type LeaveStatus,
  type LeaveType,
  type PeriodRequestsDto,
} from '@rotaplex/contracts';

/** A date request on one cell and whether the roster, as it stands, honours it. */
export interface CellRequest {
  request: DateRequestDto;
  honoured: boolean;
}

/** Leave that covers one cell's date. Only pending and approved leave is marked. */
export interface CellLeave {
  type: LeaveType;
  status: Extract<LeaveStatus, 'pending' | 'approved'>;
}

export interface CellMarks {
  requests: CellRequest[];
  leave: CellLeave | null;
}

/**
 * Whether the cell's shift honours a date request, as the roster model reads requests
 * (libs/contracts requests.ts): shift on: the person works that shift type that day; shift off:
 * the person does not work that shift type that day; day off: the person works no shift that day.
 */
export function honours(request: Pick<DateRequestDto, 'kind' | 'shiftTypeId'>, shiftTypeId: string | null) {
  if (request.kind === 'shiftOn') return shiftTypeId !== null && shiftTypeId === request.shiftTypeId;
  if (request.kind === 'shiftOff') return shiftTypeId === null || shiftTypeId !== request.shiftTypeId;
  return shiftTypeId === null;
}

/** Dates "YYYY-MM-DD" compare in calendar order as plain strings. */
const within = (date: string, leave: Pick<LeaveDto, 'startDate' | 'endDate'>) =>
  leave.startDate <= date && date <= leave.endDate;

/**
 * Marks per cell ("staffMemberId|date"): the date requests on it with honoured or not, and the
 * leave covering it. Approved leave wins over pending leave on the same day; declined and
 * cancelled leave is not marked.
 */
export function requestMarks(grid: AssignmentGridDto, input: PeriodRequestsDto): Map<string, CellMarks> {
  const marks = new Map<string, CellMarks>();
  const at = (staffMemberId: string, date: string) => {
    const key = `${staffMemberId}|${date}`;
    let m = marks.get(key);
    if (!m) {
      m = { requests: [], leave: null };
      marks.set(key, m);
    }
    return m;
  };
  const rows = new Map(grid.rows.map((r) => [r.staffMemberId, r]));
  const dayIndex = new Map(grid.dates.map((d, i) => [d, i]));
  for (const request of input.dateRequests) {
    const row = rows.get(request.staffMemberId);
    const i = dayIndex.get(request.date);
    if (!row || i === undefined) continue;
    at(request.staffMemberId, request.date).requests.push({
      request,
      honoured: honours(request, row.cells[i]?.shiftTypeId ?? null),
    });
  }
  for (const leave of input.leave) {
    if (leave.status !== 'approved' && leave.status !== 'pending') continue;
    if (!rows.has(leave.staffMemberId)) continue;
    for (const date of grid.dates) {
      if (!within(date, leave)) continue;
      const m = at(leave.staffMemberId, date);
      if (!m.leave || (m.leave.status === 'pending' && leave.status === 'approved')) {
        m.leave = { type: leave.type, status: leave.status };
      }
    }
  }
  return marks;
}

/** Words for a cell's marks, for its accessible name and tooltip. */
export function marksText(marks: CellMarks | undefined, shiftCodes: Map<string, string>): string[] {
  if (!marks) return [];
  const words: string[] = [];
  if (marks.leave) {
    words.push(
      `${LEAVE_TYPE_LABELS[marks.leave.type].toLowerCase()}${marks.leave.status === 'pending' ? ' (pending)' : ''}`,
    );
  }
  for (const { request, honoured } of marks.requests) {
    const code = request.shiftTypeId ? (shiftCodes.get(request.shiftTypeId) ?? request.shiftTypeCode) : null;
    words.push(
      `request ${DATE_REQUEST_KIND_LABELS[request.kind].toLowerCase()}${code ? ` ${code}` : ''} ${honoured ? 'honoured' : 'not honoured'}`,
    );
  }
  return words;
}
