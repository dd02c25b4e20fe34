import { Body1, Caption1, makeStyles, Subtitle1, Subtitle2, tokens } from '@fluentui/react-components';
import type { MyRosterShiftDto } from '@rotaplex/contracts';
import { SHIFT_COLOUR_TOKENS } from '@/features/planning/utils/shiftColours';
import { dayLabel } from '@/features/swaps/utils/swapText';
import { agendaDays, nextShifts, shiftWhen } from '../utils/agenda';

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
  next: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalXS,
    padding: tokens.spacingHorizontalL,
    borderRadius: tokens.borderRadiusLarge,
    backgroundColor: tokens.colorBrandBackground2,
    border: `${tokens.strokeWidthThin} solid ${tokens.colorBrandStroke2}`,
  },
  list: { listStyleType: 'none', margin: 0, padding: 0, display: 'grid', gap: tokens.spacingVerticalS },
  day: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXS },
  shift: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalXXS,
    padding: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalM}`,
    borderRadius: tokens.borderRadiusMedium,
    borderLeftWidth: tokens.strokeWidthThickest,
    borderLeftStyle: 'solid',
    backgroundColor: tokens.colorNeutralBackground1,
    boxShadow: tokens.shadow2,
  },
  muted: { color: tokens.colorNeutralForeground3 },
});

export interface MyRosterAgendaProps {
  /** Published shifts of mine and my colleagues' over the days shown. */
  shifts: readonly MyRosterShiftDto[];
  now: Date;
}

/** Who else works the same shift that day (names only, as the team roster shows them). */
function colleaguesOn(all: readonly MyRosterShiftDto[], s: MyRosterShiftDto): string[] {
  return all
    .filter((o) => !o.mine && o.unitId === s.unitId && o.date === s.date && o.shiftCode === s.shiftCode)
    .map((o) => o.name);
}

/** My next shift first, then my upcoming shifts by day: the phone's view of My roster. */
export function MyRosterAgenda({ shifts, now }: MyRosterAgendaProps) {
  const styles = useStyles();
  const upcoming = nextShifts(shifts, now);
  const [next] = upcoming;
  if (!next) {
    return <Body1>You have no published shifts in the coming weeks.</Body1>;
  }
  const team = colleaguesOn(shifts, next);
  return (
    <div className={styles.root}>
      <section className={styles.next} aria-label="Your next shift" data-testid="next-shift">
        <Caption1>Your next shift</Caption1>
        <Subtitle1 as="p">{shiftWhen(next)}</Subtitle1>
        <Body1>
          {next.shiftName} ({next.shiftCode}), {next.unitName}
        </Body1>
        {team.length > 0 && <Caption1 className={styles.muted}>With {team.join(', ')}</Caption1>}
      </section>
      <section aria-label="Your upcoming shifts">
        <ul className={styles.list}>
          {agendaDays(upcoming).map((day) => (
            <li key={day.date} className={styles.day}>
              <Subtitle2 as="h3">{dayLabel(day.date)}</Subtitle2>
              {day.shifts.map((s) => {
                const others = colleaguesOn(shifts, s);
                return (
                  <div
                    key={s.start}
                    className={styles.shift}
                    style={{ borderLeftColor: SHIFT_COLOUR_TOKENS[s.colour].border }}
                  >
                    <Body1>
                      <strong>{shiftWhen(s)}</strong>
                    </Body1>
                    <Body1>
                      {s.shiftName} ({s.shiftCode}), {s.unitName}
                    </Body1>
                    {others.length > 0 && (
                      <Caption1 className={styles.muted}>With {others.join(', ')}</Caption1>
                    )}
                  </div>
                );
              })}
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
