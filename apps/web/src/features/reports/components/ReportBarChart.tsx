import { Bar, BarChart, CartesianGrid, Legend, Tooltip, XAxis, YAxis } from 'recharts';
import { CHART_COLOURS, legendText, rowsHeight } from './chartTheme';

/** One series of bars: the row field it reads, its legend name and its colour. */
export interface BarSeries {
  dataKey: string;
  name: string;
  fill: string;
}

export interface ReportBarChartProps {
  rows: readonly object[];
  /**
   * 'people': one row of bars per person, names down the side (`name` field), values along the bottom;
   * 'days': one stacked column per day (`label` field), values up the side.
   */
  by: 'people' | 'days';
  bars: readonly BarSeries[];
  /** Extra settings of the value axis: a unit, or whole numbers only. */
  valueAxis?: { unit?: string; allowDecimals?: boolean };
}

/** The reports' bar chart: theme colours, a grid across the values, a tooltip and a legend. */
export function ReportBarChart({ rows, by, bars, valueAxis = {} }: ReportBarChartProps) {
  const people = by === 'people';
  return (
    <BarChart
      data={[...rows]}
      {...(people ? { layout: 'vertical' as const } : {})}
      responsive
      accessibilityLayer={false}
      style={{ width: '100%', height: people ? rowsHeight(rows.length) : '20rem' }}
      margin={{ left: people ? 8 : 0, right: 16 }}
    >
      {people ? (
        <CartesianGrid stroke={CHART_COLOURS.grid} horizontal={false} />
      ) : (
        <CartesianGrid stroke={CHART_COLOURS.grid} vertical={false} />
      )}
      {people ? (
        <XAxis type="number" {...valueAxis} stroke={CHART_COLOURS.text} />
      ) : (
        <XAxis dataKey="label" stroke={CHART_COLOURS.text} />
      )}
      {people ? (
        <YAxis type="category" dataKey="name" width={140} interval={0} stroke={CHART_COLOURS.text} />
      ) : (
        <YAxis {...valueAxis} stroke={CHART_COLOURS.text} />
      )}
      <Tooltip />
      <Legend formatter={legendText} />
      {bars.map((bar) => (
        <Bar
          key={bar.dataKey}
          {...bar}
          {...(people ? {} : { stackId: 'by-day' })}
          isAnimationActive={false}
        />
      ))}
    </BarChart>
  );
}
