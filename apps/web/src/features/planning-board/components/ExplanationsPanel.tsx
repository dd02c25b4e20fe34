import { useState } from 'react';
import { Body1, Button, makeStyles, Subtitle2, tokens } from '@fluentui/react-components';
import {
  DATE_REQUEST_KIND_LABELS,
  type DateRequestKind,
  RED_FLAG_CAUTION,
  RED_FLAG_SOURCE,
  type RedFlagDto,
  type ShiftTypeDto,
  type SkillDto,
  type SolveExplanationsDto,
} from '@rotaplex/contracts';
import { formatDay } from '../utils/days';
import type { GradedNeed, NeedSeverity } from '../utils/boardQuality';

/** Items of each list shown before "Show all". */
const SHOWN = 5;

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  list: { margin: 0, paddingLeft: tokens.spacingHorizontalXL },
  reasons: { margin: 0, paddingLeft: tokens.spacingHorizontalL, color: tokens.colorNeutralForeground2 },
  severe: { color: tokens.colorPaletteRedForeground1, fontWeight: tokens.fontWeightSemibold },
});

export interface ExplanationsPanelProps {
  explanations: SolveExplanationsDto;
  /** The unmet needs graded against the board's cover, worst first. */
  graded: GradedNeed[];
  /** Red flags of safe staffing on the board as it stands (NICE SG1), by date: listed first. */
  redFlags: RedFlagDto[];
  shiftTypes: Map<string, ShiftTypeDto>;
  skills: Map<string, SkillDto>;
  staffNames: Map<string, string>;
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

function needText(g: GradedNeed, shiftTypes: Map<string, ShiftTypeDto>, skills: Map<string, SkillDto>) {
  const shift = shiftTypes.get(g.need.shiftTypeId)?.name ?? 'A shift';
  const skill = g.need.skillId ? (skills.get(g.need.skillId)?.name ?? 'the required skill') : null;
  const who = skill ? `with ${skill}` : 'in all';
  const figures =
    g.count === null
      ? `${plural(g.need.short, 'person', 'people')} short`
      : g.severity === 'belowTarget'
        ? `${g.count} ${who} on, target ${g.target}`
        : `${g.count} ${who} on, minimum ${g.min}`;
  const lead = g.severity === 'noneOfSkill' ? `nobody with ${skill}, minimum ${g.min}` : figures;
  return `${formatDay(g.need.date)}, ${shift}: ${lead}`;
}

const GROUPS: { severity: NeedSeverity[]; title: string; empty: string }[] = [
  {
    severity: ['noneOfSkill', 'belowMinimum'],
    title: 'Below minimum staffing',
    empty: 'Every shift has its minimum staff.',
  },
  { severity: ['belowTarget'], title: 'Below target (minimum met)', empty: 'Every target is met.' },
];

/** Why the roster is not perfect: unmet needs by severity, requests not honoured and conflicting rules. */
export function ExplanationsPanel({
  explanations,
  graded,
  redFlags,
  shiftTypes,
  skills,
  staffNames,
}: ExplanationsPanelProps) {
  const styles = useStyles();
  const [all, setAll] = useState(false);
  const { conflicts } = explanations;
  const cut = <T,>(items: T[]) => (all ? items : items.slice(0, SHOWN));
  const groups = GROUPS.map((g) => ({ ...g, items: graded.filter((n) => g.severity.includes(n.severity)) }));
  const requestsNotHonoured = cut(explanations.requestsNotHonoured);
  const flags = cut(redFlags);
  const hidden =
    redFlags.length -
    flags.length +
    groups.reduce((sum, g) => sum + g.items.length - cut(g.items).length, 0) +
    (explanations.requestsNotHonoured.length - requestsNotHonoured.length);
  const kindText = (kind: string) =>
    DATE_REQUEST_KIND_LABELS[kind as DateRequestKind]?.toLowerCase() ?? 'request';
  return (
    <section className={styles.root} aria-label="Explanations">
      {redFlags.length > 0 && (
        <div>
          <Subtitle2 as="h3" block className={styles.severe}>
            Red flags of safe staffing ({redFlags.length})
          </Subtitle2>
          <ul className={styles.list} aria-label="Red flags">
            {flags.map((f) => (
              <li key={`${f.date}-${f.shiftTypeId}-${f.skillId}`}>
                <span className={styles.severe}>Red flag ({RED_FLAG_SOURCE}):</span> {f.text}
              </li>
            ))}
          </ul>
          <Body1 as="p" block>
            {RED_FLAG_CAUTION}
          </Body1>
        </div>
      )}
      {conflicts && (
        <div>
          <Subtitle2 as="h3" block>
            Conflicting rules
          </Subtitle2>
          <Body1 as="p" block>
            {conflicts.summary}
          </Body1>
          <ul className={styles.list}>
            {conflicts.rules.map((rule) => (
              <li key={rule}>{rule}</li>
            ))}
          </ul>
        </div>
      )}
      <Subtitle2 as="h3" block>
        Unmet needs ({graded.length}): {groups[0].items.length} below minimum, {groups[1].items.length} below
        target
      </Subtitle2>
      {groups.map((group, i) => (
        <div key={group.title}>
          <Body1 as="h4" block className={i === 0 && group.items.length > 0 ? styles.severe : undefined}>
            {group.title} ({group.items.length})
          </Body1>
          {group.items.length === 0 ? (
            <Body1 as="p" block>
              {group.empty}
            </Body1>
          ) : (
            <ul className={styles.list} aria-label={group.title}>
              {cut(group.items).map((n) => (
                <li key={`${n.need.date}-${n.need.shiftTypeId}-${n.need.skillId ?? ''}`}>
                  {needText(n, shiftTypes, skills)}
                  <ul className={styles.reasons}>
                    {n.need.reasons.map((r) => (
                      <li key={r}>{r}</li>
                    ))}
                  </ul>
                </li>
              ))}
            </ul>
          )}
        </div>
      ))}
      <div>
        <Subtitle2 as="h3" block>
          Requests not honoured ({explanations.requestsNotHonoured.length})
        </Subtitle2>
        {requestsNotHonoured.length === 0 ? (
          <Body1 as="p" block>
            Every request is honoured.
          </Body1>
        ) : (
          <ul className={styles.list} aria-label="Requests not honoured">
            {requestsNotHonoured.map((r) => (
              <li key={`${r.staffMemberId}-${r.date}-${r.kind}`}>
                {staffNames.get(r.staffMemberId) ?? 'Someone'}, {formatDay(r.date)}: {kindText(r.kind)}
                <ul className={styles.reasons}>
                  {r.reasons.map((reason) => (
                    <li key={reason}>{reason}</li>
                  ))}
                </ul>
              </li>
            ))}
          </ul>
        )}
      </div>
      {(hidden > 0 || all) && (
        <div>
          <Button onClick={() => setAll(!all)}>{all ? 'Show fewer' : `Show all (${hidden} more)`}</Button>
        </div>
      )}
    </section>
  );
}
