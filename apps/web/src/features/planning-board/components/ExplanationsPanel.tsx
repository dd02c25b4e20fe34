import { useState } from 'react';
import { Body1, Button, makeStyles, Subtitle2, tokens } from '@fluentui/react-components';
import type { ShiftTypeDto, SkillDto, SolveExplanationsDto } from '@rotaplex/contracts';
import { formatDay } from '../utils/days';

/** Items of each list shown before "Show all". */
const SHOWN = 5;

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS },
  list: { margin: 0, paddingLeft: tokens.spacingHorizontalXL },
  reasons: { margin: 0, paddingLeft: tokens.spacingHorizontalL, color: tokens.colorNeutralForeground2 },
});

export interface ExplanationsPanelProps {
  explanations: SolveExplanationsDto;
  shiftTypes: Map<string, ShiftTypeDto>;
  skills: Map<string, SkillDto>;
  staffNames: Map<string, string>;
}

/** Why the roster is not perfect: unmet needs, requests not honoured and conflicting rules. */
export function ExplanationsPanel({ explanations, shiftTypes, skills, staffNames }: ExplanationsPanelProps) {
  const styles = useStyles();
  const [all, setAll] = useState(false);
  const { conflicts } = explanations;
  const unmetNeeds = all ? explanations.unmetNeeds : explanations.unmetNeeds.slice(0, SHOWN);
  const requestsNotHonoured = all
    ? explanations.requestsNotHonoured
    : explanations.requestsNotHonoured.slice(0, SHOWN);
  const hidden =
    explanations.unmetNeeds.length -
    unmetNeeds.length +
    (explanations.requestsNotHonoured.length - requestsNotHonoured.length);
  return (
    <section className={styles.root} aria-label="Explanations">
      <Subtitle2 as="h3">Explanations</Subtitle2>
      {conflicts && (
        <div>
          <Body1 as="h4" block>
            Conflicting rules
          </Body1>
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
      <div>
        <Body1 as="h4" block>
          Unmet needs ({explanations.unmetNeeds.length})
        </Body1>
        {unmetNeeds.length === 0 ? (
          <Body1 as="p" block>
            Every minimum need is met.
          </Body1>
        ) : (
          <ul className={styles.list} aria-label="Unmet needs">
            {unmetNeeds.map((n) => (
              <li key={`${n.date}-${n.shiftTypeId}-${n.skillId ?? ''}`}>
                {formatDay(n.date)}, {shiftTypes.get(n.shiftTypeId)?.name ?? 'a shift'}
                {n.skillId ? ` (${skills.get(n.skillId)?.name ?? 'a skill'})` : ''}: {n.short} short
                <ul className={styles.reasons}>
                  {n.reasons.map((r) => (
                    <li key={r}>{r}</li>
                  ))}
                </ul>
              </li>
            ))}
          </ul>
        )}
      </div>
      <div>
        <Body1 as="h4" block>
          Requests not honoured ({explanations.requestsNotHonoured.length})
        </Body1>
        {requestsNotHonoured.length === 0 ? (
          <Body1 as="p" block>
            Every request is honoured.
          </Body1>
        ) : (
          <ul className={styles.list} aria-label="Requests not honoured">
            {requestsNotHonoured.map((r) => (
              <li key={`${r.staffMemberId}-${r.date}-${r.kind}`}>
                {staffNames.get(r.staffMemberId) ?? 'Someone'}, {formatDay(r.date)} ({r.kind})
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
