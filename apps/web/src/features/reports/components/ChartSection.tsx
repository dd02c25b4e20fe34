import { useId, type ReactNode } from 'react';
import { Body1, makeStyles, mergeClasses, Subtitle1, tokens } from '@fluentui/react-components';

const useCardStyles = makeStyles({
  root: {
    backgroundColor: tokens.colorNeutralBackground1,
    borderRadius: tokens.borderRadiusLarge,
    boxShadow: tokens.shadow2,
    padding: tokens.spacingHorizontalL,
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalM,
  },
});

export interface ReportCardProps {
  title: string;
  /** Extra class of the card (how it handles content wider than itself). */
  className: string;
  children: ReactNode;
}

/** A report's card: a section named by its "h2" title. */
export function ReportCard({ title, className, children }: ReportCardProps) {
  const styles = useCardStyles();
  const headingId = useId();
  return (
    <section className={mergeClasses(styles.root, className)} aria-labelledby={headingId}>
      <Subtitle1 as="h2" id={headingId}>
        {title}
      </Subtitle1>
      {children}
    </section>
  );
}

const useStyles = makeStyles({
  root: { minWidth: 0 },
  summary: { color: tokens.colorNeutralForeground2 },
  chart: { width: '100%', minWidth: 0 },
  details: {
    '& > summary': {
      cursor: 'pointer',
      color: tokens.colorBrandForegroundLink,
      fontWeight: tokens.fontWeightSemibold,
      paddingBlock: tokens.spacingVerticalXS,
    },
  },
  table: { overflowX: 'auto', marginTop: tokens.spacingVerticalS },
});

export interface ChartSectionProps {
  title: string;
  /** The chart's message in a sentence: the text alternative read before the chart. */
  summary: ReactNode;
  chart: ReactNode;
  /** The chart's numbers as a table (shown on request). */
  table: ReactNode;
}

/**
 * A chart with its title, a sentence that says what it shows, and the same numbers as a table, so
 * the figures are there for people who cannot see or read the chart (WCAG 2.2, 1.1.1 Non-text Content).
 */
export function ChartSection({ title, summary, chart, table }: ChartSectionProps) {
  const styles = useStyles();
  return (
    <ReportCard title={title} className={styles.root}>
      <Body1 className={styles.summary}>{summary}</Body1>
      <div className={styles.chart} role="img" aria-label={`Chart: ${title}`}>
        {chart}
      </div>
      <details className={styles.details}>
        <summary>Show the figures as a table</summary>
        <div className={styles.table}>{table}</div>
      </details>
    </ReportCard>
  );
}
