import { type OpenShiftDto, type RosterViolationDto } from '@rotaplex/contracts';
import { dateInWords } from '../common/text/date-words';
import { type OutgoingMail } from '../mail/mail.service';
import { escapeHtml } from '../mail/templates';

/** What each hard rule protects, in a staff member's words (rule names of the roster model). */
const RULE_WORDS: Record<string, string> = {
  minRest: 'Rest between shifts',
  forbiddenSuccession: 'Shift order',
  maxPaidMinutes: 'Hours',
  minPaidMinutes: 'Hours',
  maxConsecutiveWorkDays: 'Days in a row',
  minConsecutiveWorkDays: 'Days in a row',
  minConsecutiveDaysOff: 'Days off in a row',
  maxConsecutiveNights: 'Nights in a row',
  maxWeekends: 'Weekends',
  maxShiftsPerType: 'Shifts of this kind',
  absence: 'Leave or unavailability',
  oneShiftPerDay: 'One shift a day',
  pin: 'A fixed shift',
};

/**
 * One checker finding as a reason a person may not take a shift: "Rest between shifts: only 8 h 30 min
 * of rest between L on Fri 1 Jan 2027 and …", without the person's own name and with dates in words.
 */
export function ruleInWords(v: Pick<RosterViolationDto, 'rule' | 'message'>, name: string): string {
  const who = name.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  const message = v.message
    .replace(new RegExp(`^${who}:\\s*`), '')
    .replace(new RegExp(`\\b${who} is\\b`, 'g'), 'you are')
    .replace(new RegExp(`\\b${who} has\\b`, 'g'), 'you have')
    .replace(new RegExp(`\\b${who}\\b`, 'g'), 'you');
  return `${RULE_WORDS[v.rule] ?? 'A rule of your contract'}: ${checkerWords(message)}`;
}

/**
 * A checker finding about a shift someone would take, in plain words: "would have" for the shift
 * taken, dates in words, and no "day(s)".
 */
export function checkerWords(message: string): string {
  return message
    .replace(/\bbut has shift\b/g, 'but would have shift')
    .replace(/\b(\d{4}-\d{2}-\d{2})\b/g, (d) => dateInWords(d))
    .replace(/\b1 day\(s\)/g, '1 day')
    .replace(/\bday\(s\)/g, 'days');
}

/** The e-mail that tells one person about an open shift they may take (their unit's local times). */
export function openShiftMail(
  person: { name: string; email: string | null },
  shift: OpenShiftDto,
  unit: { name: string; timeZone: string },
  publicUrl: string | null,
): OutgoingMail {
  const when = `${shift.shiftName} ${shift.start}-${shift.end} on ${dateInWords(shift.date)}`;
  const subject = `Open shift you could take: ${when}`;
  const url = `${publicUrl ?? ''}/open-shifts`;
  const lines = [
    `Hello ${person.name},`,
    `${unit.name} has an open shift: ${when}${shift.skillCode ? ` (needs ${shift.skillCode})` : ''}.`,
    'You have the skill, are free that day, and taking it keeps the rules of your contract. A manager approves each claim.',
    `Times are in the unit's time zone (${unit.timeZone}).`,
  ];
  const text = [...lines, `See the open shifts: ${url}`].join('\n\n');
  const html = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(subject)}</title></head>
<body style="font-family:'Open Sans',Arial,sans-serif;color:#1d2b2a;line-height:1.5;padding:24px">
<h1 style="font-size:20px;margin:0 0 16px">${escapeHtml(subject)}</h1>
${lines.map((l) => `<p style="margin:0 0 16px">${escapeHtml(l)}</p>`).join('\n')}
<p style="margin:24px 0"><a href="${escapeHtml(url)}">See the open shifts</a></p>
</body></html>`;
  return { to: person.email ?? '', subject, text: `${text}\n`, html };
}
