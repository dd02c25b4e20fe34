import type { AuditEntryDto } from '@rotaplex/contracts';
import { daysFrom } from '@/features/planning/utils/periodDates';

/**
 * Notice window of fair-workweek laws: schedules 14 days ahead, and changes inside that window
 * carry predictability pay (e.g. Seattle SMC 14.22, Chicago Fair Workweek Ordinance, Oregon SB 828;
 * PRODUCT.md "Trade facts"). Local law and agreements decide whether and how it applies.
 */
export const NOTICE_WINDOW_DAYS = 14;

export const NOTICE_WINDOW_CAUTION =
  `Changed less than ${NOTICE_WINDOW_DAYS} days before the shift. Where a fair-workweek law or ` +
  'agreement applies, such a change may owe the person predictability pay: local law and agreements decide.';

/**
 * The days of a change to a published roster that fall inside the notice window: each changed cell's
 * date from 0 to NOTICE_WINDOW_DAYS - 1 days after the day of the change (UTC day of the entry).
 * Publishing itself is no change; entries without cell lists have none.
 */
export function daysInsideNoticeWindow(
  entry: Pick<AuditEntryDto, 'kind' | 'at' | 'before' | 'after'>,
  days = NOTICE_WINDOW_DAYS,
): string[] {
  if (entry.kind === 'publish') return [];
  const changed = new Set<string>();
  for (const list of [entry.before, entry.after]) {
    if (!Array.isArray(list)) continue;
    for (const cell of list as { date?: unknown }[]) {
      if (typeof cell?.date === 'string') changed.add(cell.date);
    }
  }
  const on = entry.at.slice(0, 10);
  return [...changed].filter((d) => daysFrom(on, d) >= 0 && daysFrom(on, d) < days).sort();
}
