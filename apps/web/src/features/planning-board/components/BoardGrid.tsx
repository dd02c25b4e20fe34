import type { KeyboardEvent } from 'react';
import { makeStyles, mergeClasses, tokens } from '@fluentui/react-components';
import {
  BeachRegular,
  FlagFilled,
  PersonFeedbackFilled,
  PersonFeedbackRegular,
  PinFilled,
  WarningFilled,
} from '@fluentui/react-icons';
import {
  type AssignmentGridDto,
  RED_FLAG_SOURCE,
  type RedFlagDto,
  type ShiftTypeDto,
} from '@rotaplex/contracts';
import { ShiftChip } from '@/features/planning/components/ShiftChip';
import {
  coverState,
  hoursText,
  type CoverLine,
  type CoverState,
  type HoursLine,
} from '../utils/boardSummary';
import { coverCellKey } from '../utils/boardQuality';
import { dayOfMonth, formatDay, formatWeekday } from '../utils/days';
import { marksText, type CellMarks } from '../utils/requestMarks';

const useStyles = makeStyles({
  scroller: { overflowX: 'auto', maxWidth: '100%' },
  table: {
    borderCollapse: 'collapse',
    fontSize: tokens.fontSizeBase200,
    '& th, & td': {
      borderBottom: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
      padding: tokens.spacingHorizontalXXS,
      textAlign: 'center',
    },
  },
  name: {
    textAlign: 'left',
    whiteSpace: 'nowrap',
    position: 'sticky',
    left: 0,
    backgroundColor: tokens.colorNeutralBackground1,
    fontWeight: tokens.fontWeightRegular,
  },
  weekend: { backgroundColor: tokens.colorNeutralBackground3 },
  dayHead: { minWidth: '2.75rem', fontWeight: tokens.fontWeightSemibold },
  muted: { color: tokens.colorNeutralForeground3, fontWeight: tokens.fontWeightRegular },
  cell: {
    display: 'inline-flex',
    alignItems: 'center',
    justifyContent: 'center',
    gap: tokens.spacingHorizontalXXS,
    minWidth: '2.75rem',
    minHeight: '1.75rem',
    padding: 0,
    border: `${tokens.strokeWidthThin} solid transparent`,
    borderRadius: tokens.borderRadiusMedium,
    backgroundColor: 'transparent',
    color: tokens.colorNeutralForeground1,
    cursor: 'pointer',
    ':hover': { border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke1Hover}` },
    ':focus-visible': { outline: `${tokens.strokeWidthThick} solid ${tokens.colorStrokeFocus2}` },
    ':disabled': { cursor: 'default' },
  },
  flagged: { border: `${tokens.strokeWidthThin} solid ${tokens.colorPaletteRedBorder2}` },
  leave: { backgroundColor: tokens.colorNeutralBackground5 },
  leavePending: { opacity: 0.6 },
  honoured: { color: tokens.colorPaletteGreenForeground1 },
  notHonoured: { color: tokens.colorPaletteDarkOrangeForeground1 },
  warnIcon: { color: tokens.colorPaletteRedForeground1 },
  off: { color: tokens.colorNeutralForeground4 },
  short: { backgroundColor: tokens.colorPaletteRedBackground2, color: tokens.colorPaletteRedForeground2 },
  belowTarget: {
    backgroundColor: tokens.colorPaletteYellowBackground2,
    color: tokens.colorNeutralForeground1,
  },
  met: { color: tokens.colorPaletteGreenForeground1 },
  over: { backgroundColor: tokens.colorPaletteBlueBackground2, color: tokens.colorPaletteBlueForeground2 },
  none: { color: tokens.colorNeutralForeground3 },
  // A red flag of safe staffing: a flag and the words, with a frame inside the cell (never colour alone).
  redFlagCell: {
    outline: `${tokens.strokeWidthThick} solid ${tokens.colorPaletteRedBorder2}`,
    outlineOffset: `calc(-1 * ${tokens.strokeWidthThick})`,
    // Room for the words inside the frame (the table's cells are narrow).
    '&&': { paddingLeft: tokens.spacingHorizontalXS, paddingRight: tokens.spacingHorizontalXS },
  },
  redFlag: {
    display: 'inline-flex',
    alignItems: 'center',
    gap: '2px',
    whiteSpace: 'nowrap',
    fontSize: tokens.fontSizeBase100,
    fontWeight: tokens.fontWeightSemibold,
  },
  hours: { whiteSpace: 'nowrap', textAlign: 'right' },
  under: { color: tokens.colorPaletteRedForeground1 },
  coverHead: { backgroundColor: tokens.colorNeutralBackground2 },
  // The heading spans every day; it stays at the left edge while the grid scrolls sideways.
  coverTitle: { textAlign: 'left' },
  stickyLeft: { position: 'sticky', left: tokens.spacingHorizontalXS },
});

/** Words beside each cover figure, so the state never rests on colour alone. */
const COVER_WORDS: Record<CoverState, string> = {
  short: 'short',
  belowTarget: 'below target',
  met: 'met',
  over: 'over',
  none: '',
};

export interface BoardGridProps {
  grid: AssignmentGridDto;
  shiftTypes: Map<string, ShiftTypeDto>;
  cover: CoverLine[];
  hours: Map<string, HoursLine>;
  /** "staffMemberId|date" of cells with a rule finding. */
  flagged: Set<string>;
  readOnly: boolean;
  onOpenCell: (staffMemberId: string, date: string) => void;
  /** Date requests and leave per "staffMemberId|date" (empty while they load or when unreadable). */
  marks?: Map<string, CellMarks>;
  /** Red flags of safe staffing per cover cell (coverCellKey: shift type, skill, date). */
  redFlags?: Map<string, RedFlagDto>;
}

const isWeekend = (date: string) => [0, 6].includes(new Date(`${date}T00:00:00Z`).getUTCDay());

/** Moves focus between the cells of the grid with the arrow keys, Home and End. */
function moveFocus(event: KeyboardEvent<HTMLTableElement>) {
  const target = event.target as HTMLElement;
  const row = Number(target.dataset.row);
  const col = Number(target.dataset.col);
  if (Number.isNaN(row) || Number.isNaN(col) || target.dataset.row === undefined) return;
  const moves: Record<string, [number, number]> = {
    ArrowUp: [row - 1, col],
    ArrowDown: [row + 1, col],
    ArrowLeft: [row, col - 1],
    ArrowRight: [row, col + 1],
    Home: [row, 0],
    End: [row, 10_000],
  };
  const next = moves[event.key];
  if (!next) return;
  event.preventDefault();
  const table = event.currentTarget;
  const [r, c] = next;
  const candidates = table.querySelectorAll<HTMLElement>(`[data-row="${r}"]`);
  const cell =
    table.querySelector<HTMLElement>(`[data-row="${r}"][data-col="${c}"]`) ??
    (event.key === 'End' ? candidates[candidates.length - 1] : null);
  cell?.focus();
}

/** People by days with shift codes in their colours, hours against contract and cover against needs. */
export function BoardGrid({
  grid,
  shiftTypes,
  cover,
  hours,
  flagged,
  readOnly,
  onOpenCell,
  marks,
  redFlags,
}: BoardGridProps) {
  const styles = useStyles();
  const shiftCodes = new Map([...shiftTypes.values()].map((s) => [s.id, s.code]));
  return (
    <div className={styles.scroller}>
      <table className={styles.table} aria-label="Planning board" onKeyDown={moveFocus}>
        <thead>
          <tr>
            <th scope="col" className={styles.name}>
              Person
            </th>
            {grid.dates.map((date) => (
              <th
                key={date}
                scope="col"
                className={mergeClasses(styles.dayHead, isWeekend(date) && styles.weekend)}
                abbr={formatDay(date)}
              >
                <div className={styles.muted}>{formatWeekday(date)}</div>
                {dayOfMonth(date)}
              </th>
            ))}
            <th scope="col">Hours / contract</th>
          </tr>
        </thead>
        <tbody>
          {grid.rows.map((row, r) => {
            const h = hours.get(row.staffMemberId);
            return (
              <tr key={row.staffMemberId}>
                <th scope="row" className={styles.name}>
                  {row.name}
                </th>
                {row.cells.map((cell, c) => {
                  const date = grid.dates[c];
                  const shift = cell.shiftTypeId ? shiftTypes.get(cell.shiftTypeId) : undefined;
                  const hasFinding = flagged.has(`${row.staffMemberId}|${date}`);
                  const mark = marks?.get(`${row.staffMemberId}|${date}`);
                  const label = [
                    row.name,
                    formatDay(date),
                    shift ? `${shift.code} ${shift.name}` : 'day off',
                    cell.pinned ? 'pinned' : '',
                    hasFinding ? 'has a rule finding' : '',
                    ...marksText(mark, shiftCodes),
                  ]
                    .filter(Boolean)
                    .join(', ');
                  return (
                    <td
                      key={date}
                      className={mergeClasses(
                        isWeekend(date) && styles.weekend,
                        mark?.leave ? styles.leave : undefined,
                      )}
                    >
                      <button
                        type="button"
                        className={mergeClasses(styles.cell, hasFinding && styles.flagged)}
                        aria-label={label}
                        title={label}
                        data-row={r}
                        data-col={c}
                        tabIndex={r === 0 && c === 0 ? 0 : -1}
                        disabled={readOnly}
                        onClick={() => onOpenCell(row.staffMemberId, date)}
                      >
                        {shift ? (
                          <ShiftChip code={shift.code} colour={shift.colour} />
                        ) : (
                          <span className={styles.off} aria-hidden>
                            ·
                          </span>
                        )}
                        {mark?.leave && (
                          <BeachRegular
                            aria-hidden
                            className={mark.leave.status === 'pending' ? styles.leavePending : undefined}
                          />
                        )}
                        {mark && mark.requests.length > 0 && <RequestIcon marks={mark} styles={styles} />}
                        {cell.pinned && <PinFilled aria-hidden />}
                        {hasFinding && <WarningFilled aria-hidden className={styles.warnIcon} />}
                      </button>
                    </td>
                  );
                })}
                <td
                  className={mergeClasses(
                    styles.hours,
                    h?.state === 'under' || h?.state === 'over' ? styles.under : undefined,
                  )}
                >
                  {h ? hoursCell(h) : ''}
                </td>
              </tr>
            );
          })}
        </tbody>
        <tbody aria-label="Cover against needs">
          <tr>
            <th scope="colgroup" colSpan={grid.dates.length + 2} className={styles.coverHead}>
              <div className={styles.coverTitle}>
                <span className={styles.stickyLeft}>
                  Cover against needs: people on each shift; “short 1” is one below the minimum, “target −1”
                  one below the target
                </span>
              </div>
            </th>
          </tr>
          {cover.map((line) => (
            <tr key={`${line.shiftType.id}-${line.skill?.id ?? 'any'}`}>
              <th scope="row" className={styles.name}>
                <ShiftChip code={line.shiftType.code} colour={line.shiftType.colour} />{' '}
                {line.skill ? line.skill.code : 'anyone'}
              </th>
              {line.days.map((day, d) => {
                const state = coverState(day.count, day.need);
                const words = COVER_WORDS[state];
                const date = grid.dates[d];
                const flag = redFlags?.get(coverCellKey(line.shiftType.id, line.skill?.id ?? null, date));
                return (
                  <td
                    key={date}
                    className={mergeClasses(styles[state], flag && styles.redFlagCell)}
                    title={
                      `${formatDay(date)}, ${line.shiftType.name}${line.skill ? ` (${line.skill.name})` : ''}: ${day.count} on${day.need ? `, minimum ${day.need.min}, target ${day.need.target}` : ', no need set'}${words ? `, ${words}` : ''}` +
                      (flag ? `. Red flag (${RED_FLAG_SOURCE}): ${flag.text}` : '')
                    }
                    data-red-flag={flag ? 'true' : undefined}
                  >
                    <strong>{day.count}</strong>
                    {day.need && <div>{coverWords(state, day.count, day.need)}</div>}
                    {flag && (
                      <div className={styles.redFlag}>
                        <FlagFilled aria-hidden />
                        red flag
                      </div>
                    )}
                  </td>
                );
              })}
              <td />
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** The state of one cover cell in a word or two: how far below the minimum or target, met, or over. */
function coverWords(state: CoverState, count: number, need: { min: number; target: number }): string {
  if (state === 'short') return `short ${need.min - count}`;
  if (state === 'belowTarget') return `target −${need.target - count}`;
  if (state === 'over') return `over ${count - need.target}`;
  return state === 'met' ? 'met' : '';
}

/** One icon for a cell's date requests: outlined and green when all are honoured, filled and orange if not. */
function RequestIcon({ marks, styles }: { marks: CellMarks; styles: ReturnType<typeof useStyles> }) {
  return marks.requests.every((r) => r.honoured) ? (
    <PersonFeedbackRegular aria-hidden className={styles.honoured} />
  ) : (
    <PersonFeedbackFilled aria-hidden className={styles.notHonoured} />
  );
}

function hoursCell(h: HoursLine): string {
  const paid = hoursText(h.paidMinutes);
  if (h.state === 'noContract') return `${paid} (no contract)`;
  const range =
    h.target !== null
      ? `target ${hoursText(h.target)}`
      : h.max !== null
        ? `at most ${hoursText(h.max)}`
        : h.min !== null
          ? `at least ${hoursText(h.min)}`
          : 'no hours rule';
  const words = h.state === 'under' ? ', under' : h.state === 'over' ? ', over' : '';
  return `${paid} / ${range}${words}`;
}
