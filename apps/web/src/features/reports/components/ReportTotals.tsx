import { Caption1, makeStyles, Subtitle2, tokens } from '@fluentui/react-components';
import type { CoverReportRowDto, ReportTotalsDto } from '@rotaplex/contracts';
import { formatCost, formatHours, shiftsBelowMinimum } from '../utils/reportFigures';

const useStyles = makeStyles({
  list: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(11rem, 1fr))',
    gap: tokens.spacingHorizontalM,
    margin: 0,
  },
  item: {
    backgroundColor: tokens.colorNeutralBackground1,
    borderRadius: tokens.borderRadiusMedium,
    boxShadow: tokens.shadow2,
    padding: tokens.spacingHorizontalM,
    display: 'flex',
    flexDirection: 'column-reverse',
    gap: tokens.spacingVerticalXXS,
  },
  label: { color: tokens.colorNeutralForeground3 },
  value: { margin: 0 },
});

/** The period's headline figures, as a description list (term: label, definition: value). */
export function ReportTotals({
  totals,
  cover,
}: {
  totals: ReportTotalsDto;
  cover: readonly CoverReportRowDto[];
}) {
  const styles = useStyles();
  const below = shiftsBelowMinimum(cover);
  const items: [string, string][] = [
    ['Shifts', String(totals.shifts)],
    ['Paid hours', formatHours(totals.paidMinutes)],
    [
      'Labour cost',
      `${formatCost(totals.labourCost)}${totals.peopleWithoutCost ? ` (${totals.peopleWithoutCost} without a rate)` : ''}`,
    ],
    ['Needs at minimum', `${totals.needsMetMin} of ${totals.needs}`],
    ['Needs at target', `${totals.needsMetTarget} of ${totals.needs}`],
    [
      'Shifts below minimum',
      below.shifts
        ? `${below.shifts} (${below.missing} ${below.missing === 1 ? 'person' : 'people'} missing)`
        : '0',
    ],
    ['Requests honoured', `${totals.requestsHonoured} of ${totals.requests}`],
    ['Night shifts', String(totals.nights)],
    ['Rule findings', String(totals.violations)],
  ];
  return (
    <dl className={styles.list} aria-label="Totals">
      {items.map(([label, value]) => (
        <div key={label} className={styles.item}>
          <dd className={styles.value}>
            <Subtitle2>{value}</Subtitle2>
          </dd>
          <dt>
            <Caption1 className={styles.label}>{label}</Caption1>
          </dt>
        </div>
      ))}
    </dl>
  );
}
