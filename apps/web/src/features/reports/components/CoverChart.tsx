import {
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
} from '@fluentui/react-components';
import type { CoverDayReportDto, CoverReportRowDto } from '@rotaplex/contracts';
import { Bar, BarChart, CartesianGrid, Legend, Tooltip, XAxis, YAxis } from 'recharts';
import { coverDayRows, formatDate } from '../utils/reportFigures';
import { ChartSection } from './ChartSection';
import { CHART_COLOURS, legendText } from './chartTheme';

export interface CoverChartProps {
  days: CoverDayReportDto[];
  cover: CoverReportRowDto[];
}

/** Cover needs of each day met at the target, at the minimum only, or short (stacked bars). */
export function CoverChart({ days, cover }: CoverChartProps) {
  const rows = coverDayRows(days);
  const needs = rows.reduce((s, r) => s + r.needs, 0);
  const short = rows.reduce((s, r) => s + r.belowMin, 0);
  const daysShort = rows.filter((r) => r.belowMin > 0).length;
  return (
    <ChartSection
      title="Cover met per day"
      summary={`${needs - short} of ${needs} cover needs have at least their minimum; ${daysShort} of ${rows.length} days have a need below its minimum.`}
      chart={
        <BarChart
          data={rows}
          responsive
          accessibilityLayer={false}
          style={{ width: '100%', height: '20rem' }}
          margin={{ left: 0, right: 16 }}
        >
          <CartesianGrid stroke={CHART_COLOURS.grid} vertical={false} />
          <XAxis dataKey="label" stroke={CHART_COLOURS.text} />
          <YAxis allowDecimals={false} stroke={CHART_COLOURS.text} />
          <Tooltip />
          <Legend formatter={legendText} />
          <Bar
            dataKey="metTarget"
            name="Target met"
            stackId="needs"
            fill={CHART_COLOURS.metTarget}
            isAnimationActive={false}
          />
          <Bar
            dataKey="metMinOnly"
            name="Minimum met"
            stackId="needs"
            fill={CHART_COLOURS.metMin}
            isAnimationActive={false}
          />
          <Bar
            dataKey="belowMin"
            name="Below minimum"
            stackId="needs"
            fill={CHART_COLOURS.belowMin}
            isAnimationActive={false}
          />
        </BarChart>
      }
      table={
        <Table size="small" aria-label="Cover against needs">
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Date</TableHeaderCell>
              <TableHeaderCell>Shift</TableHeaderCell>
              <TableHeaderCell>Skill</TableHeaderCell>
              <TableHeaderCell>Minimum</TableHeaderCell>
              <TableHeaderCell>Target</TableHeaderCell>
              <TableHeaderCell>On shift</TableHeaderCell>
              <TableHeaderCell>Short of minimum</TableHeaderCell>
              <TableHeaderCell>Short of target</TableHeaderCell>
              <TableHeaderCell>Over target</TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
            {cover.map((c) => (
              <TableRow key={`${c.date}|${c.shiftTypeId}|${c.skillId ?? ''}`}>
                <TableCell>{formatDate(c.date)}</TableCell>
                <TableCell>{c.shiftCode}</TableCell>
                <TableCell>{c.skillCode ?? 'Anyone'}</TableCell>
                <TableCell>{c.min}</TableCell>
                <TableCell>{c.target}</TableCell>
                <TableCell>{c.assigned}</TableCell>
                <TableCell>{c.shortOfMin}</TableCell>
                <TableCell>{c.shortOfTarget}</TableCell>
                <TableCell>{c.over}</TableCell>
              </TableRow>
            ))}
          </TableBody>
        </Table>
      }
    />
  );
}
