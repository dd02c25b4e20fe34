import {
  type RedFlagDto,
  shiftRedFlags,
  type SolveRunResultDto,
  sortRedFlags,
  type UnmetNeedExplanationDto,
} from '@rotaplex/contracts';
import type { CoverLine, HoursLine } from './boardSummary';
import type { CellMarks } from './requestMarks';

/** How bad an unmet need is, worst first: nobody of a required skill, below minimum, below target. */
export type NeedSeverity = 'noneOfSkill' | 'belowMinimum' | 'belowTarget';

export interface GradedNeed {
  need: UnmetNeedExplanationDto;
  severity: NeedSeverity;
  /** People on the shift (with the skill) in the roster as it stands; null when the need is unknown. */
  count: number | null;
  min: number | null;
  target: number | null;
}

const ORDER: Record<NeedSeverity, number> = { noneOfSkill: 0, belowMinimum: 1, belowTarget: 2 };

/**
 * Grades the solve's unmet needs against the cover the board counts now: below the minimum when fewer
 * people are on the shift than its minimum (with none at all of a required skill the worst), otherwise
 * below the target. A need the board cannot find counts as below minimum, so it is never played down.
 * Worst first, then by date.
 */
export function gradeUnmetNeeds(
  needs: readonly UnmetNeedExplanationDto[],
  cover: readonly CoverLine[],
  dates: readonly string[],
): GradedNeed[] {
  const graded = needs.map((need): GradedNeed => {
    const line = cover.find(
      (l) => l.shiftType.id === need.shiftTypeId && (l.skill?.id ?? null) === need.skillId,
    );
    const day = line?.days[dates.indexOf(need.date)];
    if (!day?.need) return { need, severity: 'belowMinimum', count: null, min: null, target: null };
    const { min, target } = day.need;
    const severity: NeedSeverity =
      day.count >= min
        ? 'belowTarget'
        : need.skillId !== null && day.count === 0
          ? 'noneOfSkill'
          : 'belowMinimum';
    return { need, severity, count: day.count, min, target };
  });
  return graded.sort(
    (a, b) => ORDER[a.severity] - ORDER[b.severity] || a.need.date.localeCompare(b.need.date),
  );
}

/**
 * Red flags of safe staffing on the board as it stands (NICE SG1 2014; the rule and our reading of it
 * are in contracts' safe-staffing.ts, shared with the publish check): every line of a registered skill,
 * each date with a minimum, the people on the shift with the skill against that minimum. By date.
 */
export function boardRedFlags(cover: readonly CoverLine[], dates: readonly string[]): RedFlagDto[] {
  const out: RedFlagDto[] = [];
  for (const line of cover) {
    const skill = line.skill;
    if (!skill?.registered) continue;
    line.days.forEach((day, i) => {
      if (!day.need || day.need.min <= 0 || dates[i] === undefined) return;
      out.push(
        ...shiftRedFlags(
          {
            date: dates[i],
            shiftTypeId: line.shiftType.id,
            shiftCode: line.shiftType.code,
            shiftName: line.shiftType.name,
            paidMinutes: line.shiftType.paidMinutes,
          },
          [
            {
              skillId: skill.id,
              skillCode: skill.code,
              skillName: skill.name,
              need: day.need.min,
              onShift: day.count,
            },
          ],
        ),
      );
    });
  }
  return sortRedFlags(out);
}

/** The key of one cover cell of the board: a shift type, a skill (null: anyone) and a date. */
export const coverCellKey = (shiftTypeId: string, skillId: string | null, date: string): string =>
  `${shiftTypeId}|${skillId ?? ''}|${date}`;

/**
 * The red flags by the cover cell they stand on (coverCellKey), for marking the board's cover rows.
 * A cover row holds one skill, so a cell has at most one red flag.
 */
export function redFlagsByCell(flags: readonly RedFlagDto[]): Map<string, RedFlagDto> {
  return new Map(flags.map((f) => [coverCellKey(f.shiftTypeId, f.skillId, f.date), f]));
}

/**
 * A rule finding's message to show after the person's name: the checker starts most messages with the
 * name ("Agnieszka Nowak: …"), so a list that names the person first drops it from the message.
 */
export function findingMessage(message: string, name: string | undefined): string {
  return name && message.startsWith(`${name}: `) ? message.slice(name.length + 2) : message;
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** The relative gap in words with one rounding (0.1 percentage point), used on the face and in details. */
export function gapPercent(gap: number): string {
  return `${(Math.round(gap * 1000) / 10).toLocaleString('en-GB', { maximumFractionDigits: 1 })}%`;
}

export interface QualityInput {
  result: Pick<SolveRunResultDto, 'gap' | 'solverStatus' | 'staffing' | 'explanations' | 'objective'>;
  /** Hours against contract per person on the board now. */
  hours: ReadonlyMap<string, HoursLine>;
  /** Request marks per cell on the board now (undefined while they load). */
  marks?: ReadonlyMap<string, CellMarks>;
}

/**
 * The roster's quality in a ward manager's words: shifts below minimum, requests honoured, hours
 * against contract, and how much better a roster could be ("at most N% better is possible").
 */
export function qualityLine({ result, hours, marks }: QualityInput): string {
  if (result.objective === null) return 'No roster was found.';
  const parts: string[] = [];
  const short = result.staffing?.shiftsShort;
  if (short !== undefined) {
    parts.push(
      short === 0
        ? 'every shift has its minimum staff'
        : `${plural(short, 'shift is', 'shifts are')} below minimum staffing`,
    );
  }
  if (marks) {
    let total = 0;
    let honoured = 0;
    for (const m of marks.values()) {
      for (const r of m.requests) {
        total++;
        if (r.honoured) honoured++;
      }
    }
    if (total > 0) parts.push(`${honoured} of ${plural(total, 'request', 'requests')} honoured`);
  }
  let outside = 0;
  let withContract = 0;
  for (const h of hours.values()) {
    if (h.state === 'noContract') continue;
    withContract++;
    if (h.state !== 'within') outside++;
  }
  if (withContract > 0) {
    parts.push(
      outside === 0
        ? 'everyone is within contract hours'
        : `${plural(outside, 'person is', 'people are')} outside contract hours`,
    );
  }
  const gap = result.gap;
  parts.push(
    result.solverStatus === 'optimal' || (gap !== null && gap <= 0.0005)
      ? 'no better roster is possible'
      : gap === null || gap >= 1
        ? // A gap of 100% or more says nothing a manager can use: the proof had not got far.
          'how much better a roster could be is not known yet'
        : `at most ${gapPercent(gap)} better is possible`,
  );
  const sentence = parts.join('; ');
  return `${sentence.charAt(0).toUpperCase()}${sentence.slice(1)}.`;
}
