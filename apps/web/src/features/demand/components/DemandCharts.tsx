import type { ReactNode } from 'react';
import { TableCell, TableRow } from '@fluentui/react-components';
import {
  Bar,
  CartesianGrid,
  ComposedChart,
  Legend,
  Line,
  LineChart,
  ReferenceLine,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import { ChartSection } from '@/features/reports/components/ChartSection';
import { CHART_COLOURS, legendText } from '@/features/reports/components/chartTheme';
import { DataTable } from '@/ui/DataTable';
import { rosteredShortfall, type IntervalPoint } from '../utils/demandFigures';
import { DEMAND_COLOURS } from './demandColours';

const fmt = (n: number | null, digits = 1) =>
  n === null ? '–' : Number.isInteger(n) ? String(n) : n.toFixed(digits);

export interface DemandCoverChartProps {
  title: string;
  points: readonly IntervalPoint[];
  /** Compact: no contacts bars, a lower chart (the planning board's panel). */
  compact?: boolean;
  /** Said after the summary (a link to more). */
  extra?: ReactNode;
}

/**
 * Demand (contacts, bars on their own axis), the requirement after shrinkage, the plan's people and
 * the rostered people per interval (step lines), with the same numbers as a table.
 */
export function DemandCoverChart({ title, points, compact = false, extra }: DemandCoverChartProps) {
  const short = rosteredShortfall(points);
  const contacts = points.reduce((s, p) => s + p.contacts, 0);
  const peak = points.reduce((m, p) => Math.max(m, p.required), 0);
  const summary =
    `${fmt(contacts, 0)} contacts; the requirement peaks at ${peak} people. ` +
    (short.intervals === 0
      ? 'The rostered people meet the requirement in every interval.'
      : `The rostered people are below the requirement in ${short.intervals} of ${points.length} intervals (${short.people} person-intervals short).`);
  return (
    <ChartSection
      title={title}
      summary={
        <>
          {summary}
          {extra && <> {extra}</>}
        </>
      }
      chart={
        <ComposedChart
          data={[...points]}
          responsive
          accessibilityLayer={false}
          style={{ width: '100%', height: compact ? '12rem' : '20rem' }}
          margin={{ left: 8, right: 16 }}
        >
          <CartesianGrid stroke={CHART_COLOURS.grid} vertical={false} />
          <XAxis dataKey="label" stroke={CHART_COLOURS.text} interval="preserveStartEnd" minTickGap={16} />
          <YAxis yAxisId="people" allowDecimals={false} stroke={CHART_COLOURS.text} width={32} />
          {!compact && (
            <YAxis yAxisId="contacts" orientation="right" stroke={CHART_COLOURS.text} width={40} />
          )}
          <Tooltip />
          <Legend formatter={legendText} />
          {!compact && (
            <Bar
              yAxisId="contacts"
              dataKey="contacts"
              name="Contacts (right axis)"
              fill={DEMAND_COLOURS.contacts}
              isAnimationActive={false}
            />
          )}
          <Line
            yAxisId="people"
            type="stepAfter"
            dataKey="required"
            name="Requirement"
            stroke={DEMAND_COLOURS.required}
            strokeWidth={2}
            dot={false}
            isAnimationActive={false}
          />
          {!compact && (
            <Line
              yAxisId="people"
              type="stepAfter"
              dataKey="planned"
              name="Plan"
              stroke={DEMAND_COLOURS.planned}
              strokeDasharray="6 3"
              dot={false}
              isAnimationActive={false}
            />
          )}
          <Line
            yAxisId="people"
            type="stepAfter"
            dataKey="rostered"
            name="Rostered"
            stroke={DEMAND_COLOURS.rostered}
            strokeWidth={2}
            dot={false}
            isAnimationActive={false}
          />
        </ComposedChart>
      }
      table={
        <DataTable
          label={`${title}: figures`}
          columns={['Interval', 'Contacts', 'Agents (Erlang C)', 'Required', 'Plan', 'Rostered']}
          size="small"
        >
          {points.map((p) => (
            <TableRow key={p.start}>
              <TableCell>{p.label}</TableCell>
              <TableCell>{fmt(p.contacts)}</TableCell>
              <TableCell>{p.agents}</TableCell>
              <TableCell>{p.required}</TableCell>
              <TableCell>{p.planned}</TableCell>
              <TableCell>{p.rostered}</TableCell>
            </TableRow>
          ))}
        </DataTable>
      }
    />
  );
}

export interface ServiceLevelChartProps {
  title: string;
  points: readonly IntervalPoint[];
  targetPercent: number;
  targetSeconds: number;
}

/** Service level per interval of the rostered people (after shrinkage) against the target line. */
export function ServiceLevelChart({ title, points, targetPercent, targetSeconds }: ServiceLevelChartProps) {
  const measured = points.filter((p) => p.serviceLevel !== null);
  const below = measured.filter((p) => (p.serviceLevel ?? 0) < targetPercent).length;
  const summary = measured.length
    ? `Target: ${targetPercent}% of contacts answered within ${targetSeconds} s. With the people rostered now, ${below} of ${measured.length} intervals with contacts fall below it.`
    : 'No interval of this stretch has contacts.';
  return (
    <ChartSection
      title={title}
      summary={summary}
      chart={
        <LineChart
          data={[...points]}
          responsive
          accessibilityLayer={false}
          style={{ width: '100%', height: '16rem' }}
          margin={{ left: 8, right: 16 }}
        >
          <CartesianGrid stroke={CHART_COLOURS.grid} vertical={false} />
          <XAxis dataKey="label" stroke={CHART_COLOURS.text} interval="preserveStartEnd" minTickGap={16} />
          <YAxis domain={[0, 100]} unit="%" stroke={CHART_COLOURS.text} width={44} />
          <Tooltip />
          <Legend formatter={legendText} />
          <ReferenceLine
            y={targetPercent}
            stroke={DEMAND_COLOURS.target}
            strokeDasharray="4 4"
            label={{
              value: `Target ${targetPercent}%`,
              position: 'insideBottomLeft',
              fill: CHART_COLOURS.text,
            }}
          />
          <Line
            type="linear"
            dataKey="serviceLevel"
            name="Service level of the rostered people"
            stroke={DEMAND_COLOURS.rostered}
            strokeWidth={2}
            dot={false}
            connectNulls={false}
            isAnimationActive={false}
          />
        </LineChart>
      }
      table={
        <DataTable
          label={`${title}: figures`}
          columns={['Interval', 'Rostered', 'Service level']}
          size="small"
        >
          {measured.map((p) => (
            <TableRow key={p.start}>
              <TableCell>{p.label}</TableCell>
              <TableCell>{p.rostered}</TableCell>
              <TableCell>{`${fmt(p.serviceLevel)}%${(p.serviceLevel ?? 0) < targetPercent ? ' (below target)' : ''}`}</TableCell>
            </TableRow>
          ))}
        </DataTable>
      }
    />
  );
}
