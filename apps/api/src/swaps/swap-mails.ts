import { type SwapPreviewDto } from '@rotaplex/contracts';
import { type OutgoingMail } from '../mail/mail.service';
import { type RosterInput } from '../roster-input/roster-input.service';
import { type StaffMemberEntity } from '../staff/staff-member.entity';
import { type StoredCellChange, type SwapRequestEntity } from './swap-request.entity';
import { dateInWords } from '../common/text/date-words';
import { escapeHtml } from '../mail/templates';
import { type LateChangeEntity } from '../roster-periods/late-change.entity';
import { lateNotes } from '../roster-periods/notice-window';

/** Where the person finds the request in the menu: staff under "Swaps", managers under "Swap approvals". */
export type SwapMailPlace = 'Swaps' | 'Swap approvals';

/** A shift in words, in the unit's local time: "Early 07:00-15:00 on Mon 4 Jan 2027". */
export function shiftWords(
  shift: { name: string; start: string; end: string } | undefined,
  date: string,
): string {
  const day = dateInWords(date);
  return shift ? `${shift.name} ${shift.start}-${shift.end} on ${day}` : `a day off on ${day}`;
}

/**
 * Plain-text and HTML versions of a swap message. Only the names and shifts of the people in the
 * request appear (no contact details, requests or pay of anyone else).
 */
export function swapMail(p: {
  to: string;
  name: string;
  subject: string;
  lines: string[];
  timeZone: string;
  place: SwapMailPlace;
  action?: { label: string; url: string };
}): OutgoingMail {
  const lines = [`Hello ${p.name},`, ...p.lines, `Times are in the unit's time zone (${p.timeZone}).`];
  const footer = p.action
    ? `The link works once, only for this decision, and expires. You can also decide in Rotaplex under ${p.place}.`
    : p.place === 'Swaps'
      ? 'You can see all your swaps in Rotaplex under Swaps.'
      : 'You can see the swaps and claims waiting for a decision in Rotaplex under Swap approvals.';
  const text = [...lines, ...(p.action ? [`${p.action.label}: ${p.action.url}`] : []), footer].join('\n\n');
  const body = lines.map((l) => `<p style="margin:0 0 16px">${escapeHtml(l)}</p>`).join('\n');
  const button = p.action
    ? `<p style="margin:24px 0"><a href="${escapeHtml(p.action.url)}" style="background:#0f5c57;color:#ffffff;padding:10px 18px;border-radius:4px;text-decoration:none">${escapeHtml(p.action.label)}</a></p>
<p style="margin:0 0 16px;font-size:13px">If the button does not work, open this address: <a href="${escapeHtml(p.action.url)}">${escapeHtml(p.action.url)}</a></p>`
    : '';
  const html = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(p.subject)}</title></head>
<body style="font-family:'Open Sans',Arial,sans-serif;color:#1d2b2a;line-height:1.5;padding:24px">
<h1 style="font-size:20px;margin:0 0 16px">${escapeHtml(p.subject)}</h1>
${body}
${button}
<p style="margin:24px 0 0;font-size:12px;color:#5a6b69">${escapeHtml(footer)}</p>
</body></html>`;
  return { to: p.to, subject: p.subject, text: `${text}\n`, html };
}

// ---------------------------------------------------------------- requests in words

/** The shift type of an id (undefined for a day off or an unknown id). */
export function shiftOf(input: Pick<RosterInput, 'shiftTypes'>, id: string | null) {
  return id === null ? undefined : input.shiftTypes.find((s) => s.id === id);
}

export function staffName(input: Pick<RosterInput, 'staff'>, id: string): string {
  return input.staff.find((s) => s.id === id)?.name ?? 'someone';
}

/** The messages of the checker's findings that the change would add. */
export function newMessages(p: SwapPreviewDto): string[] {
  return p.violations.filter((v) => v.isNew).map((v) => v.message);
}

/** The request in words: who works what after the change. */
export function summary(input: RosterInput, row: Pick<SwapRequestEntity, 'changes'>): string {
  const changes = JSON.parse(row.changes) as StoredCellChange[];
  return changes
    .filter((c) => c.after !== null)
    .map((c) => `${staffName(input, c.staffMemberId)} works ${shiftWords(shiftOf(input, c.after), c.date)}`)
    .join(' and ');
}

/** What a proposed swap or offer asks of the colleague, for their mail. */
export function describe(
  input: RosterInput,
  changes: StoredCellChange[],
  me: StaffMemberEntity,
  colleague: StaffMemberEntity,
  kind: 'swap' | 'offer',
): string[] {
  const give = changes.find((c) => c.staffMemberId === me.id && c.before !== null)!;
  if (kind === 'offer') {
    return [`${me.name} offers you their shift ${shiftWords(shiftOf(input, give.before), give.date)}.`];
  }
  const take = changes.find((c) => c.staffMemberId === colleague.id && c.before !== null)!;
  return [
    `${me.name} asks to swap: you would work ${shiftWords(shiftOf(input, give.before), give.date)}, ` +
      `and they would work your shift ${shiftWords(shiftOf(input, take.before), take.date)}.`,
    'Rotaplex checked both rosters after the swap: it breaks no rule.',
  ];
}

// ---------------------------------------------------------------- late changes

/**
 * Said to each person whose shift an approved swap, give-away or claim changed inside the notice
 * window: they asked for it or agreed to it, which the usual exceptions of notice-window laws cover
 * (Seattle SMC 14.22, from memory; docs/notice-window.md).
 */
export const ASKED_FOR_LATE =
  'You asked for or agreed to this change, so it is commonly exempt from predictability pay.';

/**
 * Per person (staff member id), the lines of the approval mail on their shifts changed inside the
 * notice window: the notice window's note (`lateNotes`) and that they asked for the change.
 */
export function lateLines(late: readonly LateChangeEntity[]): Map<string, string[]> {
  return new Map([...lateNotes(late)].map(([id, note]) => [id, [note, ASKED_FOR_LATE]]));
}

/** The approving manager's line on the change's shifts inside the notice window (null: none). */
export function lateManagerLine(late: readonly LateChangeEntity[]): string | null {
  if (late.length === 0) return null;
  const days = [...new Set(late.map((l) => l.date))].sort().map(dateInWords);
  return (
    `This is a late change: ${days.join(', ')} ${days.length === 1 ? 'is' : 'are'} less than ` +
    `${late[0].noticeWindowDays} days away. The staff asked for it, so it is commonly exempt from ` +
    'predictability pay; where a notice-window law or agreement applies, it decides. It is listed in ' +
    "the period's reports under changes inside the notice window."
  );
}
