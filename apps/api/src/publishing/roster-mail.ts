import { TZDate } from '@date-fns/tz';
import { shiftInterval } from '@rotaplex/roster-model';
import { format } from 'date-fns';
import { addDays } from '../common/dates';
import { dateRangeInWords } from '../common/text/date-words';
import { escapeHtml, type MailContent } from '../mail/templates';

/** One shift of one person, for their e-mail. */
export interface MailShift {
  /** Day of the period (0-based). */
  day: number;
  code: string;
  name: string;
  start: string;
  end: string;
}

export interface RosterMailInput {
  displayName: string;
  unitName: string;
  timeZone: string;
  /** First day of the period, "YYYY-MM-DD" in the unit's zone. */
  startDate: string;
  days: number;
  shifts: MailShift[];
  link: string;
  kind: 'published' | 'changed';
  /** Open shifts of this roster the person may take (skill, free that day, no rule broken); 0 or absent: none. */
  openShifts?: number;
  /** For a change inside the notice window: the line saying it is a late change. */
  lateNote?: string;
}

/**
 * A shift's real start and end in the unit's zone, e.g. "Sun 29 Mar 2026, 21:00 – Mon 30 Mar 2026,
 * 07:00". Instants come from the roster model (right across midnight and daylight-saving changes),
 * then are written as wall-clock times of the unit's IANA zone.
 */
export function formatShiftTimes(
  shift: Pick<MailShift, 'day' | 'start' | 'end'>,
  period: { startDate: string; timeZone: string },
): string {
  const { start, end } = shiftInterval(period, shift.day, shift);
  const s = new TZDate(start, period.timeZone);
  const e = new TZDate(end, period.timeZone);
  const day = (d: Date) => format(d, 'EEE d MMM yyyy');
  const time = (d: Date) => format(d, 'HH:mm');
  return day(s) === day(e)
    ? `${day(s)}, ${time(s)}–${time(e)}`
    : `${day(s)}, ${time(s)} – ${day(e)}, ${time(e)}`;
}

/** The e-mail telling one person their own shifts of a period (no one else's data). */
export function rosterMail(p: RosterMailInput): MailContent {
  const range = dateRangeInWords(p.startDate, addDays(p.startDate, p.days - 1));
  const subject =
    p.kind === 'published'
      ? `Your roster for ${p.unitName}, ${range}`
      : `Your roster for ${p.unitName} has changed, ${range}`;
  const intro =
    p.kind === 'published'
      ? `The roster of ${p.unitName} for ${range} is published.`
      : `The published roster of ${p.unitName} for ${range} was changed. Your shifts are now:`;
  const zoneNote = `Times are in the unit's time zone, ${p.timeZone}.`;
  const lines = [...p.shifts]
    .sort((a, b) => a.day - b.day)
    .map((s) => `${formatShiftTimes(s, p)}  ${s.code} (${s.name})`);
  const none = 'You have no shifts in this period.';
  const open = p.openShifts ?? 0;
  const openLine =
    open > 0
      ? `${open === 1 ? 'One shift of this roster is' : `${open} shifts of this roster are`} still open and you could take ${open === 1 ? 'it' : 'them'} (you have the skill, are free that day and keep your contract's rules). See Open shifts in Rotaplex; a manager approves each claim.`
      : null;
  const text = [
    `Hello ${p.displayName},`,
    '',
    intro,
    zoneNote,
    '',
    ...(lines.length ? lines.map((l) => `- ${l}`) : [none]),
    '',
    ...(p.lateNote ? [p.lateNote, ''] : []),
    ...(openLine ? [openLine, ''] : []),
    `See the roster: ${p.link}`,
    '',
  ].join('\n');
  const html = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(subject)}</title></head>
<body style="font-family:'Open Sans',Arial,sans-serif;color:#1d2b2a;line-height:1.5;padding:24px">
<h1 style="font-size:20px;margin:0 0 16px">${escapeHtml(subject)}</h1>
<p style="margin:0 0 16px">Hello ${escapeHtml(p.displayName)},</p>
<p style="margin:0 0 16px">${escapeHtml(intro)} ${escapeHtml(zoneNote)}</p>
${
  lines.length
    ? `<ul style="margin:0 0 16px;padding-left:20px">\n${lines.map((l) => `<li>${escapeHtml(l)}</li>`).join('\n')}\n</ul>`
    : `<p style="margin:0 0 16px">${escapeHtml(none)}</p>`
}${p.lateNote ? `\n<p style="margin:0 0 16px">${escapeHtml(p.lateNote)}</p>` : ''}${openLine ? `\n<p style="margin:0 0 16px">${escapeHtml(openLine)}</p>` : ''}
<p style="margin:24px 0"><a href="${escapeHtml(p.link)}" style="background:#0f5c57;color:#ffffff;padding:10px 18px;border-radius:4px;text-decoration:none">See the roster</a></p>
</body></html>`;
  return { subject, text, html };
}
