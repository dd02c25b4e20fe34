import { useState } from 'react';
import {
  Body1,
  Button,
  makeStyles,
  MessageBar,
  MessageBarBody,
  Subtitle2,
  tokens,
} from '@fluentui/react-components';
import type { RosterViolationDto } from '@rotaplex/contracts';
import { findingMessage } from '../utils/boardQuality';
import { formatDay } from '../utils/days';

const useStyles = makeStyles({
  list: {
    margin: 0,
    paddingLeft: tokens.spacingHorizontalXL,
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalXS,
  },
  root: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS },
});

/** The checker's findings, each with its dates, and the fatigue warning beside any rest finding. */
export function ViolationList({
  violations,
  label,
  names,
}: {
  violations: RosterViolationDto[];
  label: string;
  names?: Map<string, string>;
}) {
  const styles = useStyles();
  return (
    <ul className={styles.list} aria-label={label}>
      {violations.map((v, i) => (
        <li key={`${v.rule}-${v.staffMemberId}-${v.dates.join()}-${i}`}>
          {names && <strong>{names.get(v.staffMemberId) ?? 'Someone'}: </strong>}
          {names ? findingMessage(v.message, names.get(v.staffMemberId)) : v.message}
          {v.dates.length > 0 && ` (${v.dates.map(formatDay).join(', ')})`}
          {v.warning && (
            <MessageBar intent="warning">
              <MessageBarBody>{v.warning}</MessageBarBody>
            </MessageBar>
          )}
        </li>
      ))}
    </ul>
  );
}

/** All findings of the checker on the roster as it is now. */
export function ViolationsPanel({
  violations,
  names,
}: {
  violations: RosterViolationDto[];
  names: Map<string, string>;
}) {
  const styles = useStyles();
  const [all, setAll] = useState(false);
  const shown = all ? violations : violations.slice(0, 20);
  return (
    <section className={styles.root} aria-label="Rule findings">
      <Subtitle2 as="h2">Rule findings ({violations.length})</Subtitle2>
      {violations.length === 0 ? (
        <Body1>The roster breaks no rule of the contracts.</Body1>
      ) : (
        <ViolationList violations={shown} label="Rule findings on the roster" names={names} />
      )}
      {(all || shown.length < violations.length) && (
        <div>
          <Button onClick={() => setAll(!all)}>
            {all ? 'Show fewer' : `Show all (${violations.length - shown.length} more)`}
          </Button>
        </div>
      )}
    </section>
  );
}
