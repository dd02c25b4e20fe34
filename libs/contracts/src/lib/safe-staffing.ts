/**
 * Red flags of safe staffing for registered (licensed) skills, from NICE safe-staffing guideline SG1
 * (2014, adult inpatient wards in England), as quoted in the product brief (PRODUCT.md, "Safe
 * staffing"): "red flags include fewer than 2 registered nurses on a shift, or a registered-nurse
 * shortfall of more than 8 hours or 25% of the shift's need".
 *
 * One rule, used by the publish check (API) and the planning board and home page (web).
 *
 * Our reading of the guideline, in the terms of a roster:
 * - "The shift's need" of a registered skill is the shift's minimum cover of that skill: the number
 *   the ward itself says a safe shift needs. (The target is what the ward would like; falling short
 *   of it is not treated as a red flag.)
 * - "Fewer than 2 registered nurses on a shift" applies to a shift whose minimum of the registered
 *   skill is at least 2. A ward that plans a shift with 1 of a registered skill has decided locally
 *   that the guideline's two-nurse floor does not apply there (a small unit, a skill that is not
 *   nursing); we do not flag it, and the caution below says local policy decides.
 * - The shortfall in hours is the people short times the shift's paid hours; in share, the people
 *   short over the shift's need. "More than" is strict: exactly 8 hours or exactly 25% is not a red
 *   flag.
 */

/** NICE SG1 (2014) via PRODUCT.md: fewer than this many registered nurses on a shift is a red flag. */
export const RED_FLAG_MIN_REGISTERED = 2;
/** NICE SG1 (2014) via PRODUCT.md: a registered shortfall of more than this many hours is a red flag. */
export const RED_FLAG_SHORTFALL_HOURS = 8;
/** NICE SG1 (2014) via PRODUCT.md: a registered shortfall of more than this share of the need is a red flag. */
export const RED_FLAG_SHORTFALL_SHARE = 0.25;

/** Which red-flag rule a shift breaks. */
export const RED_FLAG_RULES = ['fewerThanTwo', 'shortfallHours', 'shortfallShare'] as const;
export type RedFlagRule = (typeof RED_FLAG_RULES)[number];

/** Where the red flags come from, said once wherever they are shown. */
export const RED_FLAG_SOURCE = 'NICE safe-staffing guideline SG1';

/**
 * The caution shown with red flags: whom the guideline is for, who decides, and the usual advice.
 */
export const RED_FLAG_CAUTION =
  'Red flags follow the NICE safe-staffing guideline SG1 (2014), written for adult inpatient wards in ' +
  'England; local policy and the judgement of the registered professionals in charge decide what is ' +
  'safe for your ward. Where a red flag stands, ask for bank or agency staff and escalate as your ' +
  'local policy says.';

/** A shift of a roster: its date and shift type (with paid minutes). */
export interface RedFlagShift {
  date: string;
  shiftTypeId: string;
  shiftCode: string;
  shiftName: string;
  paidMinutes: number;
}

/** The cover of one registered skill on the shift: its minimum (the need) and the people on it. */
export interface RegisteredSkillCover {
  skillId: string;
  skillCode: string;
  skillName: string;
  /** The shift's minimum cover of the skill. */
  need: number;
  /** People on the shift who have the skill. */
  onShift: number;
}

/** A red flag on one shift for one registered skill, with the rules it breaks and the words. */
export interface RedFlagDto {
  date: string;
  shiftTypeId: string;
  shiftCode: string;
  shiftName: string;
  skillId: string;
  skillCode: string;
  skillName: string;
  need: number;
  onShift: number;
  /** People short times the shift's paid hours. */
  shortHours: number;
  /** People short over the need (0-1). */
  shortShare: number;
  rules: RedFlagRule[];
  /** The red flag in words, e.g. "Sat 9 Jan, Night, Registered nurse (RN): 1 on the shift of 2 needed (…)". */
  text: string;
}

const dayFormat = new Intl.DateTimeFormat('en-GB', {
  weekday: 'short',
  day: 'numeric',
  month: 'short',
  timeZone: 'UTC',
});

const hoursText = (h: number) => `${Number(h.toFixed(2)).toLocaleString('en-GB')} h`;

/** The rules a registered skill's cover on a shift breaks (empty: no red flag). */
export function redFlagRules(need: number, onShift: number, paidMinutes: number): RedFlagRule[] {
  const rules: RedFlagRule[] = [];
  const short = Math.max(0, need - onShift);
  if (need >= RED_FLAG_MIN_REGISTERED && onShift < RED_FLAG_MIN_REGISTERED) rules.push('fewerThanTwo');
  // Compare in minutes (whole numbers) so exactly 8 h is never more than 8 h by rounding.
  if (short * paidMinutes > RED_FLAG_SHORTFALL_HOURS * 60) rules.push('shortfallHours');
  // short / need > 1/4  <=>  4 short > need (whole numbers, no rounding).
  if (need > 0 && short / RED_FLAG_SHORTFALL_SHARE > need) rules.push('shortfallShare');
  return rules;
}

/**
 * The red flags of one shift of a roster, one per registered skill that breaks a rule, in the order
 * of `covers`. Only registered skills belong in `covers`.
 */
export function shiftRedFlags(shift: RedFlagShift, covers: readonly RegisteredSkillCover[]): RedFlagDto[] {
  const out: RedFlagDto[] = [];
  for (const c of covers) {
    const rules = redFlagRules(c.need, c.onShift, shift.paidMinutes);
    if (rules.length === 0) continue;
    const short = Math.max(0, c.need - c.onShift);
    const shortHours = (short * shift.paidMinutes) / 60;
    const shortShare = c.need > 0 ? short / c.need : 0;
    const words: string[] = [];
    if (rules.includes('fewerThanTwo')) words.push(`fewer than ${RED_FLAG_MIN_REGISTERED} on the shift`);
    if (rules.includes('shortfallHours'))
      words.push(`${hoursText(shortHours)} short, more than ${RED_FLAG_SHORTFALL_HOURS} h`);
    if (rules.includes('shortfallShare'))
      words.push(
        `${Math.round(shortShare * 100)}% of the need short, more than ${RED_FLAG_SHORTFALL_SHARE * 100}%`,
      );
    const day = dayFormat.format(new Date(`${shift.date}T00:00:00Z`));
    out.push({
      date: shift.date,
      shiftTypeId: shift.shiftTypeId,
      shiftCode: shift.shiftCode,
      shiftName: shift.shiftName,
      skillId: c.skillId,
      skillCode: c.skillCode,
      skillName: c.skillName,
      need: c.need,
      onShift: c.onShift,
      shortHours,
      shortShare,
      rules,
      text:
        `${day}, ${shift.shiftName}, ${c.skillName} (${c.skillCode}): ${c.onShift} on the shift of ` +
        `${c.need} needed (${words.join('; ')})`,
    });
  }
  return out;
}

/** Red flags by date, then shift code, then skill code. */
export function sortRedFlags<T extends Pick<RedFlagDto, 'date' | 'shiftCode' | 'skillCode'>>(
  flags: T[],
): T[] {
  return flags.sort(
    (a, b) =>
      a.date.localeCompare(b.date) ||
      a.shiftCode.localeCompare(b.shiftCode) ||
      a.skillCode.localeCompare(b.skillCode),
  );
}
