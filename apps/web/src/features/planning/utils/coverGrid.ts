import type { CoverPatternRowDto } from '@rotaplex/contracts';

/** Weekdays in the order the grid shows them, Monday first (ISO 8601 week); values as in JavaScript (0 = Sunday). */
export const GRID_WEEKDAYS = [1, 2, 3, 4, 5, 6, 0] as const;

export interface CoverCell {
  /** As typed; '' is no need. */
  min: string;
  /** As typed; '' means the same as min. */
  target: string;
}

/** One row of the grid: a shift type and a skill (null: anyone on the shift), one cell per weekday. */
export interface CoverLine {
  shiftTypeId: string;
  skillId: string | null;
  cells: Record<number, CoverCell>;
}

export const lineKey = (shiftTypeId: string, skillId: string | null) => `${shiftTypeId}|${skillId ?? ''}`;

const emptyCells = (): Record<number, CoverCell> =>
  Object.fromEntries(GRID_WEEKDAYS.map((d) => [d, { min: '', target: '' }]));

/**
 * The grid for a weekly pattern: one line per shift type and skill that has a need on any day,
 * ordered as the shift types are listed, then the "anyone" line before skill lines.
 */
export function gridFromPattern(
  pattern: readonly CoverPatternRowDto[],
  shiftTypeOrder: readonly string[],
): CoverLine[] {
  const lines = new Map<string, CoverLine>();
  for (const row of pattern) {
    const key = lineKey(row.shiftTypeId, row.skillId);
    let line = lines.get(key);
    if (!line) {
      line = { shiftTypeId: row.shiftTypeId, skillId: row.skillId, cells: emptyCells() };
      lines.set(key, line);
    }
    line.cells[row.weekday] = { min: String(row.min), target: String(row.target) };
  }
  return sortLines([...lines.values()], shiftTypeOrder);
}

export function sortLines(lines: CoverLine[], shiftTypeOrder: readonly string[]): CoverLine[] {
  const rank = (id: string) => {
    const i = shiftTypeOrder.indexOf(id);
    return i < 0 ? shiftTypeOrder.length : i;
  };
  return [...lines].sort(
    (a, b) =>
      rank(a.shiftTypeId) - rank(b.shiftTypeId) ||
      (a.skillId === null ? -1 : 0) - (b.skillId === null ? -1 : 0) ||
      (a.skillId ?? '').localeCompare(b.skillId ?? ''),
  );
}

/** Adds an empty line for a shift type and skill, unless the grid has it already. */
export function addLine(
  lines: readonly CoverLine[],
  shiftTypeId: string,
  skillId: string | null,
): CoverLine[] {
  if (lines.some((l) => lineKey(l.shiftTypeId, l.skillId) === lineKey(shiftTypeId, skillId)))
    return [...lines];
  return [...lines, { shiftTypeId, skillId, cells: emptyCells() }];
}

export function setCell(
  lines: readonly CoverLine[],
  key: string,
  weekday: number,
  cell: Partial<CoverCell>,
): CoverLine[] {
  return lines.map((l) =>
    lineKey(l.shiftTypeId, l.skillId) === key
      ? { ...l, cells: { ...l.cells, [weekday]: { ...l.cells[weekday], ...cell } } }
      : l,
  );
}

/** Copies one weekday's needs, on every line, to the other days given. */
export function copyDay(lines: readonly CoverLine[], from: number, to: readonly number[]): CoverLine[] {
  return lines.map((l) => {
    const cells = { ...l.cells };
    for (const day of to) if (day !== from) cells[day] = { ...l.cells[from] };
    return { ...l, cells };
  });
}

export type CellErrors = Record<string, string>;
export const cellKey = (line: string, weekday: number) => `${line}@${weekday}`;

/** A count typed in a cell: '' is none; otherwise a whole number 0-999. */
function readCount(text: string): number | null | 'bad' {
  const t = text.trim();
  if (t === '') return null;
  if (!/^\d{1,3}$/.test(t)) return 'bad';
  return Number(t);
}

/**
 * The pattern rows of a grid and the errors of its cells (keyed by {@link cellKey}). A cell with no
 * minimum and no target, or both 0, is no need and makes no row; an empty target means "same as minimum".
 */
export function patternFromGrid(lines: readonly CoverLine[]): {
  rows: CoverPatternRowDto[];
  errors: CellErrors;
} {
  const rows: CoverPatternRowDto[] = [];
  const errors: CellErrors = {};
  for (const line of lines) {
    const key = lineKey(line.shiftTypeId, line.skillId);
    for (const weekday of GRID_WEEKDAYS) {
      const cell = line.cells[weekday] ?? { min: '', target: '' };
      const min = readCount(cell.min);
      const target = readCount(cell.target);
      if (min === 'bad' || target === 'bad') {
        errors[cellKey(key, weekday)] = 'Enter whole numbers from 0 to 999.';
        continue;
      }
      if (min === null && target === null) continue;
      const lo = min ?? 0;
      const hi = target ?? lo;
      if (hi < lo) {
        errors[cellKey(key, weekday)] = 'The target cannot be below the minimum.';
        continue;
      }
      if (lo === 0 && hi === 0) continue;
      rows.push({ weekday, shiftTypeId: line.shiftTypeId, skillId: line.skillId, min: lo, target: hi });
    }
  }
  return { rows, errors };
}
