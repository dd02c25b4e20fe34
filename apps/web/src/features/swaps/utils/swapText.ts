import type { SwapCellChangeDto, SwapKind, SwapStatus } from '@rotaplex/contracts';

/** "Mon 4 Jan" from "YYYY-MM-DD" (calendar date, no time zone shift). */
export function dayLabel(date: string): string {
  return new Date(`${date}T12:00:00Z`).toLocaleDateString('en-GB', {
    weekday: 'short',
    day: 'numeric',
    month: 'short',
    timeZone: 'UTC',
  });
}

/** Who works what after the change, e.g. "Robin Tallis works E on Mon 4 Jan; Priya Wendover works L on Mon 4 Jan". */
export function changeSummary(changes: readonly SwapCellChangeDto[]): string {
  return changes
    .filter((c) => c.afterShiftCode !== null)
    .map((c) => `${c.staffName} works ${c.afterShiftCode} on ${dayLabel(c.date)}`)
    .join('; ');
}

export const KIND_LABELS: Record<SwapKind, string> = {
  swap: 'Swap',
  offer: 'Shift offered',
  claim: 'Open shift claim',
};

export const STATUS_LABELS: Record<SwapStatus, string> = {
  proposed: 'Waiting for colleague',
  accepted: 'Waiting for manager',
  declined: 'Declined by colleague',
  approved: 'Approved',
  refused: 'Not approved',
  cancelled: 'Cancelled',
  expired: 'Expired',
};

/** Badge colour of a status: done well, done badly, or still open. */
export function statusColour(status: SwapStatus): 'success' | 'danger' | 'informative' | 'subtle' {
  if (status === 'approved') return 'success';
  if (status === 'refused' || status === 'declined') return 'danger';
  if (status === 'proposed' || status === 'accepted') return 'informative';
  return 'subtle';
}
